import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Integral of the squared error, by the trapezoidal rule on the samples:
 *
 *   ISE = ∫₀ᵀ e(t)² dt ≈ Σ_k (t_{k+1} − t_k)·(e_k² + e_{k+1}²)/2.
 *
 * t: time grid [s], strictly increasing; e: error r − y [y]. Result [y²·s].
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.4;
 * G. C. Newton, L. A. Gould and J. F. Kaiser, Analytical Design of Linear Feedback Controls,
 * Wiley, 1957 (integral-square-error design and its tables).
 */
export function ise(t: ArrayLike<number>, e: ArrayLike<number>): number {
  assertSameLength(t, { e });
  let sum = 0;
  let previous = e[0] * e[0];
  for (let k = 1; k < t.length; k++) {
    const current = e[k] * e[k];
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const iseCriterion: CriterionDefinition = {
  id: "ise",
  kind: "time",
  label: "ISE",
  unit: "y²·s",
  description: "Integral of the squared control error over the horizon, ∫e²dt.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : ise(trace.t, trace.e)),
};
