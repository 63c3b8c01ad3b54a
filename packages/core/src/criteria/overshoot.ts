import type { CriterionDefinition } from "./criterion-definition.js";
import { assertStepLevels, stepReference } from "./step-reference.js";

/**
 * Overshoot of a step response, in percent of the output change:
 *
 *   overshoot = 100 · max(0, max_k s·(y_k − y_f)) / |y_f − y0|,   s = sign(y_f − y0),
 *
 * where y0 is the output before the step and y_f the final value it moves to (see stepReference:
 * y∞ when known, else the setpoint). Sign-aware: for a downward step the overshoot is how far y
 * goes below y_f. 0 when y never passes y_f. The maximum is taken over the samples, so a peak
 * between samples is missed by at most ½·|y''|·(dt/2)².
 * y[0] = y(0⁺) counts like any sample (it matters only for a plant with direct feedthrough).
 *
 * y: output samples [y]; y0, target: output before the step and final value [y], finite,
 * different. Result [%].
 *
 * References: K. Ogata, Modern Control Engineering, 5th ed., Prentice Hall, 2010, §5-3 (maximum
 * percent overshoot relative to c(∞)); K. J. Åström and T. Hägglund, Advanced PID Control, ISA,
 * 2006, §4.4 (overshoot of the setpoint response).
 */
export function overshoot(y: ArrayLike<number>, y0: number, target: number): number {
  assertStepLevels(y0, target);
  const change = target - y0;
  const s = Math.sign(change);
  let worst = 0;
  for (let k = 0; k < y.length; k++) {
    const beyond = s * (y[k] - target);
    if (beyond > worst || Number.isNaN(beyond)) worst = beyond;
  }
  return (100 * worst) / Math.abs(change);
}

export const overshootCriterion: CriterionDefinition = {
  id: "overshoot",
  kind: "time",
  label: "Overshoot",
  unit: "%",
  description: "How far the output passes its final value, in % of the output change; 0 if it never does.",
  compute: (trace) => {
    const ref = stepReference(trace);
    return ref === null ? NaN : overshoot(trace.y, ref.y0, ref.target);
  },
};
