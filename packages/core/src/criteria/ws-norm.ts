import { sensitivityTail } from "../frequency/frequency-response.js";
import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import type { SensitivityWeight } from "../frequency/sensitivity-weight.js";
import { weightedSensitivityPeak } from "../frequency/weighted-sensitivity-peak.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Weighted sensitivity norm (the H∞ norm of W·S):
 *
 *   ‖W·S‖∞ = sup_ω |W(jω)|·|S(jω)|,
 *
 * for a proper weight W(s) = num/den (dimensionless). ‖W·S‖∞ < 1 means |S(jω)| < 1/|W(jω)| at
 * every frequency: the sensitivity stays under the bound 1/|W| the weight describes. The common
 * preset is performanceWeight({ M, omegaB, A }) = (s/M + ωB)/(s + ωB·A): |S| at most A at low
 * frequency, at most M at high frequency, bandwidth about ωB. Computed on frequencyResponse's grid
 * joined with the weight's own pole and zero frequencies, peaks refined by golden section
 * (weightedSensitivityPeak). Throws a RangeError naming `weight` when none is given.
 *
 * References: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.8.2 (weighted sensitivity, eq. 2.104–2.105); K. Zhou, J. C. Doyle and K. Glover, Robust and
 * Optimal Control, Prentice Hall, 1996, §4.3 (H∞ norm as the peak gain).
 */
export function wsNorm(loop: LoopTransferFunction, weight: SensitivityWeight | undefined): number {
  if (weight === undefined) throw new RangeError('weight: wsNorm needs a sensitivity weight W(s) = { num, den } (the CLI spec also takes { "preset": "performance", "M", "omegaB", "A" })');
  const response = loopFrequencyResponse(loop);
  return weightedSensitivityPeak(loop, response.omega, weight, sensitivityTail(response.highFrequencyGain, loop.delay)).value;
}

export const wsNormCriterion: CriterionDefinition = {
  id: "wsNorm",
  kind: "frequency",
  label: "‖W·S‖∞",
  unit: "",
  description: "Peak over frequency of |W(jω)·S(jω)| for the weight W; below 1 means |S| < 1/|W| everywhere.",
  compute: () => NaN,
  computeLoop: (loop, options) => wsNorm(loop, options?.weight),
};
