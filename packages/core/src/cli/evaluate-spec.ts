import { z } from "zod";
import { controllerSchema } from "../controllers/controller.js";
import { sensitivityWeightSchema } from "../frequency/sensitivity-weight-schema.js";
import { plantModelSchema } from "../plants/plant.js";
import { criterionOptionsSchema } from "../sweeps/sweep-input.js";
import { criteriaSpecSchema } from "./criteria-spec.js";
import { scenarioSpecSchema } from "./scenario-spec.js";

/**
 * The spec of `loopyard evaluate`: one plant, one controller, one scenario, the criteria.
 * Keys exactly: plant, controller, scenario, criteria, and optionally criterionOptions
 * { q, r, settlingBand, horizon } and weight (the sensitivity weight of wsNorm: { num, den } or
 * { preset: "performance", M, omegaB, A }) (see packages/core/README.md, "CLI").
 */
export const evaluateSpecSchema = z.strictObject({
  plant: plantModelSchema,
  controller: controllerSchema,
  scenario: scenarioSpecSchema,
  criteria: criteriaSpecSchema,
  criterionOptions: criterionOptionsSchema.strict().optional(),
  weight: sensitivityWeightSchema.optional(),
});

export type EvaluateSpec = z.output<typeof evaluateSpecSchema>;
