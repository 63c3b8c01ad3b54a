import { antiWindupTrackingTime } from "../controllers/controller-realization.js";
import type { ActuatorLimits } from "../plants/actuator-limits.js";
import type { DeployablePid } from "./deployable-pid.js";
import { DISCRETIZATION_METHODS, type DiscretePid, type DiscretizationMethod } from "./discrete-pid.js";

/** Options of discretizePid. */
export interface DiscretizePidOptions {
  /** Sample time h [s], > 0. */
  sampleTime: number;
  method: DiscretizationMethod;
  /** Output limits min, max [u] and rate limit [u/s]; omitted: none. */
  limits?: ActuatorLimits;
  /**
   * Tracking time Tt [s] of back-calculation anti-windup; default √(Ti·Td), or Ti without
   * derivative action (antiWindupTrackingTime); Infinity turns anti-windup off.
   */
  trackingTime?: number;
}

/**
 * Difference equations of the PID u = kp(b r − y) + ki∫e dt + kd·s/(tf s + 1)·(c r − y) at
 * sample time h (coefficients as in DiscretePidCoefficients), by replacing s with
 *
 *   backward Euler:  s ← (1 − q⁻¹)/h
 *   Tustin:          s ← (2/h)·(1 − q⁻¹)/(1 + q⁻¹)
 *
 * in the integral ki/s and the filtered derivative kd·s/(tf s + 1) separately:
 *
 *   P:  pr = kp·b,   py = kp
 *   I:  backward Euler bi1 = ki·h, bi0 = 0;   Tustin bi1 = bi0 = ki·h/2
 *   D:  backward Euler ad = tf/(tf + h),        bd = kd/(tf + h)
 *       Tustin         ad = (2tf − h)/(2tf + h), bd = 2kd/(2tf + h);   dr = bd·c, dy = bd
 *   back-calculation:  at = h/Tt (the tracking term (u − v)/Tt integrated over one sample)
 *
 * With u = v (no limit reached) the result is exactly the chosen discretisation of C(s); both keep
 * the gain at zero frequency (z = 1 ↔ s = 0). Tustin's ad is negative when h > 2tf (the filter
 * state alternates in sign: choose h < 2tf). The tracking loop needs 0 < at < 2.
 * Throws a RangeError naming the option for h ≤ 0, an unknown method, bad limits or Tt ≤ 0.
 *
 * References: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §3.6 (discretisation,
 * back-calculation, the algorithm's listing); K. J. Åström and B. Wittenmark, Computer-Controlled
 * Systems, 3rd ed., Prentice Hall, 1997, §8.2 (Tustin and backward differences).
 */
export function discretizePid(pid: DeployablePid, options: DiscretizePidOptions): DiscretePid {
  const h = options.sampleTime;
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`sampleTime must be a finite number > 0 s, got ${h}`);
  const method = options.method;
  if (!(DISCRETIZATION_METHODS as readonly string[]).includes(method)) throw new RangeError(`method must be tustin or backward-euler, got "${String(method)}"`);
  const min = options.limits?.min ?? -Infinity;
  const max = options.limits?.max ?? Infinity;
  const rate = options.limits?.rate ?? Infinity;
  if (Number.isNaN(min) || Number.isNaN(max) || !(max > min)) throw new RangeError(`limits.max must exceed limits.min, got min = ${min}, max = ${max}`);
  if (!(rate > 0)) throw new RangeError(`limits.rate must be > 0 (units per second), got ${rate}`);
  const { kp, ki, kd, tf, b, c } = pid;
  const tustin = method === "tustin";
  const bi1 = tustin ? (ki * h) / 2 : ki * h;
  const bi0 = tustin ? (ki * h) / 2 : 0;
  let ad = 0;
  let bd = 0;
  if (kd !== 0) {
    ad = tustin ? (2 * tf - h) / (2 * tf + h) : tf / (tf + h);
    bd = tustin ? (2 * kd) / (2 * tf + h) : kd / (tf + h);
  }
  let trackingTime = NaN;
  if (ki !== 0) {
    trackingTime = options.trackingTime ?? antiWindupTrackingTime(kp, ki, kd);
    if (!(trackingTime > 0)) throw new RangeError(`trackingTime must be > 0 s (Infinity: no anti-windup), got ${trackingTime}`);
  }
  const at = ki !== 0 && Number.isFinite(trackingTime) ? h / trackingTime : 0;
  return {
    method,
    sampleTime: h,
    coefficients: { pr: kp * b, py: kp, bi1, bi0, ad, dr: bd * c, dy: bd, at },
    limits: { min, max, step: rate * h },
    trackingTime,
    pid,
  };
}
