import { z } from "zod";
import { textField } from "../schemas/text.js";
import { MAX_FAMILY_VARIANTS, MAX_TITLE_LENGTH } from "../limits.js";
import { plantModelSchema } from "../plants/plant.js";
import type { Plant } from "../plants/plant.js";
import { checkSweepDefinition, sweepDefinitionFields, withDefaultFilter } from "../sweeps/sweep-input.js";

/**
 * The spec of `loopyard sweep` (see packages/core/README.md, "CLI"): the sweep definition of the
 * web form and the server (sweepInputSchema: structure, ranges, fixed, filter, sampleTime,
 * antiWindup, scenario, criteria, criterionOptions, design, aggregate, with the same checks,
 * checkSweepDefinition) except that the family's variants carry their plant inline
 * (`{ label?, plant, parameters? }`) instead of a plant revision, and the name is optional.
 * Variants without a label are named v1, v2, ….
 */
export const sweepSpecSchema = z
  .strictObject({
    name: textField({ label: "name", min: 1, required: "give the sweep a name", max: MAX_TITLE_LENGTH }).optional(),
    ...sweepDefinitionFields,
    family: z.strictObject({
      name: textField({ label: "family name", max: MAX_TITLE_LENGTH }).optional(),
      variants: z
        .array(
          z.strictObject({
            label: textField({ label: "label", max: MAX_TITLE_LENGTH }).optional(),
            plant: plantModelSchema,
            parameters: z.record(z.string(), z.number({ error: "every variant parameter must be a number" }).finite("every variant parameter must be finite")).optional(),
          }),
        )
        .min(1, "give at least one variant")
        .max(MAX_FAMILY_VARIANTS, `a family holds at most ${MAX_FAMILY_VARIANTS} variants`),
    }),
  })
  .overwrite(withDefaultFilter)
  .superRefine((spec, ctx) => {
    checkSweepDefinition(spec, ctx);
    const labels = variantNames(spec);
    if (new Set(labels).size !== labels.length) ctx.addIssue({ code: "custom", path: ["family", "variants"], message: "give each variant a different label" });
  });

export type SweepSpec = z.output<typeof sweepSpecSchema>;

/** Variant names of a validated sweep spec: the given labels, else v1, v2, …. */
export function variantNames(spec: Pick<SweepSpec, "family">): string[] {
  return spec.family.variants.map((v, i) => v.label || `v${i + 1}`);
}

/** The plant models of a validated spec's variants, in family order (before their overrides). */
export function variantModels(spec: SweepSpec): Plant[] {
  return spec.family.variants.map((v) => v.plant as Plant);
}
