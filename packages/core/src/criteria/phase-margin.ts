import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import { evaluateLoop, type LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Phase margin [degrees]: the extra phase lag at the gain crossover that would bring the Nyquist
 * curve to −1,
 *
 *   PM = min_k (180° + ∠L(jωc,k))   over all gain crossovers ωc,k (|L(jωc)| = 1),
 *
 * with ∠L + 180° taken as the angle from −1 to L(jωc) on the unit circle, in (−180°, 180°]
 * (positive when L passes below −1, as for a stable loop without open-loop RHP poles), so no
 * phase unwrapping is needed. The smallest over all crossovers. Infinity when |L| never crosses 1
 * (|L| < 1 or > 1 at every frequency, so no added phase lag alone can bring L(jω) onto −1).
 *
 * Example: L = 1/(s(s + 1)) has ωc = √((√5 − 1)/2) ≈ 0.786 rad/s and PM = 90° − atan ωc ≈ 51.8°.
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2 (phase margin
 * φm, eq. 4.8); S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.4.3, eq. (2.34).
 */
export function phaseMargin(loop: LoopTransferFunction): number {
  let margin = Infinity;
  for (const omega of loopFrequencyResponse(loop).gainCrossovers) {
    const l = evaluateLoop(loop, omega);
    // arg(L/(−1)) = arg(−L), in (−π, π].
    margin = Math.min(margin, (Math.atan2(-l.im, -l.re) * 180) / Math.PI);
  }
  return margin;
}

export const phaseMarginCriterion: CriterionDefinition = {
  id: "phaseMargin",
  kind: "frequency",
  label: "Phase margin",
  unit: "°",
  better: "larger",
  description: "Smallest 180° + ∠L(jωc) over the gain crossovers (|L| = 1); Infinity when |L| never crosses 1.",
  compute: () => NaN,
  computeLoop: (loop) => phaseMargin(loop),
};
