import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Integral of time-weighted absolute error, by the trapezoidal rule on the samples:
 *
 *   ITAE = ∫₀ᵀ t·|e(t)| dt ≈ Σ_k (t_{k+1} − t_k)·(t_k|e_k| + t_{k+1}|e_{k+1}|)/2.
 *
 * Weighting by t forgives the unavoidable error just after the step and punishes slow settling.
 * t: time grid [s], strictly increasing, starting at the step; e: error r − y [y]. Result [y·s²].
 *
 * Reference: D. Graham and R. C. Lathrop, "The synthesis of 'optimum' transient response:
 * criteria and standard forms", Trans. AIEE 72(5), 273–288, 1953.
 */
export function itae(t: ArrayLike<number>, e: ArrayLike<number>): number {
  assertSameLength(t, { e });
  let sum = 0;
  let previous = t[0] * Math.abs(e[0]);
  for (let k = 1; k < t.length; k++) {
    const current = t[k] * Math.abs(e[k]);
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const itaeCriterion: CriterionDefinition = {
  id: "itae",
  kind: "time",
  label: "ITAE",
  unit: "y·s²",
  description: "Integral of time-weighted absolute control error, ∫t·|e|dt; punishes slow settling.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : itae(trace.t, trace.e)),
};
