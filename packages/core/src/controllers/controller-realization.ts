import { CONTROLLER_RULES, type Controller } from "./controller.js";
import { CONTROLLER_PARAMETERS, REFERENCE_GAIN_PARAMETER, satisfiesSign } from "./controller-parameters.js";

/**
 * A controller as a linear state space with two measured inputs, the setpoint r and the output y,
 * plus an optional state-feedback row:
 *
 *   x_c' = A x_c + B_r r + B_y y,   u = C x_c + D_r r + D_y y + K_x x,
 *
 * x the plant's state. One-degree-of-freedom controllers have B_r = −B_y, D_r = −D_y.
 * `integrator` is the index of the integral state (anti-windup acts on it), −1 when none.
 */
export interface ControllerRealization {
  n: number;
  a: Float64Array;
  br: Float64Array;
  by: Float64Array;
  c: Float64Array;
  dr: number;
  dy: number;
  /** Row K_x multiplying the plant state; null unless state feedback. */
  kx: Float64Array | null;
  integrator: number;
  /** Integral gain ki (for the back-calculation term), 0 when none. */
  ki: number;
  /** Default tracking time of back-calculation [s] (antiWindupTrackingTime), NaN when no integrator. */
  trackingTime: number;
}

/**
 * The realisation of any controller structure (see ControllerRealization):
 * - p: u = kp(r − y);
 * - pi: x_i' = r − y, u = ki x_i + kp(r − y);
 * - pid: x_i' = r − y, x_d' = −x_d/tf + (r − y), u = ki x_i − (kd/tf²) x_d + (kp + kd/tf)(r − y)
 *   (a term with a zero gain has no state);
 * - pid2dof: x_i' = r − y, x_d' = −x_d/tf + (c r − y), u = ki x_i − (kd/tf²) x_d + kp(b r − y) + (kd/tf)(c r − y);
 * - lead-lag: x' = −x/tLag + e, u = (k/tLag)(1 − tLead/tLag) x + k(tLead/tLag) e (tLag > 0), else u = k e;
 * - state-feedback: no states, u = N r − K x.
 * Throws a RangeError naming the bad field. References: K. J. Åström and T. Hägglund, Advanced
 * PID Control, ISA, 2006, §3.3–3.4 (filtered derivative, setpoint weighting).
 */
export function controllerRealization(controller: Controller, plantStates?: number): ControllerRealization {
  assertValidController(controller);
  switch (controller.kind) {
    case "p":
      return make(0, [], [], [], [], controller.kp, -controller.kp);
    case "pi":
      return pidLike(controller.kp, controller.ki, 0, 0, 1, 1);
    case "pid":
      return pidLike(controller.kp, controller.ki, controller.kd, controller.tf, 1, 1);
    case "pid2dof":
      return pidLike(controller.kp, controller.ki, controller.kd, controller.tf, controller.b, controller.c);
    case "lead-lag": {
      const { k, tLead, tLag } = controller;
      if (!(tLag > 0)) return make(0, [], [], [], [], k, -k);
      const ratio = tLead / tLag;
      return make(1, [-1 / tLag], [1], [-1], [(k / tLag) * (1 - ratio)], k * ratio, -k * ratio);
    }
    case "state-feedback": {
      if (plantStates !== undefined && controller.k.length !== plantStates) {
        throw new RangeError(`controller.k: give one gain per plant state (${plantStates}), got ${controller.k.length}`);
      }
      const r = make(0, [], [], [], [], controller.n, 0);
      r.kx = Float64Array.from(controller.k, (v) => -v);
      return r;
    }
  }
}

