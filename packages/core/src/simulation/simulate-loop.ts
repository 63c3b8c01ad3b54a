import { discretizeZoh } from "../linear-algebra/discretize-zoh.js";
import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { pidStateSpace } from "../controllers/pid-state-space.js";
import type { PidController } from "../controllers/pid.js";
import { normalizeTransferFunction } from "../plants/normalize-transfer-function.js";
import type { Plant } from "../plants/plant.js";
import { transferFunctionToStateSpace } from "../plants/transfer-function-to-state-space.js";
import { IllPosedLoopError, isWellPosedLoop } from "./ill-posed-loop-error.js";
import type { LoopTrace, SetpointStepScenario } from "./loop-trace.js";
import { steadyStateInput, steadyStateOutput } from "./steady-state-input.js";
import { timeGrid } from "./time-grid.js";

/**
 * Unity-feedback loop of a plant G(s)·e^(−θs) and a PID C(s) = kp + ki/s + kd·s/(tf·s + 1)
 * after a unit setpoint step r(t) = 1, t ≥ 0, from rest, on the grid t_k = k·dt, k = 0…N,
 * N = round(horizon/dt):  e = r − y,  u = C e,  y = G u(· − θ).
 *
 * Delay-free plants (and θ < dt/2, see below): exact. With plant (A_p, B_p, C_p, D_p) and
 * controller (A_c, B_c, C_c, D_c) (see transferFunctionToStateSpace, pidStateSpace), the algebraic
 * loop through the feedthroughs is solved, k = 1/(1 + D_c·D_p):
 *
 *   u = k·(D_c (r − C_p x) + C_c x_c),   y = C_p x + D_p u,
 *   d/dt [x; x_c] = A_cl [x; x_c] + B_cl r,
 *   A_cl = ⎡A_p − k D_c B_p C_p    k B_p C_c        ⎤,   B_cl = k ⎡B_p D_c⎤,
 *          ⎣−k B_c C_p             A_c − k D_p B_c C_c⎦            ⎣B_c    ⎦
 *
 * and since r is constant for t ≥ 0, z_{k+1} = Φ z_k + Γ with [Φ Γ; 0 1] = exp([A_cl B_cl; 0 0]·dt)
 * is exact at the grid points (Van Loan 1978). Throws IllPosedLoopError when 1 + D_c·D_p = 0.
 *
 * Plants with dead time θ ≥ dt/2: plant and controller are each discretised by zero-order hold
 * on the grid and the plant input passes a delay line of d = round(θ/dt) samples:
 *
 *   y_k = C_p x_k + D_p u_{k−d},  e_k = 1 − y_k,  u_k = C_c x_{c,k} + D_c e_k,
 *   x_{k+1} = Φ_p x_k + Γ_p u_{k−d},  x_{c,k+1} = Φ_c x_{c,k} + Γ_c e_k   (u_j = 0 for j < 0).
 *
 * This is the loop as a sampled-data loop with period dt: the dead time is rounded to the grid
 * (an error of at most dt/2) and the controller sees e held over each step (an O(dt) error).
 * A dead time below dt/2 rounds to d = 0 and the loop is simulated as delay-free.
 *
 * Value at t = 0: every sample k = 0 is the right limit t → 0⁺, r[0] = 1. From rest, x = 0 and
 * x_c = 0, so u[0] = u(0⁺) = D_c/(1 + D_c·D_p); for a strictly proper plant (D_p = 0)
 * u[0] = kp + kd/tf: the proportional kick kp·1 plus the filtered-derivative kick kd/tf·1,
 * which then decays with time constant tf. With dead time, u[0] = D_c = kp + kd/tf too.
 * y[0] = D_p·u[0] (0 with dead time or a strictly proper plant), e[0] = 1 − y[0].
 * When dt is not small against tf, the grid does not resolve that derivative kick and criteria
 * integrated on the grid (effort) over-weight it: choose dt ≲ tf for accurate effort figures.
 *
 * Per-step work allocates nothing: state vectors are preallocated Float64Arrays.
 * References: C. F. Van Loan, IEEE Trans. Automatic Control 23(3), 1978; K. J. Åström and
 * B. Wittenmark, Computer-Controlled Systems, 3rd ed., 1997, §2.3 (ZOH sampling) and §2.3 (delays).
 */
export function simulateLoop(plant: Plant, controller: PidController, scenario: SetpointStepScenario): LoopTrace {
  if (scenario === null || typeof scenario !== "object" || scenario.kind !== "setpoint-step") {
    throw new RangeError('scenario.kind must be "setpoint-step"');
  }
  const tfp = normalizeTransferFunction(plant);
  const plantSs = transferFunctionToStateSpace(tfp);
  const ctrlSs = pidStateSpace(controller);
  const t = timeGrid(scenario.horizon, scenario.dt);
  const n = t.length;
  const trace: LoopTrace = {
    t,
    r: new Float64Array(n).fill(1),
    y: new Float64Array(n),
    u: new Float64Array(n),
    e: new Float64Array(n),
    uInfinity: steadyStateInput(plant, controller),
    y0: 0,
    stepSize: 1,
    yInfinity: steadyStateOutput(plant, controller),
    status: "ok",
  };
  const delaySteps = Math.round(tfp.delay / scenario.dt);
  if (delaySteps === 0) runDelayFree(plantSs, ctrlSs, scenario.dt, trace);
  else runWithDelayLine(plantSs, ctrlSs, scenario.dt, delaySteps, trace);
  return trace;
}

