import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";
import { DEFAULT_SETTLING_BAND } from "./settling-time.js";

/**
 * Load-recovery time: how long the loop takes to recover from a load step at the plant input at
 * t_l. With the final error e_f = r_N − y∞ (0 under integral action, the static offset otherwise)
 * and the peak deviation after the load D = max_{t_k ≥ t_l} |e_k − e_f|,
 *
 *   t_rec = t* − t_l,   t* = the time after the last sample k (t_k ≥ t_l) with |e_k − e_f| > β·D at
 *           which |e − e_f| falls to β·D, by linear interpolation between samples k and k + 1,
 *
 * i.e. the settling time of the load response, its band β (default 2 %, the settling band) taken
 * relative to the response's own peak deviation, since a load response starts and ends at the same
 * level and has no step size to scale by. It includes the plant's dead time (the load needs it too).
 *
 * 0 when the load does not move the error (D = 0). Infinity when the last sample is still outside
 * the band (not recovered within the horizon). NaN when the trace has no load step, diverged, or
 * y∞ is not finite.
 *
 * t, e: time grid [s] and error [y]; loadTime t_l [s]; finalError e_f [y]; band β in (0, 1).
 * Result [s].
 * Reference: common practice — the settling time of a load-disturbance response, as used to compare
 * load rejection of tuning rules (the band relative to the peak error is our choice, stated here).
 */
export function loadRecoveryTime(t: ArrayLike<number>, e: ArrayLike<number>, loadTime: number, finalError: number, band: number = DEFAULT_SETTLING_BAND): number {
  assertSameLength(t, { e });
  if (!Number.isFinite(loadTime) || !Number.isFinite(finalError)) return NaN;
  assertBand(band);
  const n = t.length;
  let first = 0;
  while (first < n && t[first] < loadTime - 1e-9 * Math.max(1, Math.abs(loadTime))) first++;
  if (first >= n) return NaN;
  let peak = 0;
  for (let k = first; k < n; k++) {
    const d = Math.abs(e[k] - finalError);
    if (Number.isNaN(d)) return NaN;
    if (d > peak) peak = d;
  }
  if (peak === 0) return 0;
  const width = band * peak;
  let k = n - 1;
  while (k >= first && Math.abs(e[k] - finalError) <= width) k--;
  if (k < first) return 0;
  if (k === n - 1) return Infinity;
  const d0 = Math.abs(e[k] - finalError);
  const d1 = Math.abs(e[k + 1] - finalError);
  const crossing = t[k] + ((t[k + 1] - t[k]) * (d0 - width)) / (d0 - d1);
  return Math.max(0, crossing - loadTime);
}

export const loadRecoveryTimeCriterion: CriterionDefinition = {
  id: "loadRecoveryTime",
  kind: "time",
  label: "Load recovery",
  unit: "s",
  description: "Time after the load step until the error stays within a band (default 2 %) of its peak deviation around its final value; ∞ if not recovered.",
  compute: (trace, options = {}) => {
    const band = options.settlingBand ?? DEFAULT_SETTLING_BAND;
    assertBand(band);
    const load = trace.load;
    if (!load || load.size === 0 || isDivergedTrace(trace) || !Number.isFinite(trace.yInfinity)) return NaN;
    const last = trace.t.length - 1;
    return loadRecoveryTime(trace.t, trace.e, load.time, trace.r[last] - trace.yInfinity, band);
  },
};

function assertBand(band: number): void {
  if (typeof band !== "number" || !Number.isFinite(band) || band <= 0 || band >= 1) {
    throw new RangeError(`settlingBand must be a number in (0, 1), got ${String(band)}`);
  }
}