function pidLike(kp: number, ki: number, kd: number, tf: number, b: number, c: number): ControllerRealization {
  const hasI = ki !== 0;
  const hasD = kd !== 0;
  const n = (hasI ? 1 : 0) + (hasD ? 1 : 0);
  const a = new Array<number>(n * n).fill(0);
  const br: number[] = [];
  const by: number[] = [];
  const cc: number[] = [];
  if (hasI) {
    br.push(1);
    by.push(-1);
    cc.push(ki);
  }
  if (hasD) {
    a[n * n - 1] = -1 / tf;
    br.push(c);
    by.push(-1);
    cc.push(-kd / (tf * tf));
  }
  const kick = hasD ? kd / tf : 0;
  const r = make(n, a, br, by, cc, kp * b + kick * c, -(kp + kick));
  if (hasI) {
    r.integrator = 0;
    r.ki = ki;
    r.trackingTime = antiWindupTrackingTime(kp, ki, kd);
  }
  return r;
}

function make(n: number, a: number[], br: number[], by: number[], c: number[], dr: number, dy: number): ControllerRealization {
  return {
    n,
    a: Float64Array.from(a),
    br: Float64Array.from(br),
    by: Float64Array.from(by),
    c: Float64Array.from(c),
    dr,
    dy,
    kx: null,
    integrator: -1,
    ki: 0,
    trackingTime: NaN,
  };
}

/**
 * Default tracking time of back-calculation anti-windup: Tt = √(Ti·Td) with Ti = kp/ki, Td = kd/kp,
 * or Tt = Ti when there is no derivative action (K. J. Åström and T. Hägglund, Advanced PID
 * Control, ISA, 2006, §3.5). Without a usable Ti (kp ≤ 0, a pure integral controller), Tt = 1/|ki|
 * (common practice: the integrator's own time scale).
 */
export function antiWindupTrackingTime(kp: number, ki: number, kd: number): number {
  if (ki === 0) return NaN;
  const ti = kp / ki;
  if (!(ti > 0)) return 1 / Math.abs(ki);
  const td = kd / kp;
  return td > 0 ? Math.sqrt(ti * td) : ti;
}

/**
 * Throws a RangeError naming the first bad field of a controller: every parameter of the kind's
 * table (CONTROLLER_PARAMETERS) finite and of its sign, then the cross-field rules (CONTROLLER_RULES).
 */
export function assertValidController(controller: Controller): void {
  if (controller === null || typeof controller !== "object") throw new TypeError("controller must be an object with a kind");
  const kind = controller.kind;
  const table = kind === "state-feedback" ? [REFERENCE_GAIN_PARAMETER] : CONTROLLER_PARAMETERS[kind];
  if (!table) throw new RangeError(`controller.kind: unknown controller structure "${String((controller as { kind?: unknown }).kind)}"`);
  const record = controller as unknown as Record<string, unknown> & { kind: string };
  for (const p of table) {
    const v = record[p.name];
    if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`controller.${p.name} must be a finite number, got ${String(v)}`);
    if (!satisfiesSign(v, p.sign)) {
      throw new RangeError(`controller.${p.name} must be ${p.sign === "positive" ? ">" : "≥"} 0${p.unit === "s" ? " s" : ""}, got ${v}`);
    }
  }
  for (const rule of CONTROLLER_RULES) {
    const problem = rule(record);
    if (problem) throw new RangeError(`controller.${problem.message}`);
  }
  if (controller.kind === "state-feedback") {
    if (!Array.isArray(controller.k) || controller.k.length === 0 || !controller.k.every((v) => Number.isFinite(v))) {
      throw new RangeError("controller.k must be a non-empty list of finite gains");
    }
  }
  if (controller.sampleTime !== undefined && !(controller.sampleTime > 0 && Number.isFinite(controller.sampleTime))) {
    throw new RangeError(`controller.sampleTime must be a finite time > 0 s, got ${String(controller.sampleTime)}`);
  }
  const aw = controller.antiWindup;
  if (aw !== undefined) {
    if (aw.kind !== "none" && aw.kind !== "back-calculation" && aw.kind !== "conditional") {
      throw new RangeError('controller.antiWindup.kind must be "none", "back-calculation" or "conditional"');
    }
    if (aw.kind === "back-calculation" && aw.tt !== undefined && !(aw.tt > 0 && Number.isFinite(aw.tt))) {
      throw new RangeError(`controller.antiWindup.tt must be a finite time > 0 s, got ${String(aw.tt)}`);
    }
  }
}
