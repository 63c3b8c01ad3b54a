import type { AntiWindup } from "../controllers/controller.js";
import type { ControllerRealization } from "../controllers/controller-realization.js";
import { discretizeZohInputs } from "../linear-algebra/discretize-zoh-inputs.js";
import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import type { ActuatorLimits } from "../plants/actuator-limits.js";
import type { NonlinearPlantModel } from "../plants/nonlinear-plant-model.js";
import { DormandPrince } from "./dormand-prince.js";
import { gaussianNoise } from "./gaussian-noise.js";
import type { LoopTrace } from "./loop-trace.js";
import type { ResolvedScenario } from "./resolve-scenario.js";
import { stateNoise } from "./state-noise.js";

/** Relative tolerance within which a time counts as lying on the grid. */
const GRID_TOLERANCE = 1e-9;

/** The plant of a grid loop: a linear realisation, or a compiled nonlinear model. */
export type GridPlant = { kind: "linear"; ss: SisoStateSpace } | { kind: "nonlinear"; model: NonlinearPlantModel };

/** Everything the grid loop needs besides the scenario. */
export interface GridLoopConfig {
  plant: GridPlant;
  controller: ControllerRealization;
  /** Controller sample time [s]; undefined: updated every dt by ZOH (first order; simulateLoop uses runJointLoop instead). */
  sampleTime: number | undefined;
  antiWindup: AntiWindup;
  limits: ActuatorLimits | undefined;
  /** Dead time θ [s] ≥ 0 on the plant input. */
  delay: number;
}

/**
 * The loop of a sampled controller (zero-order hold) on the grid t_k = k·dt, with any plant, dead
 * time, actuator limits and noise. Between controller updates the plant input is piecewise
 * constant, so the plant is advanced exactly for its held input (linear: ZOH discretisation;
 * nonlinear: Dormand–Prince 5(4) at tight tolerance) — so the sampled loop is exact up to that integrator's
 * tolerance at any dt. (Continuous controllers with a nonlinear
 * plant, limits or dead time run on the joint loop, runJointLoop.) Per step k:
 *
 * 1. y_k from the plant state and its input at t_k⁺ (a plant with D ≠ 0 and no dead time closes
 *    the algebraic loop through D before the limits are applied; a nonlinear output that depends on
 *    u sees the input of the previous step);
 * 2. at controller updates only — the grid step nearest each multiple j·Ts of the sample time,
 *    round(j·Ts/dt) (every step when no sample time is given) — the controller output
 *    u = u_op + C_c x_c + D_r Δr + D_y (y + n − y0) + K_x (x − x_init + n_x) (n_x: stateNoise),
 *    then saturation to [min, max] and the rate limit (the held value moves by at most rate·h per
 *    update of period h), then the controller state by its exact ZOH discretisation at h = Ts;
 *    between updates u is held;
 * 3. anti-windup on the integral state x_i when the actuator limits: back-calculation adds
 *    (u_act − u)/(ki·Tt) to x_i' (Åström & Murray, Feedback Systems, 2008, §10.4; Åström &
 *    Hägglund, Advanced PID Control, 2006, §3.5), conditional integration keeps x_i when the
 *    actuator is limited and the error would drive it further (ki·e·(u − u_act) > 0, same source);
 * 4. the plant over [t_k, t_{k+1}) with its piecewise-constant input. The dead time θ = m·dt + φ,
 *    0 ≤ φ < dt, is a delay line of m samples plus a fractional part applied exactly: over the step
 *    the plant sees u_{k−m−1} for φ and u_{k−m} for dt − φ, so for a linear plant
 *      x_{k+1} = Φ(dt) x_k + Φ(dt − φ)Γ(φ) u_{k−m−1} + Γ(dt − φ) u_{k−m}
 *    (the modified z-transform split, Franklin, Powell & Workman, Digital Control of Dynamic
 *    Systems, 3rd ed., 1998, §4.3.4), exact for the held input. The load step enters the plant
 *    input (after the limits, before the dead time) and is switched inside a step exactly the same
 *    way. Nonlinear plants are integrated over each piece with Dormand–Prince 5(4) (DormandPrince).
 *    Inputs before t = 0 are the operating input u_op.
 * Divergence: any |y| or |x_i| beyond `bound` or not finite stops the loop; the rest of the trace is
 * NaN and the function returns false.
 */
