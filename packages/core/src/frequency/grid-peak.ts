import { goldenSectionMaximum } from "./golden-section-maximum.js";

/** A peak of a magnitude over frequency: where and how high. */
export interface FrequencyPeak {
  /** ω [rad/s] of the peak; Infinity when the supremum is the high-frequency limit. */
  omega: number;
  /** The peak value (a magnitude, linear). */
  value: number;
}

/** Local maxima of at least this fraction of the largest sample are refined. */
export const REFINE_FRACTION = 0.5;
/** Golden-section tolerance in ln ω (relative frequency 1e-10). */
export const PEAK_TOLERANCE = 1e-10;
/** At most this many local maxima are refined (largest first). */
export const MAX_REFINED_PEAKS = 64;

/**
 * The largest value of a magnitude f(ω) from its samples on a frequency grid, refined: every local
 * maximum i of the samples (f_i ≥ f_{i−1}, f_i ≥ f_{i+1}) of at least REFINE_FRACTION of the
 * largest sample is searched by golden section on ln ω over [ω_{i−1}, ω_{i+1}] to PEAK_TOLERANCE
 * (see goldenSectionMaximum); the first and last samples count as they are. The grid must be fine
 * enough that each peak is unimodal between the neighbours of its best sample (frequencyResponse
 * builds it so). Returns the best value found and its frequency.
 *
 * omega: ascending, > 0; values: f at those frequencies; f: the same magnitude at any ω.
 */
export function gridPeak(omega: ArrayLike<number>, values: ArrayLike<number>, f: (omega: number) => number): FrequencyPeak {
  const n = omega.length;
  let best: FrequencyPeak = { omega: NaN, value: -Infinity };
  for (let i = 0; i < n; i++) if (values[i] > best.value) best = { omega: omega[i], value: values[i] };
  if (n < 3) return best;
  const candidates: number[] = [];
  const floor = REFINE_FRACTION * best.value;
  for (let i = 1; i < n - 1; i++) {
    if (values[i] >= values[i - 1] && values[i] >= values[i + 1] && values[i] >= floor) candidates.push(i);
  }
  candidates.sort((i, j) => values[j] - values[i]);
  const fx = (x: number) => f(Math.exp(x));
  for (const i of candidates.slice(0, MAX_REFINED_PEAKS)) {
    const peak = goldenSectionMaximum(fx, Math.log(omega[i - 1]), Math.log(omega[i + 1]), values[i - 1], values[i + 1], PEAK_TOLERANCE);
    if (peak.value > best.value) best = { omega: Math.exp(peak.x), value: peak.value };
  }
  return best;
}
