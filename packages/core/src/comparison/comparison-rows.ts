import { aggregateScores } from "../aggregates/aggregate-scores.js";
import type { BatchResult } from "../batch/evaluate-batch.js";
import { STATUS_STABLE } from "../batch/batch-status.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { ComparisonColumn, ComparisonConstraint, ComparisonPlan } from "./comparison-plan.js";

/**
 * Candidates of a comparison scored per variant on a set of its columns:
 * status[i·F + f]: BATCH_STATUSES code of candidate i on variant f;
 * scores[(i·F + f)·K + k]: column k's value there (NaN when unscored or not applicable);
 * feasible[i·F + f]: 1 when the candidate is stable on variant f and meets every constraint there.
 */
export interface ComparisonRows {
  n: number;
  variants: number;
  /** The keys of the K columns held, in order. */
  columns: readonly string[];
  status: Uint8Array;
  scores: Float64Array;
  feasible: Uint8Array;
}

/**
 * Turns a batch result over `criteria` (n candidates × F variants, see evaluateBatch) into the
 * values of `columns` and the feasibility of every row. A quadratic column is q·ISE + r·Effort
 * (the term with a zero weight left out, so a NaN effort does not spoil r = 0); a constraint
 * holds on a variant when its criterion's value v is not NaN and v ≤ limit (max) or v ≥ limit
 * (min). Throws a RangeError when `criteria` lacks a criterion a column or constraint needs.
 */
export function comparisonRows(
  plan: ComparisonPlan,
  criteria: readonly CriterionId[],
  batch: BatchResult,
  n: number,
  columns: readonly ComparisonColumn[] = plan.columns,
): ComparisonRows {
  const nf = plan.variants.length;
  const nc = criteria.length;
  if (batch.status.length !== n * nf || batch.scores.length !== n * nf * nc) {
    throw new RangeError(`batch: expected ${n} candidates × ${nf} variants × ${nc} criteria`);
  }
  const at = (id: CriterionId): number => {
    const index = criteria.indexOf(id);
    if (index < 0) throw new RangeError(`criteria: ${id} is needed but was not evaluated`);
    return index;
  };
  const readers = columns.map((c) => columnReader(c, at));
  const limits = plan.constraints.map((c) => ({ index: at(c.criterion), constraint: c }));
  const nk = columns.length;
  const scores = new Float64Array(n * nf * nk);
  const feasible = new Uint8Array(n * nf);
  for (let row = 0; row < n * nf; row++) {
    const base = row * nc;
    for (let k = 0; k < nk; k++) scores[row * nk + k] = readers[k](batch.scores, base);
    let holds = batch.status[row] === STATUS_STABLE;
    for (let j = 0; j < limits.length && holds; j++) holds = meetsConstraint(batch.scores[base + limits[j].index], limits[j].constraint);
    feasible[row] = holds ? 1 : 0;
  }
  return { n, variants: nf, columns: columns.map((c) => c.key), status: batch.status.slice(), scores, feasible };
}

/** Whether a value meets a constraint: not NaN and ≤ limit (max) or ≥ limit (min). */
export function meetsConstraint(value: number, constraint: ComparisonConstraint): boolean {
  if (Number.isNaN(value)) return false;
  return constraint.bound === "max" ? value <= constraint.limit : value >= constraint.limit;
}

/**
 * One figure per candidate and column over the family (aggregateScores with the plan's aggregate,
 * each column in its criterion's sense), n × K row-major; NaN for a candidate that is not stable on
 * every variant. With `feasibleOnly`, also NaN for a candidate that breaks a constraint on some variant.
 */
export function aggregateRows(plan: ComparisonPlan, rows: ComparisonRows, feasibleOnly: boolean): Float64Array {
  const columns = rows.columns.map((key) => columnOf(plan, key));
  const out = aggregateScores(rows.scores, rows.status, rows.n, rows.variants, columns.map((c) => c.criterion), plan.aggregate);
  if (feasibleOnly) {
    const nk = columns.length;
    for (let i = 0; i < rows.n; i++) if (!isFeasible(rows, i)) out.fill(NaN, i * nk, (i + 1) * nk);
  }
  return out;
}

/** Whether candidate i is stable and meets every constraint on every variant. */
export function isFeasible(rows: ComparisonRows, i: number): boolean {
  for (let f = 0; f < rows.variants; f++) if (rows.feasible[i * rows.variants + f] !== 1) return false;
  return true;
}

/** The column of a plan with this key; throws a RangeError for an unknown key. */
export function columnOf(plan: ComparisonPlan, key: string): ComparisonColumn {
  const column = plan.columns.find((c) => c.key === key);
  if (!column) throw new RangeError(`column: no column "${key}" in this comparison`);
  return column;
}

/** A value oriented so that smaller is better: −v for a larger-is-better column. NaN stays NaN. */
export function oriented(column: ComparisonColumn, value: number): number {
  return column.better === "larger" ? -value : value;
}

function columnReader(column: ComparisonColumn, at: (id: CriterionId) => number): (scores: Float64Array, base: number) => number {
  const w = column.weights;
  if (!w) {
    const index = at(column.criterion);
    return (scores, base) => scores[base + index];
  }
  const { q, r } = w;
  if (r === 0) {
    const ise = at("ise");
    return (scores, base) => q * scores[base + ise];
  }
  if (q === 0) {
    const effort = at("effort");
    return (scores, base) => r * scores[base + effort];
  }
  const ise = at("ise");
  const effort = at("effort");
  return (scores, base) => q * scores[base + ise] + r * scores[base + effort];
}
