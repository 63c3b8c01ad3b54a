import type { Controller } from "../controllers/controller.js";
import type { Plant } from "../plants/plant.js";
import type { DecisionRecord } from "../schemas/decision.js";
import type { Scenario } from "../simulation/scenario.js";
import { variantPlant } from "../sweeps/plan-sweep.js";
import type { DeploymentDesign } from "./deployment-design.js";

/**
 * The design a decision record holds, as buildDeploymentSheet and designCurves take it: every
 * variant's plant (its revision's model with the variant's parameter overrides), the controller as
 * studied, the scenario, the criteria and the aggregate.
 */
export function recordDesign(record: DecisionRecord): DeploymentDesign {
  return {
    variants: record.family.variants.map((v, i) => ({
      label: v.label,
      plant: variantPlant(v.model as Plant, v.parameters, i),
      revision: { plantId: v.plantId, plantName: v.plantName, revisionId: v.revisionId, revisionNumber: v.revisionNumber },
    })),
    controller: record.structure.controller as Controller,
    scenario: record.scenario as Scenario,
    criteria: [...record.criteria],
    ...(record.evaluation.criterionOptions ? { criterionOptions: record.evaluation.criterionOptions } : {}),
    aggregate: record.evaluation.aggregate,
  };
}
