import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Closed-loop bandwidth ωB [rad/s], defined from the sensitivity: the frequency where |S(jω)| first
 * crosses 1/√2 (−3 dB) from below. Up to ωB feedback attenuates disturbances by at least 3 dB.
 * Chosen over the |T|-based ωBT (where |T| first drops below 1/√2) because ωBT can be far above
 * the frequencies where feedback helps when Mt is large (Skogestad & Postlethwaite's argument);
 * for a well-damped loop ωB < ωc < ωBT. 0 when |S| ≥ 1/√2 already at the low end of the grid (no
 * frequency range where feedback helps by 3 dB, e.g. a low-gain loop without integral action);
 * Infinity when |S| never reaches 1/√2 (possible only for a biproper loop).
 *
 * Reference: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.4.5 (definition 2.1 of ωB and the comparison with ωc and ωBT).
 */
export function bandwidth(loop: LoopTransferFunction): number {
  return loopFrequencyResponse(loop).bandwidth;
}

export const bandwidthCriterion: CriterionDefinition = {
  id: "bandwidth",
  kind: "frequency",
  label: "Bandwidth ωB",
  unit: "rad/s",
  better: "larger",
  description: "Where |S(jω)| first rises through 1/√2 (−3 dB): feedback helps below it.",
  compute: () => NaN,
  computeLoop: (loop) => bandwidth(loop),
};