export function runGridLoop(config: GridLoopConfig, sc: ResolvedScenario, trace: LoopTrace, bound: number): boolean {
  const { plant, controller: c, limits, antiWindup } = config;
  const { dt, t } = sc;
  const samples = t.length;
  const nonlinear = plant.kind === "nonlinear" ? plant.model : null;
  const ss = plant.kind === "linear" ? plant.ss : null;
  const np = ss ? ss.n : nonlinear!.system.stateCount;
  const uOp = nonlinear ? nonlinear.operatingInput : 0;
  const y0 = nonlinear ? nonlinear.y0 : 0;
  const xInit = nonlinear ? nonlinear.initial : new Float64Array(np);

  // Controller discretisation with inputs [Δr, y − y0, w] (w = u_act − u for back-calculation).
  const nc = c.n;
  const limited = limits !== undefined && (limits.min !== undefined || limits.max !== undefined || limits.rate !== undefined);
  const lo = limits?.min ?? -Infinity;
  const hi = limits?.max ?? Infinity;
  const rate = limits?.rate;
  const backCalculation = limited && antiWindup.kind === "back-calculation" && c.integrator >= 0;
  const conditional = limited && antiWindup.kind === "conditional" && c.integrator >= 0;
  const period = config.sampleTime ?? dt;
  if (config.sampleTime !== undefined && config.sampleTime < dt * (1 - GRID_TOLERANCE)) {
    throw new RangeError(`controller.sampleTime (${config.sampleTime} s) must be ≥ scenario.dt (${dt} s)`);
  }
  const cb = new Float64Array(nc * 3);
  for (let i = 0; i < nc; i++) {
    cb[i * 3] = c.br[i];
    cb[i * 3 + 1] = c.by[i];
  }
  if (backCalculation) {
    const tt = antiWindup.kind === "back-calculation" && antiWindup.tt !== undefined ? antiWindup.tt : c.trackingTime;
    cb[c.integrator * 3 + 2] = 1 / (c.ki * tt);
  }
  const cd = nc > 0 ? discretizeZohInputs(c.a, cb, nc, 3, period) : { phi: new Float64Array(0), gamma: new Float64Array(0) };

  // Dead time split θ = m·dt + φ.
  const q = config.delay / dt;
  let m = Math.floor(q);
  let phi = config.delay - m * dt;
  if (Math.abs(q - Math.round(q)) <= GRID_TOLERANCE * Math.max(1, q)) {
    m = Math.round(q);
    phi = 0;
  }
  const algebraic = m === 0 && phi === 0;

  // Load switch time at the plant (after the dead time).
  const load = sc.load;
  const loadSize = load ? load.size : 0;
  let loadIndex = samples;
  let loadOffset = 0; // time from t_{loadIndex−1} to the switch, when off the grid
  if (load) {
    const tl = load.time + config.delay;
    const ql = tl / dt;
    if (Math.abs(ql - Math.round(ql)) <= GRID_TOLERANCE * Math.max(1, ql)) loadIndex = Math.round(ql);
    else {
      loadIndex = Math.ceil(ql);
      loadOffset = tl - (loadIndex - 1) * dt;
    }
  }

  // Linear plant discretisations.
  let pPhi: Float64Array = new Float64Array(0);
  let gFull: Float64Array = new Float64Array(0);
  let gNew: Float64Array = new Float64Array(0);
  let gOld: Float64Array = new Float64Array(0);
  let gLoadPartial: Float64Array = new Float64Array(0);
  if (ss && np > 0) {
    const full = discretizeZohInputs(ss.a, ss.b, np, 1, dt);
    pPhi = full.phi;
    gFull = full.gamma;
    if (phi > 0) {
      const tail = discretizeZohInputs(ss.a, ss.b, np, 1, dt - phi);
      const head = discretizeZohInputs(ss.a, ss.b, np, 1, phi);
      gNew = tail.gamma;
      gOld = new Float64Array(np);
      for (let i = 0; i < np; i++) {
        let acc = 0;
        for (let j = 0; j < np; j++) acc += tail.phi[i * np + j] * head.gamma[j];
        gOld[i] = acc;
      }
    } else {
      gNew = gFull;
      gOld = new Float64Array(np);
    }
    if (loadOffset > 0) gLoadPartial = discretizeZohInputs(ss.a, ss.b, np, 1, dt - loadOffset).gamma;
  }
  const integrator = nonlinear ? new DormandPrince(nonlinear.system, nonlinear.parameters) : null;

  const noise = sc.noise ? gaussianNoise(sc.noise.seed, sc.noise.sd, samples) : null;
  const noiseX = sc.noise && c.kx ? stateNoise(sc.noise, np, samples) : null;
  const hist = new Float64Array(samples);
  const x = Float64Array.from(xInit);
  const xNext = new Float64Array(np);
  let xc = new Float64Array(nc);
  let xcNext = new Float64Array(nc);
  const dr = sc.setpoint;
  const rAbs = y0 + dr;
  let uUnsat = uOp;
  let uAct = uOp;
  let lastUpdate = -1;
  let updateCount = 0;
  let nextUpdate = 0;
  const { r, y, u, e } = trace;
  const breaks = new Float64Array(4);
  const held = (j: number): number => (j >= 0 ? hist[j] : uOp);

  for (let k = 0; k < samples; k++) {
    const loadNow = k >= loadIndex ? loadSize : 0;
    // 1. output at t_k⁺ (without the unknown u_k when the loop is algebraic)
    let yPart: number;
    let dFeed = 0;
    if (ss) {
      yPart = 0;
      for (let j = 0; j < np; j++) yPart += ss.c[j] * x[j];
      dFeed = ss.d;
      if (!algebraic) yPart += dFeed * (held(phi > 0 ? k - m - 1 : k - m) + loadNow);
      else yPart += dFeed * loadNow;
    } else {
      const vin = (algebraic ? held(k - 1) : held(phi > 0 ? k - m - 1 : k - m)) + loadNow;
      yPart = nonlinear!.system.output(t[k], x, nonlinear!.parameters, vin);
    }
    const n = noise ? noise[k] : 0;
    // 2. controller update
    const update = k === nextUpdate;
    const yFedBack = ss && algebraic && dFeed !== 0;
    if (update) {
      let base = uOp + c.dr * dr;
      for (let j = 0; j < nc; j++) base += c.c[j] * xc[j];
      if (c.kx) for (let j = 0; j < np; j++) base += c.kx[j] * (x[j] - xInit[j] + (noiseX ? noiseX[j][k] : 0));
      if (yFedBack) uUnsat = (base + c.dy * (yPart + n - y0)) / (1 - c.dy * dFeed);
      else uUnsat = base + c.dy * (yPart + n - y0);
      let target = uUnsat < lo ? lo : uUnsat > hi ? hi : uUnsat;
      if (rate !== undefined) {
        const elapsed = lastUpdate < 0 ? period : (k - lastUpdate) * dt;
        const maxStep = rate * elapsed;
        if (target > uAct + maxStep) target = uAct + maxStep;
        else if (target < uAct - maxStep) target = uAct - maxStep;
      }
      uAct = target;
    }
    const ys = yFedBack ? yPart + dFeed * uAct : yPart;
    if (!(Math.abs(ys) <= bound)) {
      fillNaN(trace, k, rAbs);
      return false;
    }
    if (update) {
      const dy = ys + n - y0;
      const w = uAct - uUnsat;
      for (let i = 0; i < nc; i++) {
        let acc = cd.gamma[i * 3] * dr + cd.gamma[i * 3 + 1] * dy + cd.gamma[i * 3 + 2] * w;
        for (let j = 0; j < nc; j++) acc += cd.phi[i * nc + j] * xc[j];
        xcNext[i] = acc;
      }
      if (conditional && uAct !== uUnsat && c.ki * (dr - dy) * (uUnsat - uAct) > 0) xcNext[c.integrator] = xc[c.integrator];
      const swap = xc;
      xc = xcNext;
      xcNext = swap;
      lastUpdate = k;
      updateCount++;
      nextUpdate = config.sampleTime === undefined ? k + 1 : Math.round((updateCount * config.sampleTime) / dt);
      if (nextUpdate <= k) nextUpdate = k + 1;
    }
    r[k] = rAbs;
    y[k] = ys;
    u[k] = uAct;
    e[k] = rAbs - ys;
    hist[k] = uAct;
    if (k === samples - 1) break;
    // 4. plant over [t_k, t_{k+1})
    const vNew = held(k - m);
    const vOld = held(k - m - 1);
    if (ss) {
      for (let i = 0; i < np; i++) {
        let acc = gNew[i] * vNew + gOld[i] * vOld;
        if (k >= loadIndex) acc += gFull[i] * loadSize;
        else if (k + 1 === loadIndex && loadOffset > 0) acc += gLoadPartial[i] * loadSize;
        for (let j = 0; j < np; j++) acc += pPhi[i * np + j] * x[j];
        xNext[i] = acc;
      }
      x.set(xNext);
    } else {
      // Pieces of the step: split at φ (dead-time fraction) and at the load switch.
      let count = 0;
      breaks[count++] = 0;
      if (phi > 0) breaks[count++] = phi;
      if (k + 1 === loadIndex && loadOffset > 0) breaks[count++] = loadOffset;
      if (count === 3 && breaks[2] < breaks[1]) {
        const tmp = breaks[1];
        breaks[1] = breaks[2];
        breaks[2] = tmp;
      }
      breaks[count] = dt;
      for (let s = 0; s < count; s++) {
        const a = breaks[s];
        const b = breaks[s + 1];
        if (!(b > a)) continue;
        const mid = (a + b) / 2;
        const v = (mid < phi ? vOld : vNew) + (k >= loadIndex || (k + 1 === loadIndex && loadOffset > 0 && mid > loadOffset) ? loadSize : 0);
        if (!integrator!.advance(x, t[k] + a, t[k] + b, v)) {
          fillNaN(trace, k + 1, rAbs);
          return false;
        }
      }
    }
    for (let i = 0; i < np; i++) {
      if (!(Math.abs(x[i]) <= bound)) {
        fillNaN(trace, k + 1, rAbs);
        return false;
      }
    }
  }
  return true;
}

function fillNaN(trace: LoopTrace, from: number, r: number): void {
  for (let k = from; k < trace.t.length; k++) {
    trace.r[k] = r;
    trace.y[k] = NaN;
    trace.u[k] = NaN;
    trace.e[k] = NaN;
  }
}
