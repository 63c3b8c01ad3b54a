import { CRITERIA, type CriterionId } from "@loopyard/core";

/** Axis or column label of a criterion with its unit, e.g. "IAE [y·s]". */
export function criterionLabel(id: CriterionId): string {
  const definition = CRITERIA[id];
  if (!definition) return id;
  return definition.unit ? `${definition.label} [${definition.unit}]` : definition.label;
}

export function criterionShortLabel(id: CriterionId): string {
  return CRITERIA[id]?.label ?? id;
}

export function criterionDescription(id: CriterionId): string {
  return CRITERIA[id]?.description ?? "";
}
