import { RANGE_PADDING } from "./reference-points.js";

/**
 * Tukey's multiplier for "far out" values: beyond Q3 + 3·IQR or below Q1 − 3·IQR (the outer fences).
 * References: J. W. Tukey, Exploratory Data Analysis, Addison-Wesley, 1977, ch. 2 (inner fences at 1.5·IQR,
 * outer at 3·IQR).
 */
export const FAR_OUT_IQR = 3;

/**
 * Extra points (baselines) widen a fitted axis only when they lie within this fraction of the fitted
 * span beyond its ends; farther ones are left beyond the axes (and said to be there), so that one
 * far rule does not squeeze the front either.
 */
export const EXTRA_REACH = 0.25;

/** When the quartiles coincide (a coarse grid), the spread is taken from these quantiles instead. */
const WIDE_QUANTILES = [0.05, 0.95] as const;

/** One fitted axis: its plotly range (log10 units on a log axis) and the fence beyond which cloud values are outliers. */
export interface AxisFit {
  /** The plotly range: [lo − p, hi + p] with p = RANGE_PADDING·(hi − lo), in log10 units on a log axis. */
  range: [number, number];
  /** The data span the range was fitted to, before padding (axis units). */
  span: [number, number];
  /** Whether some cloud values lie beyond `span` (then they are drawn at the edge, see edgeMarks). */
  clipped: boolean;
}

/**
 * Rearranges `a` so that a[k] is the value that would sit at position k if `a` were sorted, every
 * value before it ≤ a[k] and every value after it ≥ a[k] (Hoare's FIND: partition around a
 * median-of-three pivot, keep the side holding k). O(n) on average instead of a sort's O(n log n),
 * which matters for 10⁵ points on the page's thread. Returns a[k].
 * References: C. A. R. Hoare, "Algorithm 65: Find", Communications of the ACM 4(7), 1961; W. H. Press
 * et al., Numerical Recipes, 3rd ed., Cambridge University Press, 2007, §8.5 (select).
 */
export function selectKth(a: Float64Array, k: number): number {
  if (!(k >= 0 && k < a.length) || !Number.isInteger(k)) throw new RangeError(`selectKth: k must be a position in the array, got ${k}`);
  let lo = 0;
  let hi = a.length - 1;
  const swap = (i: number, j: number) => {
    const t = a[i] as number;
    a[i] = a[j] as number;
    a[j] = t;
  };
  for (;;) {
    if (hi <= lo + 1) {
      if (hi === lo + 1 && (a[hi] as number) < (a[lo] as number)) swap(lo, hi);
      return a[k] as number;
    }
    // Median of a[lo], a[mid], a[hi] as the pivot, placed at lo + 1; a[lo] ≤ pivot ≤ a[hi] act as sentinels.
    const mid = (lo + hi) >>> 1;
    swap(mid, lo + 1);
    if ((a[lo] as number) > (a[hi] as number)) swap(lo, hi);
    if ((a[lo + 1] as number) > (a[hi] as number)) swap(lo + 1, hi);
    if ((a[lo] as number) > (a[lo + 1] as number)) swap(lo, lo + 1);
    let i = lo + 1;
    let j = hi;
    const pivot = a[lo + 1] as number;
    for (;;) {
      do i++;
      while ((a[i] as number) < pivot);
      do j--;
      while ((a[j] as number) > pivot);
      if (j < i) break;
      swap(i, j);
    }
    a[lo + 1] = a[j] as number;
    a[j] = pivot;
    if (j >= k) hi = j - 1;
    if (j <= k) lo = i;
  }
}

/**
 * The q-quantile of values by linear interpolation between order statistics, x[(n−1)q] with x
 * sorted ascending (Hyndman & Fan 1996, definition 7; the default of R's quantile, d3.quantile and
 * mathjs quantileSeq), found with selectKth instead of a sort: the order statistic at floor((n−1)q),
 * then the least value after it. Reorders `a`.
 * References: R. J. Hyndman, Y. Fan, "Sample quantiles in statistical packages", The American
 * Statistician 50(4), 1996.
 */
