import { criterionSense } from "../criteria/criterion-sense.js";
import type { CriterionId } from "../criteria/criterion-id.js";

/**
 * The m × k objective matrix a search minimises, row-major: objective j of candidate i is its
 * aggregate score on `objectives[j]` (a column of `criteria`), negated when that criterion is
 * better larger (criterionSense, as orientForMinimisation), so that smaller is better on every
 * column. A candidate whose `scores(i)` is null (not stable on every variant) gets NaN throughout,
 * which the searches treat as infeasible.
 *
 * scores(i): candidate i's aggregate scores in `criteria` order, or null. objectives: ids among
 * `criteria` (a RangeError names one that is not).
 */
export function searchObjectiveMatrix(
  scores: (i: number) => readonly number[] | null,
  m: number,
  criteria: readonly CriterionId[],
  objectives: readonly CriterionId[],
): Float64Array {
  const k = objectives.length;
  const columns = objectives.map((id) => {
    const column = criteria.indexOf(id);
    if (column < 0) throw new RangeError(`objectives: "${id}" is not one of the criteria ${criteria.join(", ")}`);
    return column;
  });
  const signs = objectives.map((id) => (criterionSense(id) === "larger" ? -1 : 1));
  const out = new Float64Array(m * k);
  for (let i = 0; i < m; i++) {
    const row = scores(i);
    for (let j = 0; j < k; j++) out[i * k + j] = row ? (signs[j] as number) * (row[columns[j] as number] ?? Number.NaN) : Number.NaN;
  }
  return out;
}
