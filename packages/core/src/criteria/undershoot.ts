import type { CriterionDefinition } from "./criterion-definition.js";
import { assertStepLevels, stepReference } from "./step-reference.js";

/**
 * Undershoot of a step response (inverse response), in percent of the output change:
 *
 *   undershoot = 100 · max(0, max_k s·(y0 − y_k)) / |y_f − y0|,   s = sign(y_f − y0):
 *
 * how far the output moves from y0 in the direction opposite to the change. A non-minimum-phase
 * plant (a right-half-plane zero) starts the wrong way; 0 if y never goes past y0 the wrong way.
 * Taken over the whole horizon, so a response that swings back past y0 after a very large
 * overshoot also counts. Sampled like overshoot (a dip between samples is missed by at most
 * ½·|y''|·(dt/2)²); y[0] = y(0⁺) counts like any sample.
 *
 * y: output samples [y]; y0, target: output before the step and final value [y], finite,
 * different. Result [%].
 *
 * Reference: common practice (e.g. the inverse response of systems with right-half-plane zeros,
 * K. J. Åström and R. M. Murray, Feedback Systems, Princeton University Press, 2008, §5.3 and
 * §14.2 — definition from memory).
 */
export function undershoot(y: ArrayLike<number>, y0: number, target: number): number {
  assertStepLevels(y0, target);
  const change = target - y0;
  const s = Math.sign(change);
  let worst = 0;
  for (let k = 0; k < y.length; k++) {
    const wrongWay = s * (y0 - y[k]);
    if (wrongWay > worst || Number.isNaN(wrongWay)) worst = wrongWay;
  }
  return (100 * worst) / Math.abs(change);
}

export const undershootCriterion: CriterionDefinition = {
  id: "undershoot",
  kind: "time",
  label: "Undershoot",
  unit: "%",
  description: "How far the output first moves the wrong way from where it started, in % of the output change; 0 if never.",
  compute: (trace) => {
    const ref = stepReference(trace);
    return ref === null ? NaN : undershoot(trace.y, ref.y0, ref.target);
  },
};
