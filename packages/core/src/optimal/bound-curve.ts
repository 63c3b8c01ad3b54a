import { Matrix } from "ml-matrix";
import type { Plant } from "../plants/plant.js";
import type { ExactCostScenario } from "./exact-quadratic-costs.js";
import { lqrBound } from "./lqr-bound.js";
import { symmetrize } from "./matrix-argument.js";
import { setpointDeviationProblem } from "./setpoint-deviation-problem.js";
import { lyapunovMatrix } from "./solve-lyapunov.js";

/** Default weight ratios r/q: 33 points, four per decade from 1e-4 to 1e4. */
export const DEFAULT_BOUND_RATIOS: readonly number[] = Array.from({ length: 33 }, (_, k) => 10 ** (-4 + k / 4));

/** One point of the bound curve: the LQR design for r/q = ratio and its ISE and effort. */
export interface BoundCurvePoint {
  ratio: number;
  /** ∫e² dt of the LQR loop [y²·s] (with Δr²·θ for a dead time). */
  ise: number;
  /** ∫(u − u∞)² dt of the LQR loop [u²·s]. */
  effort: number;
  /** ISE + ratio·effort: the bound for q = 1, r = ratio (over the curve's horizon). */
  cost: number;
  /**
   * Finite horizon only: 1 − cost_T/cost_∞, how far the finite-horizon bound lies below the
   * infinite-horizon one at this ratio (0 to rounding once T is many closed-loop time constants).
   */
  shortfall?: number;
}

export type BoundCurve = { ok: true; points: BoundCurvePoint[]; skipped: number[] } | { ok: false; reason: string };

/**
 * The bound curve on the (ISE, effort) plane for a linear plant and a setpoint step over an infinite
 * horizon (or a finite one, below): for each weight ratio ρ = r/q, the LQR design (lqrBound with q = 1, r = ρ) and the ISE
 * and effort of its closed loop x̃' = (A − BK)x̃, from the Gramian X of x̃(0) (solveLyapunov's
 * method): ISE = (C − DK) X (C − DK)ᵀ + Δr²θ, Effort = K X Kᵀ. Points come sorted by ratio
 * ascending: effort falls and ISE rises as ρ grows.
 *
 * Why every controller lies on or above-right of the curve: for every ρ and any controller,
 * ISE + ρ·Effort ≥ bound(ρ) = ISE_ρ + ρ·Effort_ρ (lqrBound), so each point (ISE, Effort) of any
 * controller lies on or above the line through the curve's point ρ with slope −1/ρ. The set of
 * achievable (ISE, Effort) pairs is convex (both are convex quadratic functions of the input) and
 * the LQR points are where these supporting lines touch it: the curve is its lower-left envelope.
 * No candidate can sit below-left of it; one that does is a bug.
 *
 * Finite horizon T (options.horizon, e.g. the scenario's, for candidates scored over [0, T]): the
 * least cost over [0, T] is smaller, cost_T(ρ) ≤ cost_∞(ρ) (lqrBound with horizon T, the Riccati
 * differential equation in closed form), so the supporting lines move down to ISE + ρ·Effort ≥
 * cost_T(ρ). Each point is the infinite-horizon point scaled onto its finite line,
 * (ISE, Effort)·cost_T/cost_∞ — on the line, so no candidate scored over [0, T] lies below-left of
 * it — and `shortfall` = 1 − cost_T/cost_∞ says how far it moved. The gap decays like e^(−2σT)
 * (σ the slowest decay rate of the LQR loop): for T ≫ 1/σ the finite curve is the infinite one to
 * rounding. For T not long against the loop the points are valid but lie below the (unknown)
 * tangency points of the finite-horizon set by up to the shortfall.
 *
 * ratios: finite, > 0 (default DEFAULT_BOUND_RATIOS). A ratio whose solve fails numerically (an
 * extreme ratio on a badly scaled plant) is left out and listed in `skipped`; a structural failure
 * (zero at s = 0, not stabilisable or detectable) is `{ ok: false, reason }`.
 * References: as lqrBound; the weighted-sum (scalarisation) view of a Pareto front: S. Boyd and
 * L. Vandenberghe, Convex Optimization, Cambridge, 2004, §4.7.4.
 */
export function boundCurve(plant: Plant, scenario: ExactCostScenario, options: { ratios?: readonly number[]; horizon?: "infinite" | number } = {}): BoundCurve {
  const ratios = options.ratios ?? DEFAULT_BOUND_RATIOS;
  const horizon = options.horizon ?? "infinite";
  if (horizon !== "infinite" && (typeof horizon !== "number" || !(horizon > 0) || !Number.isFinite(horizon))) {
    throw new RangeError(`horizon must be "infinite" or a finite time > 0 s, got ${String(horizon)}`);
  }
  if (!Array.isArray(ratios) || ratios.length === 0) throw new RangeError("ratios must be a non-empty list of weight ratios r/q > 0");
  for (const ratio of ratios) {
    if (typeof ratio !== "number" || !Number.isFinite(ratio) || !(ratio > 0)) throw new RangeError(`ratios: every ratio r/q must be a finite number > 0, got ${String(ratio)}`);
  }
  const points: BoundCurvePoint[] = [];
  const skipped: number[] = [];
  let firstReason: string | null = null;
  for (const ratio of [...ratios].sort((x, y) => x - y)) {
    const bound = lqrBound(plant, scenario, { q: 1, r: ratio });
    if (!bound.ok) {
      firstReason ??= bound.reason;
      skipped.push(ratio);
      continue;
    }
    const problem = setpointDeviationProblem(plant as Exclude<Plant, { kind: "nonlinear" }>, scenario, 1, ratio);
    if ("ok" in problem) return problem;
    const { a, b, c, d, x0, setpoint, delay } = problem;
    const gain = new Matrix(bound.K);
    const closed = Matrix.sub(a, b.mmul(gain));
    const gram = lyapunovMatrix(closed.transpose(), symmetrize(x0.mmul(x0.transpose())));
    if (!gram) {
      skipped.push(ratio);
      continue;
    }
    const errorRow = Matrix.sub(c, Matrix.mul(gain, d));
    const ise = Math.max(0, errorRow.mmul(gram).mmul(errorRow.transpose()).get(0, 0)) + setpoint * setpoint * delay;
    const effort = Math.max(0, gain.mmul(gram).mmul(gain.transpose()).get(0, 0));
    if (horizon === "infinite") {
      points.push({ ratio, ise, effort, cost: bound.cost });
      continue;
    }
    const finite = lqrBound(plant, scenario, { q: 1, r: ratio, horizon });
    if (!finite.ok || !(bound.cost > 0)) {
      skipped.push(ratio);
      continue;
    }
    const scale = Math.min(1, finite.cost / bound.cost);
    points.push({ ratio, ise: ise * scale, effort: effort * scale, cost: finite.cost, shortfall: 1 - scale });
  }
  if (points.length === 0) return { ok: false, reason: firstReason ?? "no ratio gave a bound" };
  return { ok: true, points, skipped };
}
