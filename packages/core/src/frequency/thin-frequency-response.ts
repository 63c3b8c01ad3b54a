import type { FrequencyResponse } from "./frequency-response.js";

/** Most frequencies kept per curve: the adaptive grid thinned to about this many log-spaced points. */
export const MAX_FREQUENCY_POINTS = 600;
/**
 * The plotted band ends one decade above where |L| first stays below this level for good: beyond,
 * |S| = 1 and |T| = |L| to plotting accuracy (a strictly proper loop; common practice).
 */
export const PLOT_TAIL_GAIN = 1e-4;

/** Magnitudes of a thinned frequency response, JSON-ready (FrequencyDto without index and status). */
export interface ThinFrequencyResponse {
  omega: number[];
  /** |S(jω)|. */
  S: number[];
  /** |T(jω)|. */
  T: number[];
  /** 1/|W(jω)| when the response carries a weight. */
  invW?: number[];
}

/**
 * |S|, |T| (and 1/|W|) of a frequency response on a thinned grid for plotting:
 * 1. the band: from the first frequency up to one decade above the last ω where |L(jω)| ≥
 *    PLOT_TAIL_GAIN (beyond it |S| = 1 and |T| = |L| to plotting accuracy);
 * 2. in that band, the first grid point and then each point at least Δ = (ln ω_last − ln ω_0)/(N − 1)
 *    beyond the previous kept one in ln ω (N = maxPoints), plus the band's last point;
 * 3. the peaks of |S| and |T| in the band, so that the plotted maxima are the true Ms and Mt.
 * At most maxPoints + 3 points, in increasing ω. Common practice (log-spaced plotting grids).
 */
export function thinFrequencyResponse(response: FrequencyResponse, maxPoints = MAX_FREQUENCY_POINTS): ThinFrequencyResponse {
  if (!(Number.isInteger(maxPoints) && maxPoints >= 2)) throw new RangeError(`maxPoints must be a whole number ≥ 2, got ${String(maxPoints)}`);
  const { omega, S, T, L, weightMagnitude } = response;
  const n = omega.length;
  const mag = (c: { re: Float64Array; im: Float64Array }, i: number) => Math.hypot(c.re[i] as number, c.im[i] as number);
  // Last index where |L| ≥ PLOT_TAIL_GAIN, then one decade more.
  let last = n - 1;
  for (let i = n - 1; i >= 0; i--) {
    if (mag(L, i) >= PLOT_TAIL_GAIN) {
      last = i;
      break;
    }
  }
  const upper = (omega[last] as number) * 10;
  while (last < n - 1 && (omega[last + 1] as number) <= upper) last++;
  const lo = Math.log(omega[0] as number);
  const step = (Math.log(omega[last] as number) - lo) / (maxPoints - 1);
  const keep = new Set<number>([0, last]);
  let next = lo;
  for (let i = 0; i <= last; i++) {
    if (Math.log(omega[i] as number) >= next) {
      keep.add(i);
      next = Math.log(omega[i] as number) + step;
    }
  }
  let peakS = 0;
  let peakT = 0;
  for (let i = 0; i <= last; i++) {
    if (mag(S, i) > mag(S, peakS)) peakS = i;
    if (mag(T, i) > mag(T, peakT)) peakT = i;
  }
  keep.add(peakS).add(peakT);
  const indices = [...keep].sort((a, b) => a - b);
  const result: ThinFrequencyResponse = {
    omega: indices.map((i) => omega[i] as number),
    S: indices.map((i) => mag(S, i)),
    T: indices.map((i) => mag(T, i)),
  };
  if (weightMagnitude) result.invW = indices.map((i) => 1 / (weightMagnitude[i] as number));
  return result;
}
