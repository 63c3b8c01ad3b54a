import { z } from "zod";
import { CRITERION_IDS } from "../criteria/criterion-id.js";

/** The criteria list of a CLI spec: one or more known ids, each once. */
export const criteriaSpecSchema = z
  .array(z.enum(CRITERION_IDS, { error: `unknown criterion; use one of ${CRITERION_IDS.join(", ")}` }))
  .min(1, "choose at least one criterion")
  .refine((ids) => new Set(ids).size === ids.length, { message: "list each criterion once" });
