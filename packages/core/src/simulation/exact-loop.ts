import { discretizeZohInputs } from "../linear-algebra/discretize-zoh-inputs.js";
import { type ContinuousClosedLoop, LOOP_INPUTS } from "./continuous-closed-loop.js";
import { gaussianNoise } from "./gaussian-noise.js";
import type { LoopTrace } from "./loop-trace.js";
import type { ResolvedScenario } from "./resolve-scenario.js";
import { setpointScoreKernel } from "./setpoint-score-kernel.js";

/** Relative tolerance within which an event time counts as lying on the grid. */
const GRID_TOLERANCE = 1e-9;

/**
 * Exact recurrence of a delay-free continuous linear loop without actuator limits (the
 * ContinuousClosedLoop z' = A_cl z + B_cl w), for inputs w = [Δr, d, n] that are constant over
 * each grid step:
 *
 *   z_{k+1} = Φ z_k + Γ w_k,   [Φ Γ; 0 I] = exp([A_cl B_cl; 0 0]·dt)   (Van Loan 1978),
 *
 * exact at the grid points for the setpoint and load steps. A load step at a time T off the grid
 * enters the step [t_k, t_{k+1}) containing it through Γ_d(t_{k+1} − T)·d (the input switches
 * inside the step; Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed., 1998,
 * §4.3.4). Measurement noise n_k is held over each step (its sample at t_k), so with noise the
 * loop is the continuous loop driven by a piecewise-constant noise signal.
 * Fills y, u, e, r of the trace; returns false (and fills NaN from there on) when |z| or |y|
 * passes `bound` or is not finite.
 */
export function runExactLoop(loop: ContinuousClosedLoop, sc: ResolvedScenario, trace: LoopTrace, bound: number): boolean {
  const { nz, uz, uw, yz, yw } = loop;
  const m = LOOP_INPUTS;
  const { dt, t } = sc;
  const samples = t.length;
  const step = nz > 0 ? discretizeZohInputs(loop.a, loop.b, nz, m, dt) : { phi: new Float64Array(0), gamma: new Float64Array(0) };
  const { phi, gamma } = step;
  const dr = sc.setpoint;
  const load = sc.load;
  const loadSize = load ? load.size : 0;
  // The grid index from which the load is on at t_k⁺, and the partial step before it.
  let loadIndex = samples;
  let partial: Float64Array | null = null;
  if (load) {
    const q = load.time / dt;
    const near = Math.round(q);
    if (Math.abs(q - near) <= GRID_TOLERANCE * Math.max(1, q)) loadIndex = near;
    else {
      loadIndex = Math.ceil(q);
      if (nz > 0 && loadIndex < samples) {
        const col = new Float64Array(nz);
        for (let i = 0; i < nz; i++) col[i] = loop.b[i * m + 1];
        partial = discretizeZohInputs(loop.a, col, nz, 1, loadIndex * dt - load.time).gamma;
      }
    }
  }
  const noise = sc.noise ? gaussianNoise(sc.noise.seed, sc.noise.sd, samples) : null;
  let z = new Float64Array(nz);
  let next = new Float64Array(nz);
  const { r, y, u, e } = trace;
  for (let k = 0; k < samples; k++) {
    const d = k >= loadIndex ? loadSize : 0;
    const n = noise ? noise[k] : 0;
    let us = uw[0] * dr + uw[1] * d + uw[2] * n;
    let ys = yw[0] * dr + yw[1] * d + yw[2] * n;
    for (let j = 0; j < nz; j++) {
      us += uz[j] * z[j];
      ys += yz[j] * z[j];
    }
    if (!(Math.abs(ys) <= bound)) {
      fillNaN(trace, k, dr);
      return false;
    }
    r[k] = dr;
    u[k] = us;
    y[k] = ys;
    e[k] = dr - ys;
    for (let i = 0; i < nz; i++) {
      let acc = gamma[i * m] * dr + gamma[i * m + 1] * d + gamma[i * m + 2] * n;
      for (let j = 0; j < nz; j++) acc += phi[i * nz + j] * z[j];
      next[i] = acc;
    }
    if (partial && k + 1 === loadIndex) for (let i = 0; i < nz; i++) next[i] += partial[i] * loadSize;
    const swap = z;
    z = next;
    next = swap;
  }
  return true;
}

function fillNaN(trace: LoopTrace, from: number, dr: number): void {
  for (let k = from; k < trace.t.length; k++) {
    trace.r[k] = dr;
    trace.y[k] = NaN;
    trace.u[k] = NaN;
    trace.e[k] = NaN;
  }
}

/** Criteria the scores-only path accumulates inside the recurrence. */
export const FAST_CRITERIA = ["iae", "ise", "itae", "effort"] as const;
export type FastCriterionId = (typeof FAST_CRITERIA)[number];

/**
 * Scores-only twin of runExactLoop for a setpoint step without load or noise: the same recurrence,
 * accumulating IAE, ISE, ITAE and effort by the trapezoidal rule exactly as the trace criteria do
 * (same samples, same order of operations up to rounding), without storing a trace; the recurrence
 * runs in an unrolled kernel (setpointScoreKernel).
 * Writes [iae, ise, itae, effort] into `out`; returns false when the loop left `bound`.
 */
export function scoreExactSetpointLoop(loop: ContinuousClosedLoop, dt: number, samples: number, dr: number, uInfinity: number, bound: number, out: Float64Array): boolean {
  const { nz, uz, uw, yz, yw } = loop;
  const m = LOOP_INPUTS;
  const u0 = uw[0] * dr;
  const y0 = yw[0] * dr;
  if (nz === 0) {
    const ys = y0;
    if (!(Math.abs(ys) <= bound)) return false;
    const e = dr - ys;
    const T = (samples - 1) * dt;
    out[0] = Math.abs(e) * T;
    out[1] = e * e * T;
    out[2] = (Math.abs(e) * T * T) / 2;
    out[3] = (u0 - uInfinity) * (u0 - uInfinity) * T;
    return true;
  }
  const { phi, gamma } = discretizeZohInputs(loop.a, loop.b, nz, m, dt);
  const g = new Float64Array(nz);
  for (let i = 0; i < nz; i++) g[i] = gamma[i * m] * dr;
  return setpointScoreKernel(nz)(phi, g, uz, yz, u0, y0, dr, uInfinity, dt, samples, bound, out);
}
