import type { Complex } from "../linear-algebra/complex.js";
import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import { DELAY_PADE_ORDER, padeDelay } from "../plants/pade-delay.js";

/** Decades kept below the slowest and above the fastest feature frequency of the loop. */
export const SPAN_MARGIN_DECADES = 2;
/** Lightly damped roots get extra grid points at |Im p| + k·|Re p|, k = −HINT_WIDTHS…HINT_WIDTHS. */
export const HINT_WIDTHS = 3;
/** A root counts as lightly damped when |Re p| < LIGHT_DAMPING·|p| (ζ < 0.3). */
export const LIGHT_DAMPING = 0.3;

/** Where to look: the decade span and the frequencies that must be on the grid. */
export interface FrequencySpan {
  /** Lowest and highest frequency of the initial grid [rad/s], before the tail extension. */
  omegaMin: number;
  omegaMax: number;
  /** Frequencies [rad/s] where |L|, |S| or |T| can change fast: the feature frequencies below. */
  hints: number[];
}

/**
 * The decade span and grid hints of a loop L(s) = num/den·e^(−θs) (trimmed, proper), plus
 * optional extra rational factors (a sensitivity weight's num and den):
 *
 * feature frequencies = |p| of every non-zero root of num and den (open-loop zeros and poles), of
 * the closed-loop characteristic polynomial den + num (with e^(−θs) replaced by its [6/6] Padé
 * approximant when θ > 0: den·q(θs) + num·q(−θs)), of the extra factors, and 1/θ.
 * Span: [min feature / 10^SPAN_MARGIN_DECADES, max feature · 10^SPAN_MARGIN_DECADES]; a loop with
 * no feature (L constant) gets [10⁻², 10²]. Closed-loop poles set the scale of the crossovers and
 * of the peaks of |S| and |T| (a resonance peak sits near |Im p| of a lightly damped closed-loop
 * pair), which is why they are hints as well as range ends.
 *
 * Hints: |p| for every root, and for lightly damped complex roots (|Re p| < LIGHT_DAMPING·|p|) the
 * points |Im p| + k·|Re p|, k = −3…3, so a peak of width ~|Re p| cannot fall between grid points.
 *
 * References: the resonance of a lightly damped pair at ω ≈ |Im p| with half-power width ≈ 2|Re p|:
 * K. Ogata, Modern Control Engineering, 5th ed., 2010, §8-2; the Padé approximant: padeDelay.
 */
export function frequencySpan(num: readonly number[], den: readonly number[], delay: number, extra: readonly (readonly number[])[] = []): FrequencySpan {
  const roots: Complex[] = [];
  const addRoots = (p: readonly number[]) => {
    const q = trimLeadingZeros(p);
    if (q.length > 1) roots.push(...polynomialRoots(q));
  };
  addRoots(num);
  addRoots(den);
  if (delay > 0) {
    const pade = padeDelay(delay, DELAY_PADE_ORDER);
    addRoots(polynomialAdd(polynomialMultiply(den, pade.den), polynomialMultiply(num, pade.num)));
  } else {
    addRoots(polynomialAdd(den, num));
  }
  for (const p of extra) addRoots(p);

  const features = roots.map((p) => Math.hypot(p.re, p.im)).filter((size) => size > 0 && Number.isFinite(size));
  const hints = rootHints(roots);
  if (delay > 0) features.push(1 / delay);
  if (features.length === 0) return { omegaMin: 1e-2, omegaMax: 1e2, hints };
  const margin = 10 ** SPAN_MARGIN_DECADES;
  return { omegaMin: Math.min(...features) / margin, omegaMax: Math.max(...features) * margin, hints };
}

/**
 * Grid hints of a set of roots (see frequencySpan): |p| of every non-zero root, and
 * |Im p| + k·|Re p|, k = −HINT_WIDTHS…HINT_WIDTHS, for lightly damped complex roots.
 */
export function rootHints(roots: readonly Complex[]): number[] {
  const hints: number[] = [];
  for (const p of roots) {
    const size = Math.hypot(p.re, p.im);
    if (!(size > 0) || !Number.isFinite(size)) continue;
    hints.push(size);
    const wd = Math.abs(p.im);
    const sigma = Math.abs(p.re);
    if (wd > 0 && sigma < LIGHT_DAMPING * size) {
      for (let k = -HINT_WIDTHS; k <= HINT_WIDTHS; k++) {
        const w = wd + k * sigma;
        if (w > 0) hints.push(w);
      }
    }
  }
  return hints;
}
