import { assertValidLoop } from "../stability/assert-valid-loop.js";
import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import { evaluateLoop, type LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Gain margin (linear, not dB): the factor by which the loop gain may grow before the Nyquist
 * curve reaches −1,
 *
 *   GM = min_k 1/|L(jω₁₈₀,k)|   over all phase crossovers ω₁₈₀,k (L(jω) real and negative),
 *
 * the smallest over all crossovers, i.e. the one where |L| is largest (Skogestad &
 * Postlethwaite's rule for several crossings; for a conditionally stable loop this can be < 1).
 * With dead time and a biproper rational part (L → D·e^(−jωθ), D ≠ 0), the phase crossovers go on
 * for ever and 1/|D| is included. Infinity when there is no phase crossover (e.g. L = k/(s + 1)²,
 * whose phase only tends to −180°). Phase crossovers with |L| < 10⁻³ are not tracked
 * (PHASE_CROSSOVER_MIN_GAIN): a margin above 1000 (60 dB) is reported as Infinity.
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2 (gain margin
 * gm, eq. 4.7); S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.4.3, eq. (2.33).
 */
export function gainMargin(loop: LoopTransferFunction): number {
  const response = loopFrequencyResponse(loop);
  let margin = Infinity;
  for (const omega of response.phaseCrossovers) {
    const l = evaluateLoop(loop, omega);
    margin = Math.min(margin, 1 / Math.hypot(l.re, l.im));
  }
  const d = response.highFrequencyGain;
  if (assertValidLoop(loop).delay > 0 && d !== 0) margin = Math.min(margin, 1 / Math.abs(d));
  return margin;
}

export const gainMarginCriterion: CriterionDefinition = {
  id: "gainMargin",
  kind: "frequency",
  label: "Gain margin",
  unit: "",
  better: "larger",
  description: "Smallest 1/|L(jω)| over the phase crossovers (L real and negative); Infinity when there is none.",
  compute: () => NaN,
  computeLoop: (loop) => gainMargin(loop),
};
