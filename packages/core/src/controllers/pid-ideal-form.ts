import { assertValidPid } from "./assert-valid-pid.js";
import type { PidController } from "./pid.js";

/**
 * The ideal (non-interacting, "standard") form of a PID with filtered derivative:
 *
 *   C(s) = K · (1 + 1/(Ti·s) + Td·s/((Td/N)·s + 1))
 *
 * K: gain; integralTime Ti [s] (Infinity: no integral action); derivativeTime Td [s];
 * filterDivisor N (the derivative filter time is Td/N; Infinity when there is no filter).
 */
export interface IdealPidParameters {
  gain: number;
  integralTime: number;
  derivativeTime: number;
  filterDivisor: number;
}

/**
 * Parallel gains from the ideal form, term by term:
 *
 *   kp = K,   ki = K/Ti,   kd = K·Td,   tf = Td/N
 *
 * (Ti = Infinity gives ki = 0; Td = 0 gives kd = 0 and tf = 0.)
 * Throws a RangeError naming the parameter when K or Td is not finite, Ti is not > 0, or
 * N is not > 0 while Td > 0.
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §3.2, eq. 3.8 and 3.14.
 */
export function pidFromIdealForm(ideal: IdealPidParameters): PidController {
  const { gain, integralTime, derivativeTime, filterDivisor } = ideal;
  if (!Number.isFinite(gain)) throw new RangeError(`gain must be a finite number, got ${gain}`);
  if (!(integralTime > 0)) throw new RangeError(`integralTime must be > 0 s (Infinity for none), got ${integralTime}`);
  if (!Number.isFinite(derivativeTime) || derivativeTime < 0) {
    throw new RangeError(`derivativeTime must be a finite number ≥ 0 s, got ${derivativeTime}`);
  }
  if (derivativeTime > 0 && !(filterDivisor > 0)) throw new RangeError(`filterDivisor must be > 0, got ${filterDivisor}`);
  const kd = gain * derivativeTime;
  return {
    kind: "pid",
    kp: gain,
    ki: Number.isFinite(integralTime) ? gain / integralTime : 0,
    kd,
    tf: kd === 0 ? 0 : derivativeTime / filterDivisor,
  };
}

/**
 * Ideal form from parallel gains, the inverse of pidFromIdealForm:
 *
 *   K = kp,   Ti = kp/ki,   Td = kd/kp,   N = Td/tf
 *
 * (ki = 0 gives Ti = Infinity; kd = 0 gives Td = 0 and N = Infinity — a stored tf is then lost).
 * Needs kp ≠ 0: the ideal form has no pure-I or pure-D controller. Throws a RangeError naming
 * `kp` otherwise, or as assertValidPid.
 */
export function pidToIdealForm(pid: PidController): IdealPidParameters {
  assertValidPid(pid);
  const { kp, ki, kd, tf } = pid;
  if (kp === 0) throw new RangeError("kp must be non-zero to express a PID in ideal form (K = kp, Ti = kp/ki, Td = kd/kp)");
  const derivativeTime = kd / kp;
  return {
    gain: kp,
    integralTime: ki === 0 ? Infinity : kp / ki,
    derivativeTime,
    filterDivisor: kd === 0 ? Infinity : derivativeTime / tf,
  };
}
