import { loopFrequencyResponse } from "../frequency/frequency-response-cache.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionDefinition } from "./criterion-definition.js";

/**
 * Gain crossover frequency ωc [rad/s]: the frequency where |L(jω)| first crosses 1 from above
 * (the lowest falling crossing; the rising ones of a conditionally stable loop are skipped),
 * a measure of the loop's speed of response. NaN ("does not apply") when |L| never falls through 1.
 * Located by bisection on ln ω to a relative 1e-13 (frequencyResponse).
 *
 * References: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.4.5 (crossover frequency ωc); K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006,
 * §4.2 (gain crossover frequency ωgc).
 */
export function crossoverFrequency(loop: LoopTransferFunction): number {
  const response = loopFrequencyResponse(loop);
  const k = response.gainCrossoverFalling.indexOf(true);
  return k < 0 ? NaN : response.gainCrossovers[k];
}

export const crossoverFrequencyCriterion: CriterionDefinition = {
  id: "crossoverFrequency",
  kind: "frequency",
  label: "Crossover ωc",
  unit: "rad/s",
  better: "larger",
  description: "Gain crossover frequency: where |L(jω)| first falls through 1.",
  compute: () => NaN,
  computeLoop: (loop) => crossoverFrequency(loop),
};
