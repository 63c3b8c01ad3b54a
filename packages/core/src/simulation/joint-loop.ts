import type { AntiWindup } from "../controllers/controller.js";
import type { ControllerRealization } from "../controllers/controller-realization.js";
import type { ActuatorLimits } from "../plants/actuator-limits.js";
import type { NonlinearPlantModel } from "../plants/nonlinear-plant-model.js";
import type { GridPlant } from "./grid-loop.js";
import { DiscontinuityQueue } from "./discontinuity-queue.js";
import { InputHistory } from "./input-history.js";
import type { LoopTrace } from "./loop-trace.js";
import type { ResolvedScenario } from "./resolve-scenario.js";
import { stateNoise } from "./state-noise.js";
import { gaussianNoise } from "./gaussian-noise.js";

/** Relative tolerance within which a time counts as lying on the grid or on an internal node. */
const GRID_TOLERANCE = 1e-9;
/** Bisection halvings that locate a switching instant inside a step: to 2⁻³²·h. */
const EVENT_BISECTIONS = 32;
/** Most switching instants located inside one piece of a step (more are taken at its end). */
const MAX_EVENTS_PER_PIECE = 4;
/** Time offset of the central difference for dy/dt of a nonlinear output, as a fraction of h. */
const OUTPUT_RATE_STEP = 1e-3;
/** A jump of the demanded input larger than this (relative) starts a rate-limited ramp. */
const JUMP_TOLERANCE = 1e-12;

/** Everything the joint loop needs besides the scenario. */
export interface JointLoopConfig {
  plant: GridPlant;
  controller: ControllerRealization;
  antiWindup: AntiWindup;
  limits: ActuatorLimits | undefined;
  /** Dead time θ [s] ≥ 0 on the plant input. */
  delay: number;
  /** Internal steps per grid step, from jointSubsteps (≤ MAX_SUBSTEPS). */
  substeps: number;
}

/**
 * The loop of a continuous controller with a nonlinear plant, actuator limits or dead time:
 * plant and controller integrated as one system z = [x; x_c (; a)] by the classical fourth-order
 * Runge–Kutta method (W. Kutta, Z. Math. Phys. 46, 435–453, 1901; E. Hairer, S. P. Nørsett and
 * G. Wanner, Solving ODEs I, 2nd ed., 1993, §II.1, Table 1.2), with the controller evaluated at every
 * stage, on s equal internal steps h = dt/s per grid step (jointSubsteps: s = 1 unless the loop is
 * stiff at dt or θ < dt; at most MAX_SUBSTEPS, see simulateLoop). At every stage:
 *
 *   v = u_a(t − θ) + d(t − θ),  y = g(x, v)  (C x + D v),
 *   u = u_op + C_c x_c + D_r Δr + D_y (y + n − y0) + K_x (x − x_init + n_x),
 *   u_a = the actuator's output for u (below), x' = f(x, v), x_c' = A_c x_c + B_r Δr + B_y (y + n − y0),
 *
 * n the measurement noise held over each grid step (its sample at t_k), n_x the noise on the states a
 * state-feedback controller measures (stateNoise). Without dead time and with D ≠ 0 the algebraic
 * loop is solved, u = (… + D_y(C x + D d + n − y0))/(1 − D_y D); a nonlinear output that depends on
 * u takes one fixed-point pass from the previous stage's input.
 *
 * Dead time θ > 0: u_a(t − θ) is read from its stored past (InputHistory: cubic Hermite on the
 * node values and derivatives u_a' = C_c x_c' + D_y y' + K_x x', error O(h⁴)); θ need not be a
 * multiple of dt or h — the read time t − θ falls anywhere between nodes. h ≤ θ, so no stage reads
 * the step being taken. The input jumps at t = θ (the setpoint step passing the delay), at the load
 * switch t_d + θ and, with noise, at every t_k + θ: each step is split at these instants, so every
 * piece the Runge–Kutta method integrates has a smooth right-hand side.
 *
 * Actuator limits make the right-hand side switch between smooth pieces: saturation
 * (u_s = min(max(u, min), max)), conditional integration (x_i' = 0 while limited with
 * ki·e·(u − u_a) > 0), back-calculation (x_i' += (u_a − u)/(ki·Tt), always on; Åström & Hägglund,
 * Advanced PID Control, 2006, §3.5) and the rate limit (u_a tracks u_s while |u_s'| ≤ rate, else
 * ramps at ±rate as a state a until it meets u_s). Each step is integrated in the mode of its start;
 * when the mode at its end differs, the switching instant is located by bisection on the step's
 * cubic Hermite interpolant to 2⁻³²·h and the step is redone in two pieces (L. F. Shampine and
 * S. Thompson, "Event location for ordinary differential equations", Comput. Math. Appl. 39, 2000),
 * so switches cost no order. A jump of u_s (at t = 0⁺, or a new noise sample) starts a ramp from the
 * held value. Before t = 0 the actuator holds u_op. Only the delayed read across a switching instant
 * (which is not a node of the history) is interpolated through the kink: local error O(h²) on that
 * one interval.
 *
 * Fills y, u, e, r of the trace (u the actuator output u_a at t_k⁺); returns false (and NaN from
 * there on) when |y| or a plant state passes `bound` or is not finite.
 */
