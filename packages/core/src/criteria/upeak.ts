import type { CriterionDefinition } from "./criterion-definition.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Peak magnitude of the plant input over the grid:
 *
 *   u_peak = max_k |u_k|.
 *
 * Includes u[0] = u(0⁺), so for a PID with derivative filter on a strictly proper plant the peak is
 * usually the kick kp·Δr + kd/tf·Δr right after a setpoint step. Measured from 0, not from u∞:
 * it is the figure to compare with the actuator's range.
 *
 * u: plant input samples [u], at least one. Result [u].
 *
 * Reference: common practice (peak control signal as a check against actuator limits, e.g.
 * K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.4, control-signal activity).
 */
export function upeak(u: ArrayLike<number>): number {
  if (u.length < 1) throw new RangeError("u must hold at least one sample");
  let peak = 0;
  for (let k = 0; k < u.length; k++) {
    const a = Math.abs(u[k]);
    if (a > peak || Number.isNaN(a)) peak = a;
  }
  return peak;
}

export const upeakCriterion: CriterionDefinition = {
  id: "upeak",
  kind: "time",
  label: "Peak |u|",
  unit: "u",
  description: "Largest magnitude of the plant input over the horizon, max|u|, including u(0⁺).",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : upeak(trace.u)),
};
