import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Maximum complementary sensitivity, the resonance peak of the closed loop from setpoint to output:
 *
 *   Mt = max_ω |T(jω)| = max_ω |L(jω)|/|1 + L(jω)|
 *
 * (dimensionless; for the second-order prototype L = ωn²/(s(s + 2ζωn)), Mt = 1/(2ζ√(1 − ζ²)) when
 * ζ < 1/√2). Computed like ms. Meaningful for a stable loop only.
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2 (Mt); S. Skogestad
 * and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005, §2.4.3; K. Ogata, Modern
 * Control Engineering, 5th ed., 2010, §8-2 (resonant peak Mr).
 */
export function mt(loop: LoopTransferFunction): number {
  return loopFrequencyResponse(loop).complementaryPeak.value;
}

export const mtCriterion: CriterionDefinition = {
  id: "mt",
  kind: "frequency",
  label: "Mt",
  unit: "",
  description: "Maximum complementary sensitivity max|T(jω)| = max|L/(1 + L)|, the closed-loop resonance peak.",
  compute: () => NaN,
  computeLoop: (loop) => mt(loop),
};
