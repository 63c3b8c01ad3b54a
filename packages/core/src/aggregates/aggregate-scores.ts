import { criterionSense } from "../criteria/criterion-sense.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { STATUS_STABLE } from "../batch/batch-status.js";

/**
 * How a criterion is combined over the variants of a family:
 * - `worst`: the worst value — the largest for a smaller-is-better criterion, the smallest for a
 *   larger-is-better one (CRITERIA[id].better);
 * - `mean`: the arithmetic mean;
 * - `percentile`: the p-th percentile counted from the best value towards the worst, p ∈ [0, 100]:
 *   p = 100 is the worst case, p = 0 the best, p = 50 the median (see percentileType7).
 */
export type Aggregate = { kind: "worst" } | { kind: "mean" } | { kind: "percentile"; p: number };

/** The aggregate kinds, in the order forms list them. */
export const AGGREGATE_KINDS = ["worst", "mean", "percentile"] as const;

/**
 * One figure per candidate and criterion over the F variants of a family, from the typed arrays
 * evaluateBatch writes: scores[(i·F + f)·C + c] and status[i·F + f] (BATCH_STATUSES codes).
 *
 *   worst (smaller is better):  a_ic = max_f s_ifc      worst (larger is better):  a_ic = min_f s_ifc
 *   mean:                       a_ic = (1/F)·Σ_f s_ifc
 *   percentile p:               a_ic = Q_7(s_i·c; p) on the values ordered from best to worst
 *
 * A design must hold on every variant: a candidate that is not stable on some variant (unstable,
 * diverged or invalid there) gets NaN for every criterion, so fronts and searches drop it. A
 * criterion that does not apply on some variant (NaN there) is NaN in the aggregate. Infinite
 * values (a settling time never reached) take part as they are.
 *
 * scores: n·F·C values; status: n·F codes; n ≥ 0, variants F ≥ 1; criteria: the C ids in the
 * order of the scores. Returns a new Float64Array n × C. Throws a RangeError naming the bad
 * argument (`n`, `variants`, `criteria`, `scores`, `status`, `aggregate.kind`, `aggregate.p`).
 *
 * References: R. J. Hyndman and Y. Fan, "Sample quantiles in statistical packages", The American
 * Statistician 50(4), 361–365, 1996 (type 7); worst case and mean over a plant family: common
 * practice in robust design.
 */
export function aggregateScores(
  scores: Float64Array,
  status: Uint8Array,
  n: number,
  variants: number,
  criteria: readonly CriterionId[],
  aggregate: Aggregate,
): Float64Array {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number ≥ 0, got ${String(n)}`);
  if (!Number.isInteger(variants) || variants < 1) throw new RangeError(`variants must be a whole number ≥ 1, got ${String(variants)}`);
  if (!Array.isArray(criteria) || criteria.length === 0) throw new RangeError("criteria: give at least one criterion id");
  const nc = criteria.length;
  if (scores.length !== n * variants * nc) throw new RangeError(`scores: length ${scores.length} is not n·variants·criteria = ${n * variants * nc}`);
  if (status.length !== n * variants) throw new RangeError(`status: length ${status.length} is not n·variants = ${n * variants}`);
  const larger = criteria.map((id) => criterionSense(id) === "larger");
  const kind = aggregate?.kind;
  if (kind !== "worst" && kind !== "mean" && kind !== "percentile") {
    throw new RangeError(`aggregate.kind must be one of ${AGGREGATE_KINDS.join(", ")}, got ${String(kind)}`);
  }
  let p = 0;
  if (aggregate.kind === "percentile") {
    p = aggregate.p;
    if (typeof p !== "number" || !(p >= 0 && p <= 100)) throw new RangeError(`aggregate.p must be a number from 0 to 100, got ${String(p)}`);
  }
  const out = new Float64Array(n * nc);
  const column = new Float64Array(variants);
  for (let i = 0; i < n; i++) {
    let held = true;
    for (let f = 0; f < variants && held; f++) held = status[i * variants + f] === STATUS_STABLE;
    if (!held) {
      out.fill(NaN, i * nc, (i + 1) * nc);
      continue;
    }
    for (let c = 0; c < nc; c++) {
      let anyNaN = false;
      for (let f = 0; f < variants; f++) {
        const v = scores[(i * variants + f) * nc + c];
        if (Number.isNaN(v)) anyNaN = true;
        column[f] = v;
      }
      let value: number;
      if (anyNaN) value = NaN;
      else if (kind === "worst") value = larger[c] ? minOf(column) : maxOf(column);
      else if (kind === "mean") value = meanOf(column);
      else {
        column.sort();
        value = percentileType7(column, larger[c] ? 100 - p : p);
      }
      out[i * nc + c] = value;
    }
  }
  return out;
}

/**
 * The p-th percentile (p ∈ [0, 100]) of values sorted ascending, by linear interpolation between
 * order statistics — Hyndman & Fan (1996) type 7, the default of R and NumPy:
 *
 *   h = (N − 1)·p/100,   Q = x_⌊h⌋ + (h − ⌊h⌋)·(x_⌊h⌋+1 − x_⌊h⌋)   (0-based order statistics).
 *
 * Equal neighbours (including two infinities of one sign) return that value; NaN for N = 0.
 */
export function percentileType7(sorted: ArrayLike<number>, p: number): number {
  const count = sorted.length;
  if (count === 0) return NaN;
  const h = ((count - 1) * p) / 100;
  const lo = Math.floor(h);
  const weight = h - lo;
  const a = sorted[lo];
  if (weight === 0 || lo + 1 >= count) return a;
  const b = sorted[lo + 1];
  return a === b ? a : a + weight * (b - a);
}

function maxOf(v: Float64Array): number {
  let m = -Infinity;
  for (let i = 0; i < v.length; i++) if (v[i] > m) m = v[i];
  return m;
}

function minOf(v: Float64Array): number {
  let m = Infinity;
  for (let i = 0; i < v.length; i++) if (v[i] < m) m = v[i];
  return m;
}

function meanOf(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i];
  return s / v.length;
}
