import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Integral of time-weighted squared error, by the trapezoidal rule on the samples:
 *
 *   ITSE = ∫₀ᵀ t·e(t)² dt ≈ Σ_k (t_{k+1} − t_k)·(t_k e_k² + t_{k+1} e_{k+1}²)/2.
 *
 * Like ITAE it forgives the error just after the step (the weight t is 0 at t = 0⁺, so e[0] does
 * not count) and punishes slow settling; squaring makes large errors weigh more than small ones.
 * t: time grid [s], strictly increasing, starting at the step; e: error r − y [y]. Result [y²·s²].
 *
 * References: D. Graham and R. C. Lathrop, "The synthesis of 'optimum' transient response:
 * criteria and standard forms", Trans. AIEE 72(5), 273–288, 1953 (ITSE among the criteria
 * compared); common practice for the trapezoidal rule on the grid.
 */
export function itse(t: ArrayLike<number>, e: ArrayLike<number>): number {
  assertSameLength(t, { e });
  let sum = 0;
  let previous = t[0] * e[0] * e[0];
  for (let k = 1; k < t.length; k++) {
    const current = t[k] * e[k] * e[k];
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const itseCriterion: CriterionDefinition = {
  id: "itse",
  kind: "time",
  label: "ITSE",
  unit: "y²·s²",
  description: "Integral of time-weighted squared control error, ∫t·e²dt.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : itse(trace.t, trace.e)),
};
