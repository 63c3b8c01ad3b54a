import type { PreparedStepTest } from "./prepare-step-test.js";

/** Share of the samples after the step, at the end, on which the ramp is fitted. */
const RAMP_SHARE = 0.5;

/** An integrating-plus-dead-time estimate from the final ramp of a step response. */
export interface RampEstimate {
  /** Integrating gain k = slope/Δu [y/(u·s)]. */
  k: number;
  /** Dead time θ [s]: where the ramp line crosses the initial level, after the step (clipped at 0). */
  theta: number;
}

/**
 * The ramp the output of an integrating process settles into after an input step, by a least
 * squares line y ≈ a·t + b through the last half of the samples after the step:
 *
 *   k = a/Δu,   θ = −b/a − t_step   (y = k·Δu·(t − t_step − θ) on the ramp).
 *
 * Common practice for integrating processes (Seborg, Edgar, Mellichamp & Doyle, Process Dynamics
 * and Control, 4th ed., 2016, §7.2). Returns { ok: false, reason } when the output has no slope.
 */
export function rampEstimate(test: PreparedStepTest): ({ ok: true } & RampEstimate) | { ok: false; reason: string } {
  const { t, y, stepIndex, stepTime, stepSize } = test;
  const n = t.length;
  const from = n - Math.max(2, Math.round(RAMP_SHARE * (n - stepIndex)));
  const count = n - from;
  let st = 0;
  let sy = 0;
  for (let k = from; k < n; k++) {
    st += t[k];
    sy += y[k];
  }
  const tm = st / count;
  const ym = sy / count;
  let stt = 0;
  let sty = 0;
  for (let k = from; k < n; k++) {
    stt += (t[k] - tm) ** 2;
    sty += (t[k] - tm) * (y[k] - ym);
  }
  const slope = sty / stt;
  if (!(Math.abs(slope) > 0) || !Number.isFinite(slope)) return { ok: false, reason: "the output has no slope at the end of the test, so it does not look integrating" };
  const crossing = tm - ym / slope;
  return { ok: true, k: slope / stepSize, theta: Math.max(0, crossing - stepTime) };
}
