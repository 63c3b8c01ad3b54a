import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/** Default weights of the quadratic criterion: error and input deviation count alike. */
export const QUADRATIC_DEFAULT_Q = 1;
export const QUADRATIC_DEFAULT_R = 1;

/** Weights of the quadratic criterion; both finite and ≥ 0. */
export interface QuadraticWeights {
  q?: number;
  r?: number;
}

/**
 * Weighted quadratic cost of error and input deviation, by the trapezoidal rule:
 *
 *   J = ∫₀ᵀ (q·e(t)² + r·(u(t) − u∞)²) dt = q·ISE + r·Effort.
 *
 * q = 1, r = 0 gives ISE; q = 0, r = 1 gives effort. Units: q·[y²·s] + r·[u²·s]; choose q and r
 * (e.g. q = 1, r = 1/u_max²) to make the two terms commensurate.
 * t: time grid [s]; e: error [y]; u: plant input [u]; uInfinity: steady-state input [u] (only
 * needed, and then required finite, when r > 0). q, r: weights, finite, ≥ 0, default 1 each.
 * u[0] = u(0⁺) and e[0] = e(0⁺) enter the first trapezoid like every other sample.
 *
 * Reference: the LQ cost ∫(xᵀQx + uᵀRu)dt, B. D. O. Anderson and J. B. Moore, Optimal Control:
 * Linear Quadratic Methods, Prentice Hall, 1990, §2; here with x replaced by the control error
 * and u by its deviation from u∞ (common practice for servo problems).
 */
export function quadratic(
  t: ArrayLike<number>,
  e: ArrayLike<number>,
  u: ArrayLike<number>,
  uInfinity: number,
  weights: QuadraticWeights = {},
): number {
  assertSameLength(t, { e, u });
  const q = weight("q", weights.q, QUADRATIC_DEFAULT_Q);
  const r = weight("r", weights.r, QUADRATIC_DEFAULT_R);
  if (r > 0 && !Number.isFinite(uInfinity)) throw new RangeError(`uInfinity must be finite when r > 0, got ${uInfinity}`);
  const u0 = r > 0 ? uInfinity : 0;
  let d = u[0] - u0;
  let previous = q * e[0] * e[0] + r * d * d;
  let sum = 0;
  for (let k = 1; k < t.length; k++) {
    d = u[k] - u0;
    const current = q * e[k] * e[k] + r * d * d;
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

function weight(name: string, value: number | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be a finite number ≥ 0, got ${String(value)}`);
  }
  return value;
}

export const quadraticCriterion: CriterionDefinition = {
  id: "quadratic",
  kind: "time",
  label: "Quadratic J",
  unit: "q·y²·s + r·u²·s",
  description: "Weighted quadratic cost ∫(q·e² + r·(u−u∞)²)dt; q and r default to 1.",
  /** NaN on a diverged trace, or when r > 0 and the loop has no steady state (u∞ not finite). */
  compute: (trace, options = {}) => {
    const q = weight("q", options.q, QUADRATIC_DEFAULT_Q);
    const r = weight("r", options.r, QUADRATIC_DEFAULT_R);
    if (isDivergedTrace(trace) || (r > 0 && !Number.isFinite(trace.uInfinity))) return NaN;
    return quadratic(trace.t, trace.e, trace.u, trace.uInfinity, { q, r });
  },
};