function runDelayFree(p: SisoStateSpace, c: SisoStateSpace, dt: number, trace: LoopTrace): void {
  if (!isWellPosedLoop(c.d, p.d)) throw new IllPosedLoopError(c.d, p.d);
  const k = 1 / (1 + c.d * p.d);
  const np = p.n;
  const nc = c.n;
  const nz = np + nc;
  const a = new Float64Array(nz * nz);
  const b = new Float64Array(nz);
  for (let i = 0; i < np; i++) {
    for (let j = 0; j < np; j++) a[i * nz + j] = p.a[i * np + j] - k * c.d * p.b[i] * p.c[j];
    for (let j = 0; j < nc; j++) a[i * nz + np + j] = k * p.b[i] * c.c[j];
    b[i] = k * p.b[i] * c.d;
  }
  for (let i = 0; i < nc; i++) {
    for (let j = 0; j < np; j++) a[(np + i) * nz + j] = -k * c.b[i] * p.c[j];
    for (let j = 0; j < nc; j++) a[(np + i) * nz + np + j] = c.a[i * nc + j] - k * p.d * c.b[i] * c.c[j];
    b[np + i] = k * c.b[i];
  }
  // Output rows for r = 1: u = uRow·z + uConst, y = yRow·z + yConst.
  const uRow = new Float64Array(nz);
  const yRow = new Float64Array(nz);
  for (let j = 0; j < np; j++) uRow[j] = -k * c.d * p.c[j];
  for (let j = 0; j < nc; j++) uRow[np + j] = k * c.c[j];
  const uConst = k * c.d;
  for (let j = 0; j < nz; j++) yRow[j] = (j < np ? p.c[j] : 0) + p.d * uRow[j];
  const yConst = p.d * uConst;

  const closed: SisoStateSpace = { n: nz, a, b, c: yRow, d: yConst };
  const { phi, gamma } = nz > 0 ? discretizeZoh(closed, dt) : { phi: a, gamma: b };
  let z = new Float64Array(nz);
  let next = new Float64Array(nz);
  const { u, y, e } = trace;
  const samples = u.length;
  for (let s = 0; s < samples; s++) {
    let us = uConst;
    let ys = yConst;
    for (let j = 0; j < nz; j++) {
      us += uRow[j] * z[j];
      ys += yRow[j] * z[j];
    }
    u[s] = us;
    y[s] = ys;
    e[s] = 1 - ys;
    for (let i = 0; i < nz; i++) {
      let acc = gamma[i];
      for (let j = 0; j < nz; j++) acc += phi[i * nz + j] * z[j];
      next[i] = acc;
    }
    const swap = z;
    z = next;
    next = swap;
  }
}

function runWithDelayLine(p: SisoStateSpace, c: SisoStateSpace, dt: number, delaySteps: number, trace: LoopTrace): void {
  const np = p.n;
  const nc = c.n;
  const pd = np > 0 ? discretizeZoh(p, dt) : { phi: p.a, gamma: p.b };
  const cd = nc > 0 ? discretizeZoh(c, dt) : { phi: c.a, gamma: c.b };
  let x = new Float64Array(np);
  let xNext = new Float64Array(np);
  let xc = new Float64Array(nc);
  let xcNext = new Float64Array(nc);
  const line = new Float64Array(delaySteps);
  const { u, y, e } = trace;
  const samples = u.length;
  for (let s = 0; s < samples; s++) {
    const slot = s % delaySteps;
    const delayed = line[slot];
    let ys = p.d * delayed;
    for (let j = 0; j < np; j++) ys += p.c[j] * x[j];
    const es = 1 - ys;
    let us = c.d * es;
    for (let j = 0; j < nc; j++) us += c.c[j] * xc[j];
    y[s] = ys;
    e[s] = es;
    u[s] = us;
    line[slot] = us;
    for (let i = 0; i < np; i++) {
      let acc = pd.gamma[i] * delayed;
      for (let j = 0; j < np; j++) acc += pd.phi[i * np + j] * x[j];
      xNext[i] = acc;
    }
    for (let i = 0; i < nc; i++) {
      let acc = cd.gamma[i] * es;
      for (let j = 0; j < nc; j++) acc += cd.phi[i * nc + j] * xc[j];
      xcNext[i] = acc;
    }
    const sx = x;
    x = xNext;
    xNext = sx;
    const sc = xc;
    xc = xcNext;
    xcNext = sc;
  }
}