export function runJointLoop(config: JointLoopConfig, sc: ResolvedScenario, trace: LoopTrace, bound: number): boolean {
  return new JointLoop(config, sc).run(trace, bound);
}

class JointLoop {
  // Plant
  private readonly np: number;
  private readonly linear: boolean;
  private readonly pa: Float64Array;
  private readonly pb: Float64Array;
  private readonly pc: Float64Array;
  private readonly pd: number;
  private readonly model: NonlinearPlantModel | null;
  private readonly outputUsesInput: boolean;
  private readonly f: NonlinearPlantModel["system"]["derivatives"] | null;
  private readonly g: NonlinearPlantModel["system"]["output"] | null;
  private readonly p: Float64Array;
  private readonly baseConst: number;
  private readonly cc: Float64Array;
  private readonly ca: Float64Array;
  private readonly cby: Float64Array;
  private readonly cIn: Float64Array;
  private readonly cdy: number;
  private readonly uOp: number;
  private readonly y0: number;
  private readonly xInit: Float64Array;
  // Controller
  private readonly c: ControllerRealization;
  private readonly nc: number;
  private readonly kx: Float64Array | null;
  private readonly bcGain: number;
  private readonly conditional: boolean;
  private readonly dr: number;
  // Actuator
  private readonly lo: number;
  private readonly hi: number;
  private readonly rate: number;
  private readonly ia: number;
  // Joint state
  private readonly nz: number;
  private z: Float64Array;
  private zNew: Float64Array;
  private readonly zStart: Float64Array;
  private readonly zStage: Float64Array;
  private f0: Float64Array;
  private fEnd: Float64Array;
  private readonly k2: Float64Array;
  private readonly k3: Float64Array;
  private readonly k4: Float64Array;
  private readonly xProbe: Float64Array;
  // Time, delay, load, noise
  private readonly dt: number;
  private readonly s: number;
  private readonly h: number;
  private readonly theta: number;
  private readonly history: InputHistory | null;
  private readonly queue: DiscontinuityQueue | null;
  private loadQueued = false;
  private readonly loadSize: number;
  private readonly loadTime: number;
  private readonly noise: Float64Array | null;
  private readonly noiseX: Float64Array[] | null;
  private readonly nx: Float64Array;
  // Piece context and mode
  private n = 0;
  private loadOn = false;
  private side = -Infinity;
  private sigma = 0;
  private frozen = false;
  private ramp = 0;
  // Values of the last evaluation
  private u = 0;
  private uSat = 0;
  private uAct = 0;
  private y = 0;
  private v = 0;
  private vRate = 0;
  private lastV: number;
  private readonly rAbs: number;