export function selectQuantile(a: Float64Array, q: number): number {
  if (a.length === 0) throw new RangeError("selectQuantile: values must not be empty");
  if (!(q >= 0 && q <= 1)) throw new RangeError(`selectQuantile: q must lie in [0, 1], got ${q}`);
  const h = (a.length - 1) * q;
  const lo = Math.floor(h);
  const below = selectKth(a, lo);
  if (h === lo) return below;
  // After the selection everything right of lo is ≥ a[lo]: the next order statistic is their minimum.
  let next = Infinity;
  for (let i = lo + 1; i < a.length; i++) if ((a[i] as number) < next) next = a[i] as number;
  return below + (h - lo) * (next - below);
}

/**
 * The fences of a cloud on one axis, in axis units: [Q1 − k·s, Q3 + k·s] with k = FAR_OUT_IQR and
 * s = Q3 − Q1 (Tukey 1977); when the quartiles coincide, s is the 5–95 % spread instead; null when
 * that too is 0 (every value alike: nothing is far out). The quantiles are selectQuantile's;
 * `values` is reordered.
 */
export function farOutFences(values: Float64Array): [number, number] | null {
  if (values.length === 0) return null;
  const q1 = selectQuantile(values, 0.25);
  const q3 = selectQuantile(values, 0.75);
  let spread = q3 - q1;
  if (!(spread > 0)) spread = selectQuantile(values, WIDE_QUANTILES[1]) - selectQuantile(values, WIDE_QUANTILES[0]);
  if (!(spread > 0)) return null;
  return [q1 - FAR_OUT_IQR * spread, q3 + FAR_OUT_IQR * spread];
}

/** A value in axis units: log10 on a log axis (NaN for a value ≤ 0, which a log axis cannot show). */
export function toAxis(value: number, log: boolean): number {
  return log ? (value > 0 ? Math.log10(value) : Number.NaN) : value;
}

/** A value in axis units back in data units. */
export function fromAxis(value: number, log: boolean): number {
  return log ? 10 ** value : value;
}

/**
 * An axis range fitted to the front and most of the cloud: the span of the cloud's values inside
 * Tukey's outer fences (farOutFences), united with the whole front's span and with the `extra` values
 * (e.g. baselines) that lie within EXTRA_REACH of that span beyond its ends, then padded by
 * RANGE_PADDING of the span on each side.
 * One far-away candidate then no longer squeezes the front into a corner; it is drawn at the edge
 * (edgeMarks). Without far-out values the range is the cloud's extent padded, as before. Works in
 * log10 units on a log axis, where non-positive values are left out; null when nothing can be fitted
 * (no finite value; plotly's autorange then). With `everything`, no value is left out: the padded
 * extent of the cloud, the front and every extra value.
 */
export function fitAxis(cloud: ArrayLike<number>, front: ArrayLike<number>, log: boolean, extra: ArrayLike<number> = [], everything = false): AxisFit | null {
  const buffer = new Float64Array(cloud.length);
  let n = 0;
  for (let i = 0; i < cloud.length; i++) {
    const v = toAxis(cloud[i] as number, log);
    if (Number.isFinite(v)) buffer[n++] = v;
  }
  const values = buffer.subarray(0, n);
  const fences = everything ? null : farOutFences(values);
  const [fenceLo, fenceHi] = fences ?? [-Infinity, Infinity];
  let lo = Infinity;
  let hi = -Infinity;
  let cloudLo = Infinity;
  let cloudHi = -Infinity;
  const take = (v: number) => {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  };
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    if (v < cloudLo) cloudLo = v;
    if (v > cloudHi) cloudHi = v;
    if (v >= fenceLo && v <= fenceHi) take(v);
  }
  for (let i = 0; i < front.length; i++) {
    const v = toAxis(front[i] as number, log);
    if (Number.isFinite(v)) take(v);
  }
  if (!(hi >= lo)) return null;
  const reach = everything ? Infinity : (hi - lo) * EXTRA_REACH;
  const [reachLo, reachHi] = [lo - reach, hi + reach];
  for (let i = 0; i < extra.length; i++) {
    const v = toAxis(extra[i] as number, log);
    if (v >= reachLo && v <= reachHi) take(v);
  }
  const pad = (hi - lo) * RANGE_PADDING || (log ? 0.5 : Math.abs(lo) * 0.1 || 1);
  const clipped = n > 0 && (cloudLo < lo || cloudHi > hi);
  return { range: [lo - pad, hi + pad], span: [lo, hi], clipped };
}

