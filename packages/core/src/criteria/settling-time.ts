import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { assertStepLevels, stepReference } from "./step-reference.js";

/** Default half-width of the settling band: 2 % of the output change. */
export const DEFAULT_SETTLING_BAND = 0.02;

/**
 * Settling time of a step response: the last time the output is outside the band
 * |y − y_f| ≤ band·|y_f − y0| around its final value y_f,
 *
 *   t_s = the time after the last sample k with |y_k − y_f| > band·|y_f − y0| at which |y − y_f|
 *         falls to the band edge, by linear interpolation between samples k and k + 1.
 *
 * 0 when every sample, y[0] = y(0⁺) included, is inside the band. Infinity when the last sample
 * y[N] is still outside: not settled within the horizon. Only the horizon is inspected; a loop that
 * leaves the band after T is not seen, so choose a horizon well beyond the expected t_s.
 *
 * t: time grid [s]; y: output [y]; y0, target: output before the step and final value [y];
 * band: half-width as a fraction of |y_f − y0|, in (0, 1), default 0.02. Result [s].
 *
 * References: G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, 4th ed., Prentice Hall, 2002, §3.4 (settling time, band of a few percent of the final
 * value); K. Ogata, Modern Control Engineering, 5th ed., 2010, §5-3 (2 % or 5 % criterion).
 */
export function settlingTime(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  y0: number,
  target: number,
  band: number = DEFAULT_SETTLING_BAND,
): number {
  assertSameLength(t, { y });
  assertStepLevels(y0, target);
  assertBand(band);
  const width = band * Math.abs(target - y0);
  const last = y.length - 1;
  let k = last;
  while (k >= 0 && Math.abs(y[k] - target) <= width) k--;
  if (k < 0) return t[0];
  const d0 = y[k] - target; // outside: |d0| > width, or NaN
  if (Number.isNaN(d0)) return NaN;
  if (k === last) return Infinity;
  const d1 = y[k + 1] - target; // inside
  const edge = Math.sign(d0) * width;
  return t[k] + ((t[k + 1] - t[k]) * (d0 - edge)) / (d0 - d1);
}

function assertBand(band: number): void {
  if (typeof band !== "number" || !Number.isFinite(band) || band <= 0 || band >= 1) {
    throw new RangeError(`settlingBand must be a number in (0, 1), got ${String(band)}`);
  }
}

export const settlingTimeCriterion: CriterionDefinition = {
  id: "settlingTime",
  kind: "time",
  label: "Settling time",
  unit: "s",
  description: "Last time the output is outside a band (default 2 %) around its final value, interpolated; ∞ if not settled.",
  compute: (trace, options = {}) => {
    const band = options.settlingBand ?? DEFAULT_SETTLING_BAND;
    assertBand(band);
    const ref = stepReference(trace);
    return ref === null ? NaN : settlingTime(trace.t, trace.y, ref.y0, ref.target, band);
  },
};
