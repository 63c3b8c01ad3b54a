import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Raw control effort: the integral of the squared plant input, by the trapezoidal rule:
 *
 *   Raw effort = ∫₀ᵀ u(t)² dt ≈ Σ_k (t_{k+1} − t_k)·(u_k² + u_{k+1}²)/2.
 *
 * Unlike `effort` it is not measured from u∞, so a loop that must hold a non-zero input grows by
 * u∞²·T with the horizon T: use it to compare loops on one scenario and horizon, e.g. energy drawn
 * by a heater. u[0] is u(0⁺), after the proportional and derivative kick.
 *
 * t: time grid [s]; u: plant input [u]. Result [u²·s].
 *
 * Reference: the quadratic input cost of LQ control, B. D. O. Anderson and J. B. Moore, Optimal
 * Control: Linear Quadratic Methods, Prentice Hall, 1990, §2 (there for deviations from the
 * equilibrium; here on the absolute input — common practice for energy-like figures).
 */
export function rawEffort(t: ArrayLike<number>, u: ArrayLike<number>): number {
  assertSameLength(t, { u });
  let sum = 0;
  let previous = u[0] * u[0];
  for (let k = 1; k < t.length; k++) {
    const current = u[k] * u[k];
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const rawEffortCriterion: CriterionDefinition = {
  id: "rawEffort",
  kind: "time",
  label: "Raw effort ∫u²dt",
  unit: "u²·s",
  description: "Integral of the squared plant input over the horizon, ∫u²dt (grows with the horizon when u∞ ≠ 0).",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : rawEffort(trace.t, trace.u)),
};
