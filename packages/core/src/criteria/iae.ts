import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Integral of the absolute error, by the trapezoidal rule on the samples:
 *
 *   IAE = ∫₀ᵀ |e(t)| dt ≈ Σ_k (t_{k+1} − t_k)·(|e_k| + |e_{k+1}|)/2.
 *
 * t: time grid [s], strictly increasing; e: error r − y at those times [y]. Result [y·s].
 * The trapezoid over a sign change of e slightly over-estimates |e|; the error is O(dt²) per crossing.
 *
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.4 (criteria
 * for load disturbance and setpoint response, eq. 4.18).
 */
export function iae(t: ArrayLike<number>, e: ArrayLike<number>): number {
  assertSameLength(t, { e });
  let sum = 0;
  let previous = Math.abs(e[0]);
  for (let k = 1; k < t.length; k++) {
    const current = Math.abs(e[k]);
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const iaeCriterion: CriterionDefinition = {
  id: "iae",
  kind: "time",
  label: "IAE",
  unit: "y·s",
  description: "Integral of the absolute control error over the horizon, ∫|e|dt.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : iae(trace.t, trace.e)),
};