  constructor(config: JointLoopConfig, private readonly sc: ResolvedScenario) {
    const { plant, controller: c, limits, antiWindup } = config;
    this.linear = plant.kind === "linear";
    const ss = plant.kind === "linear" ? plant.ss : null;
    this.model = plant.kind === "nonlinear" ? plant.model : null;
    const np = ss ? ss.n : this.model!.system.stateCount;
    this.np = np;
    this.pa = ss ? ss.a : new Float64Array(0);
    this.pb = ss ? ss.b : new Float64Array(0);
    this.pc = ss ? ss.c : new Float64Array(0);
    this.pd = ss ? ss.d : 0;
    this.uOp = this.model ? this.model.operatingInput : 0;
    this.y0 = this.model ? this.model.y0 : 0;
    this.xInit = this.model ? this.model.initial : new Float64Array(np);
    this.outputUsesInput = this.model ? dependsOnInput(this.model) : false;
    this.f = this.model ? this.model.system.derivatives : null;
    this.g = this.model ? this.model.system.output : null;
    this.p = this.model ? this.model.parameters : new Float64Array(0);
    this.baseConst = this.uOp + c.dr * sc.setpoint;
    this.cc = c.c;
    this.ca = c.a;
    this.cby = c.by;
    this.cIn = Float64Array.from(c.br, (b) => b * sc.setpoint);
    this.cdy = c.dy;
    this.lastV = this.uOp;

    this.c = c;
    this.nc = c.n;
    this.kx = c.kx;
    const limited = limits !== undefined && (limits.min !== undefined || limits.max !== undefined || limits.rate !== undefined);
    const backCalculation = limited && antiWindup.kind === "back-calculation" && c.integrator >= 0;
    const tt = antiWindup.kind === "back-calculation" && antiWindup.tt !== undefined ? antiWindup.tt : c.trackingTime;
    this.bcGain = backCalculation ? 1 / (c.ki * tt) : 0;
    this.conditional = limited && antiWindup.kind === "conditional" && c.integrator >= 0;
    this.dr = sc.setpoint;
    this.rAbs = this.y0 + sc.setpoint;

    this.lo = limits?.min ?? -Infinity;
    this.hi = limits?.max ?? Infinity;
    this.rate = limits?.rate ?? Infinity;
    const rateLimited = limits?.rate !== undefined;
    this.nz = np + this.nc + (rateLimited ? 1 : 0);
    this.ia = rateLimited ? np + this.nc : -1;
    const nz = this.nz;
    this.z = new Float64Array(nz);
    this.zNew = new Float64Array(nz);
    this.zStart = new Float64Array(nz);
    this.zStage = new Float64Array(nz);
    this.f0 = new Float64Array(nz);
    this.fEnd = new Float64Array(nz);
    this.k2 = new Float64Array(nz);
    this.k3 = new Float64Array(nz);
    this.k4 = new Float64Array(nz);
    this.xProbe = new Float64Array(np);

    this.dt = sc.dt;
    this.theta = config.delay;
    this.s = config.substeps;
    this.h = sc.dt / this.s;
    this.history = this.theta > 0 ? new InputHistory(this.theta + 2 * sc.dt, Math.ceil(this.theta / this.h) + 8, this.uOp) : null;
    this.queue = this.theta > 0 ? new DiscontinuityQueue(this.theta) : null;
    this.loadSize = sc.load ? sc.load.size : 0;
    this.loadTime = sc.load ? sc.load.time + this.theta : Infinity;
    const samples = sc.t.length;
    this.noise = sc.noise ? gaussianNoise(sc.noise.seed, sc.noise.sd, samples) : null;
    this.noiseX = sc.noise && c.kx ? stateNoise(sc.noise, np, samples) : null;
    this.nx = new Float64Array(np);
  }

