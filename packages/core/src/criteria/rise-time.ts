import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { assertStepLevels, stepReference } from "./step-reference.js";

/** The rise-time levels: 10 % and 90 % of the output change. */
export const RISE_LOW_FRACTION = 0.1;
export const RISE_HIGH_FRACTION = 0.9;

/**
 * Rise time 10–90 % of a step response:
 *
 *   t_r = t₉₀ − t₁₀,   t_p = first time y reaches y0 + p·(y_f − y0)  (sign-aware),
 *
 * each crossing found between the two samples that straddle the level by linear interpolation
 * (error about dt²·|y''|/(8|y'|)). If y[0] = y(0⁺) is already at or past a level (direct
 * feedthrough), that crossing time is t[0]. Infinity when y never reaches the 90 % level within
 * the horizon (Infinity ranks last and is kept apart from NaN, which means "does not apply").
 * The first crossing counts even if y falls back below the level later.
 *
 * t: time grid [s]; y: output [y]; y0, target: output before the step and final value [y].
 * Result [s].
 *
 * References: G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, 4th ed., Prentice Hall, 2002, §3.4 (rise time 10 %–90 %); K. J. Åström and
 * T. Hägglund, Advanced PID Control, ISA, 2006, §4.4.
 */
export function riseTime(t: ArrayLike<number>, y: ArrayLike<number>, y0: number, target: number): number {
  assertSameLength(t, { y });
  assertStepLevels(y0, target);
  const change = target - y0;
  const high = firstCrossing(t, y, y0 + RISE_HIGH_FRACTION * change, Math.sign(change));
  if (high === Infinity) return Infinity;
  return high - firstCrossing(t, y, y0 + RISE_LOW_FRACTION * change, Math.sign(change));
}

/** Time at which s·(y − level) first becomes ≥ 0, interpolated; Infinity if never. */
function firstCrossing(t: ArrayLike<number>, y: ArrayLike<number>, level: number, s: number): number {
  if (s * (y[0] - level) >= 0) return t[0];
  for (let k = 1; k < y.length; k++) {
    const after = s * (y[k] - level);
    if (after >= 0) {
      const before = s * (y[k - 1] - level); // < 0
      return t[k - 1] + ((t[k] - t[k - 1]) * -before) / (after - before);
    }
  }
  return Infinity;
}

export const riseTimeCriterion: CriterionDefinition = {
  id: "riseTime",
  kind: "time",
  label: "Rise time 10–90 %",
  unit: "s",
  description: "Time the output takes from 10 % to 90 % of its change, interpolated; ∞ if 90 % is not reached.",
  compute: (trace) => {
    const ref = stepReference(trace);
    return ref === null ? NaN : riseTime(trace.t, trace.y, ref.y0, ref.target);
  },
};