/** Where an out-of-range point lies: −1 below (left), +1 above (right), 0 within; per axis. */
export type EdgeSide = -1 | 0 | 1;

/** plotly marker symbol pointing toward where an edge mark's point really lies. */
export function edgeSymbol(sx: EdgeSide, sy: EdgeSide): string {
  if (sy === 0) return sx > 0 ? "triangle-right" : "triangle-left";
  if (sx === 0) return sy > 0 ? "triangle-up" : "triangle-down";
  return `triangle-${sy > 0 ? "n" : "s"}${sx > 0 ? "e" : "w"}`;
}

/** The candidates beyond a fitted chart's spans, each moved into the padding band at the edge it lies beyond. */
export interface EdgeMarks {
  indices: number[];
  /** Positions drawn (data units): the true value on an axis it is within, the middle of the edge's padding band otherwise. */
  xs: number[];
  ys: number[];
  /** The candidates' true values (data units), for the hover text. */
  trueXs: number[];
  trueYs: number[];
  symbols: string[];
}

/**
 * The cloud's points outside the spans of the two fitted axes (a null fit: that axis is not fitted),
 * each clamped into the middle of the padding band on the side it lies beyond, with a triangle
 * pointing that way (edgeSymbol). Points that a log axis cannot show (≤ 0) are left out.
 */
export function edgeMarks(
  cloud: { indices: ArrayLike<number>; xs: ArrayLike<number>; ys: ArrayLike<number> },
  xFit: AxisFit | null,
  yFit: AxisFit | null,
  log: boolean,
): EdgeMarks {
  const out: EdgeMarks = { indices: [], xs: [], ys: [], trueXs: [], trueYs: [], symbols: [] };
  if (!xFit?.clipped && !yFit?.clipped) return out;
  const side = (v: number, fit: AxisFit | null): EdgeSide => (fit === null ? 0 : v < fit.span[0] ? -1 : v > fit.span[1] ? 1 : 0);
  const band = (s: EdgeSide, fit: AxisFit) => fromAxis(s < 0 ? (fit.range[0] + fit.span[0]) / 2 : (fit.range[1] + fit.span[1]) / 2, log);
  for (let i = 0; i < cloud.xs.length; i++) {
    const x = cloud.xs[i] as number;
    const y = cloud.ys[i] as number;
    const ax = toAxis(x, log);
    const ay = toAxis(y, log);
    if (!Number.isFinite(ax) || !Number.isFinite(ay)) continue;
    const sx = side(ax, xFit);
    const sy = side(ay, yFit);
    if (sx === 0 && sy === 0) continue;
    out.indices.push(cloud.indices[i] as number);
    out.xs.push(sx === 0 ? x : band(sx, xFit as AxisFit));
    out.ys.push(sy === 0 ? y : band(sy, yFit as AxisFit));
    out.trueXs.push(x);
    out.trueYs.push(y);
    out.symbols.push(edgeSymbol(sx, sy));
  }
  return out;
}

/**
 * Both axes of a front chart fitted (fitAxis): x and y each to most of the cloud, the whole front and
 * the `extra` points (baselines) near the cloud; with `everything`, to all of them.
 */
export function fitFrontAxes(
  cloud: { xs: ArrayLike<number>; ys: ArrayLike<number> },
  front: readonly { x: number; y: number }[],
  extra: readonly { x: number; y: number }[],
  log: boolean,
  everything = false,
): { x: AxisFit | null; y: AxisFit | null } {
  return {
    x: fitAxis(cloud.xs, front.map((p) => p.x), log, extra.map((p) => p.x), everything),
    y: fitAxis(cloud.ys, front.map((p) => p.y), log, extra.map((p) => p.y), everything),
  };
}
