import { z } from "zod";
import { plantModelSchema } from "../plants/plant.js";
import { criteriaSpecSchema } from "./criteria-spec.js";
import { scenarioSpecSchema } from "./scenario-spec.js";

const positive = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`).gt(0, `${what} must be > 0`);

/**
 * The spec of `loopyard baselines`: one plant, one scenario, the criteria (the same schemas as
 * `loopyard evaluate`), and optional design choices of the rules (see BaselineOptions):
 * filterDivisor N (tf = Td/N), tauC (SIMC τc [s]) and lambda (lambda/IMC λ [s]).
 */
export const baselinesSpecSchema = z.strictObject({
  plant: plantModelSchema,
  scenario: scenarioSpecSchema,
  criteria: criteriaSpecSchema,
  options: z
    .strictObject({
      filterDivisor: positive("filterDivisor").optional(),
      tauC: z.number({ error: "tauC must be a number" }).finite("tauC must be finite").min(0, "tauC must be ≥ 0 s").optional(),
      lambda: positive("lambda").optional(),
    })
    .optional(),
});

export type BaselinesSpec = z.output<typeof baselinesSpecSchema>;
