import type { CriterionDefinition } from "./criterion-definition.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Total variation of the plant input over the grid:
 *
 *   TV = Σ_{k=0}^{N−1} |u_{k+1} − u_k|.
 *
 * A measure of actuator wear and of how much noise the controller passes on. It starts at
 * u[0] = u(0⁺): the jump from the input before the step, u(0⁻), to u(0⁺) (the proportional and
 * derivative kick) is not counted, and the figure depends on the grid (finer sampling of a noisy u
 * shows more variation). For a monotone u, TV = |u(T) − u(0⁺)|.
 *
 * u: plant input samples [u], at least one. Result [u].
 *
 * Reference: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., Wiley,
 * 2005 (total variation of the input as a measure of manipulated-variable usage); S. Skogestad,
 * "Simple analytic rules for model reduction and PID controller tuning", J. Process Control 13,
 * 291–309, 2003, uses the same sum.
 */
export function tv(u: ArrayLike<number>): number {
  if (u.length < 1) throw new RangeError("u must hold at least one sample");
  let sum = 0;
  for (let k = 1; k < u.length; k++) sum += Math.abs(u[k] - u[k - 1]);
  return sum;
}

export const tvCriterion: CriterionDefinition = {
  id: "tv",
  kind: "time",
  label: "TV(u)",
  unit: "u",
  description: "Total variation of the plant input over the grid, Σ|u[k+1] − u[k]|, from u(0⁺) on.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : tv(trace.u)),
};
