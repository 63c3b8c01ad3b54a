import type { Aggregate } from "../aggregates/aggregate-scores.js";
import { boundCurve, type BoundCurvePoint } from "../optimal/bound-curve.js";
import type { ExactCostScenario } from "../optimal/exact-quadratic-costs.js";
import type { Plant } from "../plants/plant.js";

/** The bound of a family's aggregate on the (ISE, effort) plane, with a sentence on what it is. */
export type FamilyBoundCurve =
  | { ok: true; points: BoundCurvePoint[]; skipped: number[]; note: string }
  | { ok: false; reason: string };

/**
 * The bound curve for a family's AGGREGATE (ISE, effort) scores, from the variants' bound curves
 * (boundCurve, same ratios ρ and horizon). Each variant's curve is the set of supporting lines
 * ISE_f + ρ·Effort_f ≥ c_f(ρ) that every controller satisfies on variant f; combined:
 *
 * - worst case (a_c = max_f s_fc for ISE and effort): ISE_agg ≥ ISE_f and Effort_agg ≥ Effort_f for
 *   every f, so ISE_agg + ρ·Effort_agg ≥ max_f c_f(ρ). The point at ρ is that of the variant with the
 *   largest c_f(ρ): it lies on the combined line, so no aggregate point lies below-left of it.
 *   Variants without a bound (nonlinear) are left out — a maximum over fewer variants is still a
 *   lower bound — and the note says so.
 * - mean (a_c = (1/F)·Σ_f s_fc): the mean is linear, so ISE_agg + ρ·Effort_agg = (1/F)·Σ_f (ISE_f +
 *   ρ·Effort_f) ≥ (1/F)·Σ_f c_f(ρ). The point at ρ is the mean of the variants' points at the SAME ρ
 *   (not at the same effort): it lies on that line. It is the bound of the averaged sets (Minkowski
 *   mean, support functions add), valid but possibly loose, since one controller must serve every
 *   variant. Every variant needs a bound.
 * - percentile: no bound follows from the variants' bounds (ISE and effort may come from different
 *   variants); `{ ok: false }` with the reason.
 * A single variant: its own curve. Only ratios present on every variant used are kept.
 * Reference: the weighted-sum supporting lines, S. Boyd and L. Vandenberghe, Convex Optimization,
 * 2004, §4.7.4; max and mean of lower bounds: closed form (the inequalities above).
 */
export function familyBoundCurve(
  family: readonly Plant[],
  scenario: ExactCostScenario,
  aggregate: Aggregate,
  options: { ratios?: readonly number[]; horizon?: "infinite" | number; labels?: readonly string[] } = {},
): FamilyBoundCurve {
  if (!Array.isArray(family) || family.length === 0) throw new RangeError("family: give at least one plant");
  const horizonNote = options.horizon === undefined || options.horizon === "infinite" ? "infinite horizon" : `horizon ${options.horizon} s`;
  const label = (f: number) => options.labels?.[f] ?? `variant ${f + 1}`;
  const curve = (plant: Plant) => (plant.kind === "nonlinear" ? ({ ok: false, reason: "the bound needs a linear plant" } as const) : boundCurve(plant, scenario, { ratios: options.ratios, horizon: options.horizon }));
  if (family.length === 1) {
    const single = curve(family[0]);
    if (!single.ok) return single;
    return { ...single, note: `LQR bound of this plant (${horizonNote}).` };
  }
  if (aggregate.kind === "percentile") {
    return { ok: false, reason: `the ${aggregate.p}th-percentile aggregate has no bound from the variants' bounds (ISE and effort may come from different variants); choose the worst case or the mean` };
  }
  const curves = family.map(curve);
  const used: number[] = [];
  const missing: string[] = [];
  curves.forEach((c, f) => (c.ok ? used.push(f) : missing.push(`${label(f)}: ${c.reason}`)));
  if (aggregate.kind === "mean" && missing.length > 0) return { ok: false, reason: `the mean's bound needs a bound on every variant (${missing.join("; ")})` };
  if (used.length === 0) return { ok: false, reason: `no variant has a bound (${missing.join("; ")})` };
  const byRatio = used.map((f) => {
    const c = curves[f] as Extract<(typeof curves)[number], { ok: true }>;
    return new Map(c.points.map((p) => [p.ratio, p]));
  });
  const ratios = [...byRatio[0].keys()].filter((ratio) => byRatio.every((m) => m.has(ratio))).sort((x, y) => x - y);
  if (ratios.length === 0) return { ok: false, reason: "the variants' bounds share no weight ratio" };
  const allRatios = new Set(used.flatMap((f) => [...(curves[f] as { points: BoundCurvePoint[] }).points.map((p) => p.ratio), ...(curves[f] as { skipped: number[] }).skipped]));
  const skipped = [...allRatios].filter((ratio) => !ratios.includes(ratio)).sort((x, y) => x - y);
  const points: BoundCurvePoint[] = ratios.map((ratio) => {
    const at = byRatio.map((m) => m.get(ratio)!);
    if (aggregate.kind === "worst") return at.reduce((best, p) => (p.cost > best.cost ? p : best));
    const mean = (pick: (p: BoundCurvePoint) => number) => at.reduce((sum, p) => sum + pick(p), 0) / at.length;
    const point: BoundCurvePoint = { ratio, ise: mean((p) => p.ise), effort: mean((p) => p.effort), cost: mean((p) => p.cost) };
    if (at.some((p) => p.shortfall !== undefined)) point.shortfall = Math.max(...at.map((p) => p.shortfall ?? 0));
    return point;
  });
  const note =
    aggregate.kind === "worst"
      ? `Bound of the worst case over ${used.length} variant${used.length === 1 ? "" : "s"}: at each weight ratio the largest of their LQR bounds (${horizonNote})` +
        (missing.length > 0 ? `; left out, without a bound: ${missing.join("; ")}.` : ".")
      : `Bound of the mean over ${used.length} variants: at each weight ratio the mean of their LQR bounds (${horizonNote}); valid, possibly loose, since one controller must serve every variant.`;
  return { ok: true, points, skipped, note };
}
