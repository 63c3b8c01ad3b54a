import { variantPlant } from "@loopyard/core";
import type { DecisionRecord, DeploymentDesign, DeploymentSheetDto, Scenario } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import { sheetOfDesign, type SheetQuery } from "../deployment/sheet-service.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { getDecisionRecord, type DecisionDeps } from "./decision-service.js";

/**
 * The design a decision's record describes, as the deployment sheet takes it: the family's plants
 * (each variant's parameter overrides applied, as the study evaluated them), the recorded
 * controller, the scenario, the criteria, the criterion options and the aggregate.
 */
export function decisionDesign(record: DecisionRecord): DeploymentDesign {
  return {
    variants: record.family.variants.map((v, i) => ({
      label: v.label,
      plant: variantPlant(v.model, v.parameters, i),
      revision: { plantId: v.plantId, plantName: v.plantName, revisionId: v.revisionId, revisionNumber: v.revisionNumber },
    })),
    controller: record.structure.controller,
    scenario: record.scenario as Scenario,
    criteria: [...record.criteria],
    ...(record.evaluation.criterionOptions ? { criterionOptions: record.evaluation.criterionOptions } : {}),
    aggregate: record.evaluation.aggregate,
  };
}

/** GET …/decisions/:id/sheet?sampleTime=&method=&format= — the decision's deployment sheet, on the compute pool. */
export async function getDecisionSheet(deps: DecisionDeps & { compute: Compute }, access: MemberAccess, decisionId: string, query: SheetQuery): Promise<DeploymentSheetDto> {
  const record = await getDecisionRecord(deps, access, decisionId);
  return sheetOfDesign(deps.compute, decisionDesign(record), query);
}
