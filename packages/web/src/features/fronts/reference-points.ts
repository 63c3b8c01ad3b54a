import type { BaselineDto, CriterionId, ReferencesDto } from "@loopyard/core";
import { finiteScore } from "../../components/format-score.js";

/** Legend text and hover text of the bound and the baselines, one wording everywhere. */
export const BOUND_LABEL = "LQR bound (no controller can go below-left)";
export const BOUND_HOVER =
  "Least ISE reachable for each effort by ANY controller (LQR with Riccati weights r/q, over the sweep's horizon). " +
  "Every candidate, of any structure, lies on or above-right of this line.";
export const baselineHover = (label: string) => `Published tuning rule ${label}, scored like any candidate`;

/** A baseline placed on the chosen axes. */
export interface BaselinePoint {
  label: string;
  rule: string;
  x: number;
  y: number;
  params: Record<string, number>;
}

/**
 * The bound curve on the chosen axes: (ISE, effort) or (effort, ISE), else null (the bound is a curve in
 * that plane only). Points outside the box of `within` (the plotted candidates' columns, widened
 * by a quarter of its span) are dropped, except the nearest one beyond each end, so the dashed line
 * reaches the plot's edges without stretching its axes.
 */
export function boundTrace(
  bound: ReferencesDto["bound"] | undefined,
  x: CriterionId,
  y: CriterionId,
  within: { xs: ArrayLike<number>; ys: ArrayLike<number> } = { xs: [], ys: [] },
): { x: number[]; y: number[] } | null {
  if (!bound?.ok || bound.points.length === 0) return null;
  const swap = x === "effort" && y === "ise";
  if (!swap && !(x === "ise" && y === "effort")) return null;
  const pts = bound.points.map((p) => (swap ? { x: p.effort, y: p.ise } : { x: p.ise, y: p.effort }));
  if (within.xs.length === 0) return { x: pts.map((p) => p.x), y: pts.map((p) => p.y) };
  const span = (v: ArrayLike<number>) => {
    const [lo, hi] = extent(v);
    const pad = (hi - lo) * 0.25;
    return [lo - pad, hi + pad] as const;
  };
  const [x0, x1] = span(within.xs);
  const [y0, y1] = span(within.ys);
  const inside = pts.map((p) => p.x >= x0 && p.x <= x1 && p.y >= y0 && p.y <= y1);
  const keep = pts.filter((_, i) => inside[i] || inside[i - 1] || inside[i + 1]);
  if (keep.length < 2) return null;
  return { x: keep.map((p) => p.x), y: keep.map((p) => p.y) };
}

/** The stable baselines with finite scores on both chosen criteria. */
export function baselinePoints(baselines: readonly BaselineDto[] | undefined, criteria: readonly CriterionId[], x: CriterionId, y: CriterionId): BaselinePoint[] {
  const ix = criteria.indexOf(x);
  const iy = criteria.indexOf(y);
  if (!baselines || ix < 0 || iy < 0) return [];
  const points: BaselinePoint[] = [];
  for (const b of baselines) {
    if (b.status !== "stable") continue;
    const px = finiteScore(b.scores[ix]);
    const py = finiteScore(b.scores[iy]);
    if (px !== null && py !== null) points.push({ label: b.label, rule: b.rule, x: px, y: py, params: b.params });
  }
  return points;
}

/** Fraction of the span added on each side of a fitted axis range. */
export const RANGE_PADDING = 0.06;

/**
 * An axis range fitted to the candidates' values, so that a far-away baseline or the bound's tail does
 * not squeeze the cloud: [lo − p, hi + p] with p = RANGE_PADDING·span on a linear axis, the same in
 * log10 units on a log axis (plotly's convention for log ranges); null when there is nothing to fit
 * (or a non-positive value on a log axis: plotly's autorange handles that).
 */
export function fittedRange(values: ArrayLike<number>, log: boolean): [number, number] | null {
  if (values.length === 0) return null;
  let [lo, hi] = extent(values);
  if (log) {
    if (!(lo > 0)) return null;
    [lo, hi] = [Math.log10(lo), Math.log10(hi)];
  }
  const pad = (hi - lo) * RANGE_PADDING || (log ? 0.5 : Math.abs(lo) * 0.1 || 1);
  return [lo - pad, hi + pad];
}

/** Whether a value lies in a fitted range (null: the whole axis). */
export function inRange(value: number, range: [number, number] | null, log: boolean): boolean {
  if (range === null) return true;
  const v = log ? Math.log10(value) : value;
  return v >= range[0] && v <= range[1];
}

/** [min, max] of the values (a loop: spreading 10⁵ values into Math.min overflows the stack); NaN makes both NaN. */
export function extent(values: ArrayLike<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (Number.isNaN(v)) return [Number.NaN, Number.NaN];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}
