import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Control effort: the integral of the squared deviation of the plant input from its
 * steady-state value, by the trapezoidal rule on the samples:
 *
 *   Effort = ∫₀ᵀ (u(t) − u∞)² dt ≈ Σ_k (t_{k+1} − t_k)·((u_k − u∞)² + (u_{k+1} − u∞)²)/2.
 *
 * Measuring from u∞ rather than 0 keeps the figure finite over long horizons: every loop that
 * holds the setpoint needs u∞ for ever, and only the transient work is a property of the tuning.
 * u∞ is the exact steady-state input (steadyStateInput: 1/G(0) with integral action, 0 for a plant
 * with a pole at s = 0, kp/(1 + kp·G(0)) without integral action).
 *
 * t: time grid [s]; u: plant input [u]; uInfinity: steady-state input [u], finite. Result [u²·s].
 * The sample u_0 is u(0⁺) (with the kick kp + kd/tf); with dt ≳ tf the trapezoid over-weights the
 * derivative kick, whose exact contribution is about (kd/tf)²·tf/2.
 *
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.4 (control-signal
 * activity as a design criterion); the quadratic input cost of LQ control, B. D. O. Anderson and
 * J. B. Moore, Optimal Control: Linear Quadratic Methods, Prentice Hall, 1990, §2.
 */
export function effort(t: ArrayLike<number>, u: ArrayLike<number>, uInfinity: number): number {
  assertSameLength(t, { u });
  if (!Number.isFinite(uInfinity)) throw new RangeError(`uInfinity must be finite, got ${uInfinity}`);
  let sum = 0;
  let d = u[0] - uInfinity;
  let previous = d * d;
  for (let k = 1; k < t.length; k++) {
    d = u[k] - uInfinity;
    const current = d * d;
    sum += (t[k] - t[k - 1]) * (previous + current);
    previous = current;
  }
  return sum / 2;
}

export const effortCriterion: CriterionDefinition = {
  id: "effort",
  kind: "time",
  label: "Effort ∫(u−u∞)²dt",
  unit: "u²·s",
  description: "Integral of the squared deviation of the plant input from its steady-state value u∞.",
  /** NaN when the loop has no steady state (u∞ not finite) or diverged, so it never ranks as good. */
  compute: (trace) =>
    !isDivergedTrace(trace) && Number.isFinite(trace.uInfinity) ? effort(trace.t, trace.u, trace.uInfinity) : NaN,
};
