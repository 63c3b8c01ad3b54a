import { CRITERIA, criterionSense, type CriterionId } from "@loopyard/core";

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

/** Axis title of a criterion: its label with unit, and "larger is better" for margins, crossover and bandwidth. */
export function criterionAxisTitle(id: CriterionId): string {
  return CRITERIA[id] && criterionSense(id) === "larger" ? `${criterionLabel(id)} — larger is better` : criterionLabel(id);
}

/** Which way is better on a front's two axes, e.g. "smaller is better on both axes" or "x: smaller is better; y: larger is better". */
export function frontSenseNote(x: CriterionId, y: CriterionId): string {
  const sense = (id: CriterionId) => (CRITERIA[id] ? criterionSense(id) : "smaller");
  const [sx, sy] = [sense(x), sense(y)];
  if (sx === sy) return `${sx} is better on both axes`;
  return `${criterionShortLabel(x)}: ${sx} is better; ${criterionShortLabel(y)}: ${sy} is better`;
}
