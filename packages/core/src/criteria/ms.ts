import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Maximum sensitivity, the largest amplification of disturbances by feedback:
 *
 *   Ms = max_ω |S(jω)| = max_ω 1/|1 + L(jω)|,
 *
 * the inverse of the shortest distance from the Nyquist curve L(jω) to −1 (dimensionless; typical
 * designs 1.2–2). Computed on frequencyResponse's refined grid, peak by golden section, with the
 * high-frequency limit included (1 for a strictly proper loop). Meaningful for a stable loop only.
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2 (maximum
 * sensitivity, eq. 4.9); S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd
 * ed., 2005, §2.4.3 (peak of |S|).
 */
export function ms(loop: LoopTransferFunction): number {
  return loopFrequencyResponse(loop).sensitivityPeak.value;
}

export const msCriterion: CriterionDefinition = {
  id: "ms",
  kind: "frequency",
  label: "Ms",
  unit: "",
  description: "Maximum sensitivity max|S(jω)| = 1/(shortest distance from L(jω) to −1).",
  compute: () => NaN,
  computeLoop: (loop) => ms(loop),
};