  run(trace: LoopTrace, bound: number): boolean {
    const { sc, np, s, h, history, queue } = this;
    const samples = sc.t.length;
    const { r, y, u, e } = trace;
    this.z.set(this.xInit);
    if (this.ia >= 0) this.z[this.ia] = this.uOp;
    this.setNoise(0);
    this.enterPiece(0, this.pieceEnd(0, h));
    this.refresh(0, this.uOp);
    if (history) history.push(0, this.uOp, 0, this.uAct, this.actRate(0));
    if (queue) queue.add(0, 0);
    for (let k = 0; k < samples; k++) {
      if (!(Math.abs(this.y) <= bound)) return fail(trace, k, this.rAbs);
      r[k] = this.rAbs;
      y[k] = this.y;
      u[k] = this.uAct;
      e[k] = this.rAbs - this.y;
      if (k === samples - 1) break;
      for (let i = 0; i < s; i++) {
        const j = k * s + i;
        const tb = (j + 1) * h;
        if (!this.advanceStep(j * h, tb)) return fail(trace, k + 1, this.rAbs);
        // Node t_{j+1}; at a grid node a new noise sample (the left limit ends the piece just taken).
        const leftU = this.uAct;
        const leftRate = history ? this.actRate(tb) : 0;
        const fresh = i === s - 1 && this.noise !== null;
        if (fresh) {
          this.setNoise(k + 1);
          this.refresh(tb, leftU);
          if (queue) queue.add(tb, 0);
        }
        if (history) history.push(tb, leftU, leftRate, this.uAct, fresh ? this.actRate(tb) : leftRate);
      }
      // A jump of the plant input exactly at t_{k+1} (a breaking point or the load on the grid): the sample is its right limit.
      const tk = (k + 1) * s * h;
      if (this.enterPiece(tk, this.pieceEnd(tk, tk + h))) this.afterJump(tk);
      for (let i = 0; i < np; i++) if (!(Math.abs(this.z[i]) <= bound)) return fail(trace, k + 1, this.rAbs);
    }
    return true;
  }

  /**
   * One internal step [ta, tb]: split at the breaking points (dead time) and the load switch, each
   * piece integrated with event location. Leaves z and f0 at tb; pushes history nodes at the
   * inner piece ends.
   */
  private advanceStep(ta: number, tb: number): boolean {
    let start = ta;
    for (;;) {
      const end = this.pieceEnd(start, tb);
      if (this.enterPiece(start, end)) this.afterJump(start);
      if (!this.advancePiece(start, end)) return false;
      if (end >= tb) return true;
      if (this.history) {
        const rate = this.actRate(end);
        this.history.push(end, this.uAct, rate, this.uAct, rate);
      }
      start = end;
    }
  }

  /** Re-evaluates at t after the plant input jumped, and stores the right limit of u there. */
  private afterJump(t: number): void {
    this.refresh(t, this.uAct);
    if (this.history && this.history.newestTime >= t - GRID_TOLERANCE * this.h) this.history.setNewestRight(this.uAct, this.actRate(t));
  }

  /** End of the piece from a: the next breaking point or load switch before b, else b. */
  private pieceEnd(a: number, b: number): number {
    const tol = GRID_TOLERANCE * this.h;
    let end = b;
    if (this.queue) {
      const next = this.queue.peek();
      if (next > a + tol && next < end - tol) end = next;
    }
    const tl = this.loadTime;
    if (this.loadSize !== 0 && tl > a + tol && tl < end - tol) end = tl;
    return end;
  }

  /**
   * Enters the piece [a, b]: drops the breaking points reached, adds the load step as a source
   * once its time has come, sets the load flag and the history side. True when the plant input
   * may jump at a (a breaking point or the load switch) — the caller re-evaluates there.
   */
  private enterPiece(a: number, b: number): boolean {
    const tol = GRID_TOLERANCE * this.h;
    let jumped = false;
    if (this.queue) {
      if (this.queue.popThrough(a + tol)) jumped = true;
      if (!this.loadQueued && this.loadSize !== 0 && a + tol >= this.loadTime - this.theta) {
        this.queue.add(this.loadTime - this.theta, 0);
        this.loadQueued = true;
      }
    }
    const mid = (a + b) / 2;
    const loadOn = mid >= this.loadTime;
    if (loadOn !== this.loadOn) jumped = true;
    this.loadOn = loadOn;
    this.side = mid - this.theta;
    return jumped;
  }

