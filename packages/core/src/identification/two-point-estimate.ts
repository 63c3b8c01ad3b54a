import type { PreparedStepTest } from "./prepare-step-test.js";

/** Fractions of the final change at which Smith's two times are read (Smith 1957). */
export const SMITH_LOW_FRACTION = 0.283;
export const SMITH_HIGH_FRACTION = 0.632;
/** τ = SMITH_TAU_FACTOR·(t63.2 − t28.3) (Smith 1957). */
export const SMITH_TAU_FACTOR = 1.5;
/** Share of the samples after the step, at the end, averaged for the final value. */
const FINAL_SHARE = 0.1;

/** A first-order-plus-dead-time estimate from two points of the step response. */
export interface TwoPointEstimate {
  /** Gain k = Δy∞/Δu [y/u]. */
  k: number;
  /** Time constant τ [s] and dead time θ [s] (θ clipped at 0). */
  tau: number;
  theta: number;
  /** Times after the step [s] at which the output first reaches 28.3 % and 63.2 % of its final change. */
  t283: number;
  t632: number;
  /** Final output change Δy∞ [y]: the mean of the last 10 % of the samples after the step. */
  finalChange: number;
}

/**
 * Smith's two-point method: with t28.3 and t63.2 the times after the step at which the output
 * first reaches 28.3 % and 63.2 % of its final change (linear interpolation between samples),
 *
 *   τ = 1.5·(t63.2 − t28.3),   θ = t63.2 − τ,   k = Δy∞/Δu.
 *
 * (For y = 1 − e^(−(t−θ)/τ) the two times are θ + τ/3 and θ + τ, taking 28.3 % ≈ 1 − e^(−1/3).)
 * Returns { ok: false, reason } when the output does not settle away from zero or never reaches
 * 63.2 % of its final change.
 * Reference: C. L. Smith, Digital Computer Process Control, Intext, 1972, after O. J. M. Smith,
 * "Close control of loops with dead time", Chemical Engineering Progress 53(5), 217–219, 1957;
 * Seborg, Edgar, Mellichamp & Doyle, Process Dynamics and Control, 4th ed., 2016, §7.2.
 */
export function twoPointEstimate(test: PreparedStepTest): ({ ok: true } & TwoPointEstimate) | { ok: false; reason: string } {
  const { t, y, stepIndex, stepTime, stepSize } = test;
  const n = t.length;
  const after = n - stepIndex;
  const tailCount = Math.max(1, Math.round(FINAL_SHARE * after));
  let finalChange = 0;
  for (let k = n - tailCount; k < n; k++) finalChange += y[k];
  finalChange /= tailCount;
  let peak = 0;
  for (let k = stepIndex; k < n; k++) peak = Math.max(peak, Math.abs(y[k]));
  if (!(Math.abs(finalChange) > 0) || Math.abs(finalChange) < 1e-12 * peak) {
    return { ok: false, reason: "the output does not settle away from its initial level, so the 28.3 % and 63.2 % times are undefined" };
  }
  const at283 = crossingTime(test, SMITH_LOW_FRACTION * finalChange);
  const at632 = crossingTime(test, SMITH_HIGH_FRACTION * finalChange);
  if (at283 === undefined || at632 === undefined) {
    return { ok: false, reason: "the output never reaches 63.2 % of its final change after the step" };
  }
  const t283 = at283 - stepTime;
  const t632 = at632 - stepTime;
  const tau = SMITH_TAU_FACTOR * (t632 - t283);
  if (!(tau > 0)) return { ok: false, reason: "the output reaches 28.3 % and 63.2 % of its change at the same time; the response is too fast for the sampling" };
  return { ok: true, k: finalChange / stepSize, tau, theta: Math.max(0, t632 - tau), t283, t632, finalChange };
}

/** The first time after the step at which y reaches `level` (same sign as the change), interpolated linearly. */
function crossingTime(test: PreparedStepTest, level: number): number | undefined {
  const { t, y, stepIndex } = test;
  const sign = level > 0 ? 1 : -1;
  for (let k = stepIndex; k < t.length; k++) {
    if (sign * y[k] >= sign * level) {
      if (k === 0) return t[0];
      const y0 = y[k - 1];
      const y1 = y[k];
      const f = y1 === y0 ? 1 : (level - y0) / (y1 - y0);
      return t[k - 1] + Math.min(1, Math.max(0, f)) * (t[k] - t[k - 1]);
    }
  }
  return undefined;
}
