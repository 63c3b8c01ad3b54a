import { discretizeZohInputs } from "../linear-algebra/discretize-zoh-inputs.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant } from "../plants/plant.js";
import { gaussianNoise } from "../simulation/gaussian-noise.js";
import { divergenceBound } from "../simulation/loop-bound.js";
import type { LoopTrace } from "../simulation/loop-trace.js";
import { resolveScenario } from "../simulation/resolve-scenario.js";
import type { Scenario } from "../simulation/scenario.js";
import type { DiscretePid } from "./discrete-pid.js";
import { advanceDiscretePid, initialDiscretePidState, packDiscretePidState } from "./step-discrete-pid.js";

/** Relative tolerance within which a time counts as lying on the simulation grid. */
const GRID_TOLERANCE = 1e-9;

/**
 * The sampled loop of a linear plant and a discrete PID (its difference equations, exact or
 * rounded coefficients), under a scenario. The controller samples y every h = pid.sampleTime
 * seconds and holds u (zero-order hold); the plant is simulated exactly between samples on the
 * grid t_j = j·hs, hs = h/M, M = ⌈h/scenario.dt⌉ (so the trace is at least as fine as the
 * scenario asks and every sample instant lies on it):
 *
 *   x_{j+1} = Φ(hs) x_j + Φ(hs − φ)Γ(φ)·v_{j−m−1} + Γ(hs − φ)·v_{j−m},   v = u + d,
 *
 * the dead time θ = m·hs + φ (0 ≤ φ < hs) split exactly (modified z-transform; G. F. Franklin,
 * J. D. Powell and M. L. Workman, Digital Control of Dynamic Systems, 3rd ed., 1998, §4.3.4;
 * Φ, Γ by discretizeZohInputs, Van Loan 1978). The load step d enters the plant input before the
 * dead time; measurement noise is added to the sampled y. At a sample the controller sees
 * y = C x + D·v with the input held from before the sample (a plant with direct feedthrough is
 * sampled before the new u acts). The loop starts at rest (x = 0, r = y = u = 0 before t = 0)
 * and the setpoint steps at t = 0.
 *
 * The trace's u∞, y∞ are the sampled loop's steady state: with integral action y∞ = r and the
 * plant's input balances the load (u∞ = r/G(0) − d, or −d for an integrating plant); without,
 * u∞ = pr·r − py·y∞ with y∞ = G(0)(u∞ + d). A trace that leaves the divergence bound gets status
 * "diverged" and NaN samples from there on. Throws a RangeError naming the field for a bad plant
 * or scenario.
 */
