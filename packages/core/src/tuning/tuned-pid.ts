import type { PidController } from "../controllers/pid.js";
import { pidFromIdealForm } from "../controllers/pid-ideal-form.js";

/**
 * Derivative filter divisor N used by every rule whose paper gives none: the filter time is
 * tf = Td/N. N = 10 is the usual textbook value (Åström & Hägglund, Advanced PID Control, ISA,
 * 2006, §3.3: "N typically 8 to 20" — from memory).
 */
export const DEFAULT_FILTER_DIVISOR = 10;

/** The ideal form K·(1 + 1/(Ti·s) + Td·s/((Td/N)s + 1)) of a tuned controller. */
export interface IdealGains {
  /** Controller gain K [u/y]. */
  K: number;
  /** Integral time Ti [s]; Infinity without integral action. */
  Ti: number;
  /** Derivative time Td [s]; 0 without derivative action. */
  Td: number;
}

/** What a tuning rule gives: the parallel controller and its ideal form. */
export interface TunedPid {
  /** Parallel gains kp + ki/s + kd·s/(tf·s + 1) (always kind "pid"; ki = 0 / kd = 0 where the variant has none). */
  controller: PidController;
  ideal: IdealGains;
}

/**
 * Parallel gains from the ideal form, kp = K, ki = K/Ti, kd = K·Td, tf = Td/N (pidFromIdealForm).
 * Throws a RangeError when the rule produced a non-finite gain or a non-positive Ti.
 */
export function tunedFromIdeal(ideal: IdealGains, filterDivisor: number = DEFAULT_FILTER_DIVISOR): TunedPid {
  const controller = pidFromIdealForm({ gain: ideal.K, integralTime: ideal.Ti, derivativeTime: ideal.Td, filterDivisor });
  return { controller, ideal: { ...ideal } };
}

/** Checks a filter divisor option: N > 0 and finite. */
export function assertFilterDivisor(n: number): void {
  if (typeof n !== "number" || !Number.isFinite(n) || !(n > 0)) throw new RangeError(`filterDivisor must be a finite number > 0, got ${String(n)}`);
}
