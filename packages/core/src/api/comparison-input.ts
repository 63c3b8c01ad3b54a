import { z } from "zod";
import { MAX_TITLE_LENGTH } from "../limits.js";
import { textField } from "../schemas/text.js";
import { comparisonDefinitionSchema, type ComparisonDefinition } from "../comparison/comparison-definition.js";
import { sweepFamilySchema, type SweepFamily } from "../sweeps/sweep-input.js";

/** Fields of a comparison that the library resolves (the rest is core's ComparisonDefinition). */
const headSchema = z.object({
  name: textField({ label: "name", min: 1, required: "give the comparison a name", max: MAX_TITLE_LENGTH }),
  family: sweepFamilySchema,
  /** A saved family revision the server expanded into `family` (see sweepInputSchema.familyRevisionId). */
  familyRevisionId: z.string().uuid("choose a family revision").optional(),
}).superRefine((head, ctx) => {
  if (head.family.source !== undefined && head.familyRevisionId !== head.family.source.familyRevisionId) {
    ctx.addIssue({ code: "custom", path: ["familyRevisionId"], message: "familyRevisionId must be the family revision the variants came from (family.source)" });
  }
});

/**
 * What a member submits to start a comparison over the API: a name, the family as plant revisions
 * of the workspace (each with an optional label and, for a nonlinear plant, parameter overrides —
 * as in a sweep's family), and everything else exactly as core's comparison definition
 * (structure with its box, scenario, criterionOptions, aggregate, contenders, judges,
 * constraints, budget, seed). Issues keep their field paths flat ("contenders.2.r", "family.variants.0.plantRevisionId").
 */
export const comparisonInputSchema = z.unknown().transform((value, ctx): ComparisonInput => {
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    ctx.addIssue({ code: "custom", message: "send the comparison as a JSON object", path: [] });
    return z.NEVER;
  }
  const { name, family, familyRevisionId, ...rest } = value as Record<string, unknown>;
  const head = headSchema.safeParse({ name, family, familyRevisionId });
  const definition = comparisonDefinitionSchema.safeParse(rest);
  for (const issue of [...(head.success ? [] : head.error.issues), ...(definition.success ? [] : definition.error.issues)]) {
    ctx.addIssue({ code: "custom", message: issue.message, path: issue.path as (string | number)[] });
  }
  if (!head.success || !definition.success) return z.NEVER;
  const input: ComparisonInput = { name: head.data.name, family: head.data.family, ...definition.data };
  if (head.data.familyRevisionId !== undefined) input.familyRevisionId = head.data.familyRevisionId;
  return input;
});

/** A parsed comparison input: name, family by revisions, and core's definition. */
export type ComparisonInput = { name: string; family: SweepFamily; familyRevisionId?: string } & ComparisonDefinition;