  /** RK4 over [a, b] from (z, f0) with event location; leaves z, f0 at b. */
  private advancePiece(a: number, b: number): boolean {
    let t = a;
    for (let events = 0; ; events++) {
      const span = b - t;
      if (!(span > GRID_TOLERANCE * this.h)) return true;
      this.rk4(t, span, this.z, this.zNew);
      this.evaluate(t + span, this.zNew, this.fEnd);
      if (!Number.isFinite(this.y) || !Number.isFinite(this.zNew[0])) return false;
      if (events >= MAX_EVENTS_PER_PIECE || this.modeHolds(t + span, this.zNew, this.fEnd)) {
        this.swapEnd();
        return true;
      }
      // Locate the switching instant on the Hermite interpolant of [z, zNew].
      let lo = 0;
      let hi = span;
      for (let i = 0; i < EVENT_BISECTIONS; i++) {
        const mid = (lo + hi) / 2;
        this.interpolate(mid / span, span, this.zStage);
        this.evaluate(t + mid, this.zStage, this.k4);
        if (this.modeHolds(t + mid, this.zStage, this.k4)) lo = mid;
        else hi = mid;
      }
      // Integrate up to the switch in the old mode, then switch: a kink of u, a node of its past.
      this.rk4(t, hi, this.z, this.zNew);
      this.evaluate(t + hi, this.zNew, this.fEnd);
      const held = this.uAct;
      const heldRate = this.history ? this.demandRateAct(t + hi, this.zNew, this.fEnd) : 0;
      this.swapEnd();
      t += hi;
      // The actuator is continuous at a switch (held only for the history's left limit): a gap of
      // the bisection's size between u_s and the ramp must not read as a jump that starts a ramp.
      this.refresh(t, NaN);
      if (this.history) this.history.push(t, held, heldRate, this.uAct, this.actRate(t));
      if (this.queue) this.queue.add(t, 1);
    }
  }

  private swapEnd(): void {
    const z = this.z;
    this.z = this.zNew;
    this.zNew = z;
    const f = this.f0;
    this.f0 = this.fEnd;
    this.fEnd = f;
  }

  /** Classical RK4 from (t, z) with k1 = f0 over a step H into out. */
  private rk4(t: number, H: number, z: Float64Array, out: Float64Array): void {
    const { nz, f0, k2, k3, k4, zStage } = this;
    const half = H / 2;
    for (let i = 0; i < nz; i++) zStage[i] = z[i] + half * f0[i];
    this.evaluate(t + half, zStage, k2);
    for (let i = 0; i < nz; i++) zStage[i] = z[i] + half * k2[i];
    this.evaluate(t + half, zStage, k3);
    for (let i = 0; i < nz; i++) zStage[i] = z[i] + H * k3[i];
    this.evaluate(t + H, zStage, k4);
    const w = H / 6;
    for (let i = 0; i < nz; i++) out[i] = z[i] + w * (f0[i] + 2 * (k2[i] + k3[i]) + k4[i]);
  }

  /** Cubic Hermite interpolant at τ ∈ [0, 1] of the step (z, f0) → (zNew, fEnd) of length H. */
  private interpolate(tau: number, H: number, out: Float64Array): void {
    const { nz, z, zNew, f0, fEnd } = this;
    const t2 = tau * tau;
    const t3 = t2 * tau;
    const a0 = 2 * t3 - 3 * t2 + 1;
    const b0 = (t3 - 2 * t2 + tau) * H;
    const a1 = 3 * t2 - 2 * t3;
    const b1 = (t3 - t2) * H;
    for (let i = 0; i < nz; i++) out[i] = a0 * z[i] + b0 * f0[i] + a1 * zNew[i] + b1 * fEnd[i];
  }

  /**
   * Re-evaluates f0 at (t, z) after something jumped (start, a noise sample, the delayed input, a
   * switch) and settles the mode there; `held` is the actuator output just before t.
   */
  private refresh(t: number, held: number): void {
    for (let pass = 0; pass < 3; pass++) {
      this.evaluate(t, this.z, this.f0);
      if (this.modeHolds(t, this.z, this.f0, held)) return;
      this.adoptMode(held);
    }
    this.evaluate(t, this.z, this.f0);
  }

  // Mode proposed by the last modeHolds call.
  private nextSigma = 0;
  private nextFrozen = false;
  private nextRamp = 0;