export function simulateSampledLoop(plant: LinearPlant, pid: DiscretePid, scenario: Scenario): LoopTrace {
  const sc = resolveScenario(scenario);
  const model = linearPlantModel(plant);
  const { ss } = model;
  const h = pid.sampleTime;
  const perSample = Math.max(1, Math.ceil(h / sc.dt - GRID_TOLERANCE));
  const hs = h / perSample;
  const samples = Math.round(sc.horizon / hs) + 1;
  const t = new Float64Array(samples);
  for (let j = 0; j < samples; j++) t[j] = j * hs;
  const trace: LoopTrace = {
    t,
    r: new Float64Array(samples),
    y: new Float64Array(samples),
    u: new Float64Array(samples),
    e: new Float64Array(samples),
    uInfinity: NaN,
    y0: 0,
    stepSize: sc.setpoint,
    yInfinity: NaN,
    status: "ok",
  };
  const np = ss.n;
  const dr = sc.setpoint;
  const loadSize = sc.load ? sc.load.size : 0;

  // Dead time θ = m·hs + φ.
  const q = model.delay / hs;
  let m = Math.floor(q);
  let phi = model.delay - m * hs;
  if (Math.abs(q - Math.round(q)) <= GRID_TOLERANCE * Math.max(1, q)) {
    m = Math.round(q);
    phi = 0;
  }
  const direct = m === 0 && phi === 0;
  // Load switch at the plant, after the dead time.
  let loadIndex = samples;
  let loadOffset = 0;
  if (sc.load) {
    const ql = (sc.load.time + model.delay) / hs;
    if (Math.abs(ql - Math.round(ql)) <= GRID_TOLERANCE * Math.max(1, ql)) loadIndex = Math.round(ql);
    else {
      loadIndex = Math.ceil(ql);
      loadOffset = sc.load.time + model.delay - (loadIndex - 1) * hs;
    }
  }
  let pPhi: Float64Array = new Float64Array(0);
  let gFull: Float64Array = new Float64Array(0);
  let gNew: Float64Array = new Float64Array(0);
  let gOld: Float64Array = new Float64Array(np);
  let gLoad: Float64Array = new Float64Array(0);
  if (np > 0) {
    const full = discretizeZohInputs(ss.a, ss.b, np, 1, hs);
    pPhi = full.phi;
    gFull = full.gamma;
    gNew = gFull;
    if (phi > 0) {
      const tail = discretizeZohInputs(ss.a, ss.b, np, 1, hs - phi);
      const head = discretizeZohInputs(ss.a, ss.b, np, 1, phi);
      gNew = tail.gamma;
      gOld = new Float64Array(np);
      for (let i = 0; i < np; i++) for (let j = 0; j < np; j++) gOld[i] += tail.phi[i * np + j] * head.gamma[j];
    }
    if (loadOffset > 0) gLoad = discretizeZohInputs(ss.a, ss.b, np, 1, hs - loadOffset).gamma;
  }

  const bound = divergenceBound([dr, loadSize]);
  const noise = sc.noise ? gaussianNoise(sc.noise.seed, sc.noise.sd, samples) : null;
  const memory = packDiscretePidState(initialDiscretePidState(pid, 0, 0, 0));
  const hist = new Float64Array(samples);
  const held = (j: number): number => (j >= 0 ? hist[j] : 0);
  const x = new Float64Array(np);
  const xNext = new Float64Array(np);
  let u = 0;
  for (let j = 0; j < samples; j++) {
    const load = j >= loadIndex ? loadSize : 0;
    let cx = 0;
    for (let i = 0; i < np; i++) cx += ss.c[i] * x[i];
    const before = direct ? held(j - 1) + load : held(phi > 0 ? j - m - 1 : j - m) + load;
    if (j % perSample === 0) u = advanceDiscretePid(pid, memory, dr, cx + ss.d * before + (noise ? noise[j] : 0));
    const y = direct ? cx + ss.d * (u + load) : cx + ss.d * before;
    if (!(Math.abs(y) <= bound) || !Number.isFinite(u)) return diverged(trace, j, dr);
    trace.r[j] = dr;
    trace.y[j] = y;
    trace.u[j] = u;
    trace.e[j] = dr - y;
    hist[j] = u;
    if (j === samples - 1 || np === 0) continue;
    const vNew = held(j - m);
    const vOld = held(j - m - 1);
    for (let i = 0; i < np; i++) {
      let acc = gNew[i] * vNew + gOld[i] * vOld;
      if (j >= loadIndex) acc += gFull[i] * loadSize;
      else if (j + 1 === loadIndex && loadOffset > 0) acc += gLoad[i] * loadSize;
      for (let k = 0; k < np; k++) acc += pPhi[i * np + k] * x[k];
      xNext[i] = acc;
    }
    x.set(xNext);
    for (let i = 0; i < np; i++) if (!(Math.abs(x[i]) <= bound)) return diverged(trace, j + 1, dr);
  }
  const steady = sampledSteadyState(model.num, model.den, pid, dr, loadSize);
  trace.uInfinity = steady.u;
  trace.yInfinity = steady.y;
  return trace;
}

/** The steady state of the sampled loop (see simulateSampledLoop). */
function sampledSteadyState(num: readonly number[], den: readonly number[], pid: DiscretePid, r: number, d: number): { u: number; y: number } {
  const n0 = num[num.length - 1];
  const d0 = den[den.length - 1];
  const { pr, py, bi1, bi0 } = pid.coefficients;
  if (bi1 + bi0 !== 0) {
    if (d0 === 0) return { u: -d, y: r };
    return n0 === 0 ? { u: NaN, y: NaN } : { u: (r * d0) / n0 - d, y: r };
  }
  if (d0 === 0) return py === 0 ? { u: NaN, y: NaN } : { u: -d, y: (pr * r + d) / py };
  const g0 = n0 / d0;
  const y = (g0 * (pr * r + d)) / (1 + g0 * py);
  return { u: pr * r - py * y, y };
}

function diverged(trace: LoopTrace, from: number, r: number): LoopTrace {
  for (let k = from; k < trace.t.length; k++) {
    trace.r[k] = r;
    trace.y[k] = NaN;
    trace.u[k] = NaN;
    trace.e[k] = NaN;
  }
  trace.status = "diverged";
  return trace;
}
