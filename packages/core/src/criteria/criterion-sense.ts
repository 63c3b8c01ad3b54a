import type { CriterionId } from "./criterion-id.js";
import { CRITERIA } from "./registry.js";

/**
 * Which way a criterion is better: "larger" for gain margin, phase margin, crossover frequency and
 * bandwidth (CriterionDefinition.better), "smaller" for every other criterion (the default).
 * Throws a RangeError for an unknown id.
 */
export function criterionSense(id: CriterionId): "smaller" | "larger" {
  const definition = CRITERIA[id];
  if (definition === undefined) throw new RangeError(`id: unknown criterion "${String(id)}"`);
  return definition.better ?? "smaller";
}

/**
 * The values of criterion `id` turned so that smaller is better — negated (−v) for a "larger"
 * criterion, copied as they are otherwise — ready for a front that minimises every objective
 * (paretoFront). Non-finite values stay non-finite (+Infinity becomes −Infinity), so paretoFront
 * still ignores them. Returns a new Float64Array; `values` is not changed.
 */
export function orientForMinimisation(values: ArrayLike<number>, id: CriterionId): Float64Array {
  const sign = criterionSense(id) === "larger" ? -1 : 1;
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = sign * values[i];
  return out;
}
