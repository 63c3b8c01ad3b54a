import { controllerParameter, SAMPLE_TIME_PARAMETER } from "../controllers/controller-parameters.js";
import type { ControllerKind } from "../controllers/controller.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { CRITERIA } from "../criteria/registry.js";

/**
 * A column name with its unit in brackets, e.g. "ki [1/s]", "IAE [y·s]"; "[–]" for a dimensionless
 * figure, so every number in an export says what it is measured in.
 */
export function withUnit(name: string, unit: string): string {
  return `${name} [${unit === "" ? "–" : unit}]`;
}

/** The header of a parameter of a controller kind: its name and unit from the parameter table (k[i], n: dimensionless). */
export function parameterColumn(kind: ControllerKind, name: string): string {
  if (name === SAMPLE_TIME_PARAMETER.name) return withUnit(name, SAMPLE_TIME_PARAMETER.unit);
  return withUnit(name, controllerParameter(kind, name)?.unit ?? "");
}

/** The header of a criterion: its registry label and unit. */
export function criterionColumn(id: CriterionId): string {
  return withUnit(CRITERIA[id].label, CRITERIA[id].unit);
}

/**
 * The header of a sweep's candidates.csv: index, status, every parameter with its unit, every
 * criterion's aggregate over the family ("IAE [y·s] (worst case)"), then with more than one variant
 * every criterion on every variant ("IAE [y·s] @ Ember 400"), then the error of a candidate that
 * could not be evaluated.
 */
export function candidateCsvHeader(kind: ControllerKind, parameters: readonly string[], criteria: readonly CriterionId[], aggregateWords: string, variants: readonly string[]): string[] {
  const header = ["index", "status", ...parameters.map((name) => parameterColumn(kind, name)), ...criteria.map((id) => `${criterionColumn(id)} (${aggregateWords})`)];
  if (variants.length > 1) for (const label of variants) for (const id of criteria) header.push(`${criterionColumn(id)} @ ${label}`);
  header.push("error");
  return header;
}

/** A number in a CSV cell: the shortest text that reads back as the same double; "inf", "-inf"; empty for NaN (does not apply). */
export function csvNumber(value: number | null | undefined): string {
  if (value === null || value === undefined || Number.isNaN(value)) return "";
  if (value === Number.POSITIVE_INFINITY) return "inf";
  if (value === Number.NEGATIVE_INFINITY) return "-inf";
  return String(value);
}