  /**
   * True when the mode (saturation side, frozen integrator, rate ramp) at the last evaluation equals
   * the mode in use; otherwise leaves the new mode in next*. `held`: the actuator output just before
   * t when the demand may have jumped there (a jump starts a ramp), else NaN.
   */
  private modeHolds(t: number, z: Float64Array, dz: Float64Array, held = NaN): boolean {
    const { u, lo, hi } = this;
    const sigma = u > hi ? 1 : u < lo ? -1 : 0;
    const uSat = sigma === 0 ? u : sigma > 0 ? hi : lo;
    let ramp = 0;
    if (this.ia >= 0) {
      if (this.ramp !== 0) ramp = this.ramp * (uSat - z[this.ia]) > 0 ? this.ramp : 0;
      else if (held === held && Math.abs(uSat - held) > JUMP_TOLERANCE * (1 + Math.abs(held))) ramp = uSat > held ? 1 : -1;
      else if (sigma === 0) {
        const slope = this.demandRate(t, z, dz);
        ramp = slope > this.rate ? 1 : slope < -this.rate ? -1 : 0;
      }
    }
    let frozen = false;
    if (this.conditional && sigma !== 0) {
      const uAct = ramp !== 0 ? z[this.ia] : uSat;
      const error = this.dr - (this.y + this.n - this.y0);
      frozen = this.c.ki * error * (u - uAct) > 0;
    }
    this.nextSigma = sigma;
    this.nextFrozen = frozen;
    this.nextRamp = ramp;
    return sigma === this.sigma && frozen === this.frozen && ramp === this.ramp;
  }

  private adoptMode(held: number): void {
    if (this.ia >= 0 && this.ramp === 0 && this.nextRamp !== 0) this.z[this.ia] = held === held ? held : this.uSat;
    this.sigma = this.nextSigma;
    this.frozen = this.nextFrozen;
    this.ramp = this.nextRamp;
  }

  /** Noise samples of grid step k (held over [t_k, t_{k+1})). */
  private setNoise(k: number): void {
    this.n = this.noise ? this.noise[k] : 0;
    if (this.noiseX) for (let j = 0; j < this.np; j++) this.nx[j] = this.noiseX[j][k];
  }

  /**
   * The joint right-hand side at (t, z) in the current mode and piece context into dz; leaves u,
   * uSat, uAct, y, v (and vRate with dead time) of this evaluation.
   */
  private evaluate(t: number, z: Float64Array, dz: Float64Array): void {
    const { np, nc, kx, cc, cdy } = this;
    const d = this.loadOn ? this.loadSize : 0;
    let base = this.baseConst;
    for (let j = 0; j < nc; j++) base += cc[j] * z[np + j];
    if (kx !== null) for (let j = 0; j < np; j++) base += kx[j] * (z[j] - this.xInit[j] + this.nx[j]);
    const noiseTerm = this.n - this.y0;
    let y: number;
    if (this.history !== null) {
      const v = this.history.read(t - this.theta, this.side) + d;
      this.vRate = this.history.derivative;
      this.v = v;
      y = this.output(t, z, v);
      this.applyMode(base + cdy * (y + noiseTerm), z);
    } else if (this.linear) {
      let yPart = this.pd * d;
      for (let j = 0; j < np; j++) yPart += this.pc[j] * z[j];
      const loopGain = cdy * this.pd;
      this.applyMode(loopGain !== 0 ? (base + cdy * (yPart + noiseTerm)) / (1 - loopGain) : base + cdy * (yPart + noiseTerm), z);
      this.v = this.uAct + d;
      y = yPart + this.pd * this.uAct;
    } else {
      y = this.g!(t, z, this.p, this.lastV);
      this.applyMode(base + cdy * (y + noiseTerm), z);
      this.v = this.uAct + d;
      if (this.outputUsesInput) {
        y = this.g!(t, z, this.p, this.v);
        this.applyMode(base + cdy * (y + noiseTerm), z);
        this.v = this.uAct + d;
      }
      this.lastV = this.v;
    }
    this.y = y;
    // Plant
    const v = this.v;
    if (this.linear) {
      const { pa, pb } = this;
      for (let i = 0; i < np; i++) {
        let acc = pb[i] * v;
        for (let j = 0; j < np; j++) acc += pa[i * np + j] * z[j];
        dz[i] = acc;
      }
    } else this.f!(t, z, this.p, v, dz);
    // Controller
    const ey = y + noiseTerm;
    const { ca, cby, cIn } = this;
    for (let i = 0; i < nc; i++) {
      let acc = cIn[i] + cby[i] * ey;
      for (let j = 0; j < nc; j++) acc += ca[i * nc + j] * z[np + j];
      dz[np + i] = acc;
    }
    const integrator = this.c.integrator;
    if (integrator >= 0) {
      if (this.frozen) dz[np + integrator] = 0;
      else if (this.bcGain !== 0) dz[np + integrator] += (this.uAct - this.u) * this.bcGain;
    }
    if (this.ia >= 0) dz[this.ia] = this.ramp * (this.rate === Infinity ? 0 : this.rate);
  }

