import { z } from "zod";
import { MAX_FAMILY_VARIANTS, MAX_SWEEP_PARAMETERS, MAX_TITLE_LENGTH } from "../limits.js";
import { textField } from "../schemas/text.js";
import { parameterRangeSchema } from "../sweeps/sweep-input.js";
import { familyVariantCount } from "./expand-family.js";

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);
const wholeCount = z
  .number({ error: "design.count must be a number" })
  .int("design.count must be a whole number")
  .min(1, "design.count must be at least 1")
  .max(MAX_FAMILY_VARIANTS, `design.count must be at most ${MAX_FAMILY_VARIANTS} (a family holds at most ${MAX_FAMILY_VARIANTS} variants)`);
const seed = z.number({ error: "seed must be a number" }).int("seed must be a whole number");

/**
 * How a spread chooses its parameter sets — the sampling designs of a sweep (sweepDesignSchema),
 * reused over the spread's ranges: a grid (the product of the ranges' counts), or `count` seeded
 * draws (random, latin-hypercube; same seed, same variants).
 */
export const familySpreadDesignSchema = z.union(
  [
    z.object({ kind: z.literal("grid") }),
    z.object({ kind: z.literal("random"), count: wholeCount, seed }),
    z.object({ kind: z.literal("latin-hypercube"), count: wholeCount, seed }),
  ],
  { error: 'design must be {kind:"grid"} or random/latin-hypercube {count, seed}' },
);

export type FamilySpreadDesign = z.infer<typeof familySpreadDesignSchema>;

/**
 * Manufacturing spread of one nonlinear plant revision: ranges of its parameters (the sweep's
 * parameter ranges: min, max, count for a grid, scale) and the design that draws parameter sets
 * from them. Each parameter set is one variant.
 */
export const familySpreadSchema = z.object({
  ranges: z
    .record(z.string().min(1, "a parameter needs a name").max(40, "a parameter name has at most 40 characters"), parameterRangeSchema)
    .refine((r) => Object.keys(r).length >= 1, { message: "spread at least one parameter" })
    .refine((r) => Object.keys(r).length <= MAX_SWEEP_PARAMETERS, { message: `spread at most ${MAX_SWEEP_PARAMETERS} parameters` }),
  design: familySpreadDesignSchema.default(() => ({ kind: "grid" as const })),
});

export type FamilySpread = z.infer<typeof familySpreadSchema>;

/**
 * One entry of a family: a plant revision with an optional label and, for a nonlinear plant, fixed
 * parameter values — one variant — or, with `spread`, as many variants as the spread's design
 * draws (the fixed values held, the spread's parameters varied).
 */
export const familyEntrySchema = z.object({
  plantRevisionId: z.string().uuid("choose a plant revision"),
  label: textField({ label: "label", max: MAX_TITLE_LENGTH }).optional(),
  parameters: z.record(z.string().max(40, "a parameter name has at most 40 characters"), finite("every variant parameter")).optional(),
  spread: familySpreadSchema.optional(),
});

export type FamilyEntry = z.infer<typeof familyEntrySchema>;

/**
 * The variants of a family revision, as stored: entries in order, expanded by expandFamily into
 * exactly the variant list a sweep's family holds (sweepFamilySchema). Checks: a parameter is
 * either fixed or spread, and the family expands to 1 … MAX_FAMILY_VARIANTS variants.
 */
export const familyDefinitionSchema = z
  .object({
    entries: z.array(familyEntrySchema).min(1, "give at least one variant").max(MAX_FAMILY_VARIANTS, `a family holds at most ${MAX_FAMILY_VARIANTS} variants`),
  })
  .superRefine((definition, ctx) => {
    definition.entries.forEach((entry, i) => {
      for (const name of Object.keys(entry.spread?.ranges ?? {})) {
        if (entry.parameters && name in entry.parameters) {
          ctx.addIssue({ code: "custom", path: ["entries", i, "spread", "ranges", name], message: `${name} is both fixed and spread; give it in one place` });
        }
      }
    });
    const count = familyVariantCount(definition);
    if (count > MAX_FAMILY_VARIANTS) {
      ctx.addIssue({
        code: "custom",
        path: ["entries"],
        message: `the family expands to ${count} variants, more than the ${MAX_FAMILY_VARIANTS} a family holds; lower the spread's counts`,
      });
    }
  });

export type FamilyDefinition = z.infer<typeof familyDefinitionSchema>;

/**
 * What a member submits to create a family or revise it: its name, an optional description, the
 * change note (required when revising, checked by the server) and its variants.
 */
export const familyInputSchema = z.object({
  name: textField({ label: "name", min: 1, required: "give the family a name", max: MAX_TITLE_LENGTH }),
  description: textField({ label: "description", max: 500 }).default(""),
  note: textField({ label: "change note", max: 500 }).optional(),
  definition: familyDefinitionSchema,
});

export type FamilyInput = z.input<typeof familyInputSchema>;
export type FamilyInputParsed = z.output<typeof familyInputSchema>;