  private applyMode(u: number, z: Float64Array): void {
    this.u = u;
    const uSat = this.sigma === 0 ? u : this.sigma > 0 ? this.hi : this.lo;
    this.uSat = uSat;
    this.uAct = this.ramp !== 0 ? z[this.ia] : uSat;
  }

  /** Plant output y = g(x, v) (C x + D v for a linear plant). */
  private output(t: number, z: Float64Array, v: number): number {
    if (this.linear) {
      let y = this.pd * v;
      for (let j = 0; j < this.np; j++) y += this.pc[j] * z[j];
      return y;
    }
    const model = this.model!;
    return model.system.output(t, z, model.parameters, v);
  }

  /** du/dt of the unsaturated demand at the last evaluation (dz its derivative). */
  private demandRate(t: number, z: Float64Array, dz: Float64Array): number {
    const { np, nc, c, kx } = this;
    let rate = 0;
    for (let j = 0; j < nc; j++) rate += c.c[j] * dz[np + j];
    if (kx) for (let j = 0; j < np; j++) rate += kx[j] * dz[j];
    if (c.dy === 0) return rate;
    const vRate = this.history ? this.vRate : 0;
    let yRate: number;
    if (this.linear) {
      yRate = 0;
      for (let j = 0; j < np; j++) yRate += this.pc[j] * dz[j];
      if (this.history) yRate += this.pd * vRate;
      else if (this.pd !== 0) return (rate + c.dy * yRate) / (1 - c.dy * this.pd);
    } else {
      const eps = OUTPUT_RATE_STEP * this.h;
      const probe = this.xProbe;
      for (let j = 0; j < np; j++) probe[j] = z[j] + eps * dz[j];
      const plus = this.model!.system.output(t + eps, probe, this.model!.parameters, this.v + eps * vRate);
      for (let j = 0; j < np; j++) probe[j] = z[j] - eps * dz[j];
      const minus = this.model!.system.output(t - eps, probe, this.model!.parameters, this.v - eps * vRate);
      yRate = (plus - minus) / (2 * eps);
    }
    return rate + c.dy * yRate;
  }

  /** du_a/dt at the last evaluation at (t, z, f0) (for the stored past of the delayed input). */
  private actRate(t: number): number {
    return this.demandRateAct(t, this.z, this.f0);
  }

  /** du_a/dt in the current mode at the last evaluation, at (t, z) with derivative dz. */
  private demandRateAct(t: number, z: Float64Array, dz: Float64Array): number {
    if (this.ramp !== 0) return this.ramp * this.rate;
    if (this.sigma !== 0) return 0;
    return this.demandRate(t, z, dz);
  }
}

/** True when a nonlinear output changes with the input at the operating point (probed at u_op ± 1). */
function dependsOnInput(model: NonlinearPlantModel): boolean {
  const { system, parameters, initial, operatingInput } = model;
  const y = system.output(0, initial, parameters, operatingInput);
  return system.output(0, initial, parameters, operatingInput + 1) !== y || system.output(0, initial, parameters, operatingInput - 1) !== y;
}

function fail(trace: LoopTrace, from: number, r: number): false {
  for (let k = from; k < trace.t.length; k++) {
    trace.r[k] = r;
    trace.y[k] = NaN;
    trace.u[k] = NaN;
    trace.e[k] = NaN;
  }
  return false;
}
