import type { FopdtModel } from "./fopdt-half-rule.js";
import { DEFAULT_FILTER_DIVISOR, tunedFromIdeal, type TunedPid } from "./tuned-pid.js";

// AMIGO PI (Åström & Hägglund 2004, eq. for PI; Advanced PID Control 2006, eq. (7.6) — numbering from memory),
// with process gain Kp, dead time L and time constant T:
//   K  = 0.15/Kp + (0.35 − L·T/(L + T)²)·T/(Kp·L)
//   Ti = 0.35·L + 13·L·T²/(T² + 12·L·T + 7·L²)
export const AMIGO_PI_K0 = 0.15;
export const AMIGO_PI_K1 = 0.35;
export const AMIGO_PI_TI0 = 0.35;
export const AMIGO_PI_TI1 = 13;
export const AMIGO_PI_TI_B = 12;
export const AMIGO_PI_TI_C = 7;

// AMIGO PID (Åström & Hägglund 2004; 2006, eq. (7.?) — from memory):
//   K  = (1/Kp)·(0.2 + 0.45·T/L)
//   Ti = (0.4·L + 0.8·T)/(L + 0.1·T)·L
//   Td = 0.5·L·T/(0.3·L + T)
export const AMIGO_PID_K0 = 0.2;
export const AMIGO_PID_K1 = 0.45;
export const AMIGO_PID_TI_A = 0.4;
export const AMIGO_PID_TI_B = 0.8;
export const AMIGO_PID_TI_C = 0.1;
export const AMIGO_PID_TD_A = 0.5;
export const AMIGO_PID_TD_B = 0.3;

/**
 * AMIGO PI and PID settings for a first-order plus dead time model Kp·e^(−Ls)/(T·s + 1)
 * (in Loopyard's notation k = Kp, τ = T, θ = L):
 *
 *   PI:  K = 0.15/Kp + (0.35 − LT/(L + T)²)·T/(Kp·L),   Ti = 0.35L + 13LT²/(T² + 12LT + 7L²)
 *   PID: K = (1/Kp)(0.2 + 0.45T/L),   Ti = (0.4L + 0.8T)/(L + 0.1T)·L,   Td = 0.5LT/(0.3L + T)
 *
 * in the ideal form with error feedback on every term (the paper's setpoint weights b, c are not
 * applied here: a baseline is a one-degree-of-freedom PID like the other candidates). The paper
 * fits the FOPDT model to a step response; Loopyard's baselines feed it the half-rule fit
 * (halfRule), which may differ. Needs L > 0; the PID rule is meant for relative dead time
 * L/(L + T) ≳ 0.15 (the paper reports it conservative below — from memory).
 * Derivative filter tf = Td/N, N = DEFAULT_FILTER_DIVISOR unless given.
 * Throws a RangeError naming a bad model field.
 *
 * References: K. J. Åström and T. Hägglund, "Revisiting the Ziegler–Nichols step response method
 * for PID control", Journal of Process Control 14 (2004) 635–650; K. J. Åström and T. Hägglund,
 * Advanced PID Control, ISA, 2006, §7.
 */
export function amigoPi(model: FopdtModel, filterDivisor: number = DEFAULT_FILTER_DIVISOR): TunedPid {
  const { Kp, L, T } = checked(model);
  const K = AMIGO_PI_K0 / Kp + ((AMIGO_PI_K1 - (L * T) / (L + T) ** 2) * T) / (Kp * L);
  const Ti = AMIGO_PI_TI0 * L + (AMIGO_PI_TI1 * L * T * T) / (T * T + AMIGO_PI_TI_B * L * T + AMIGO_PI_TI_C * L * L);
  return tunedFromIdeal({ K, Ti, Td: 0 }, filterDivisor);
}

/** AMIGO PID; see amigoPi. */
export function amigoPid(model: FopdtModel, filterDivisor: number = DEFAULT_FILTER_DIVISOR): TunedPid {
  const { Kp, L, T } = checked(model);
  const K = (AMIGO_PID_K0 + (AMIGO_PID_K1 * T) / L) / Kp;
  const Ti = ((AMIGO_PID_TI_A * L + AMIGO_PID_TI_B * T) / (L + AMIGO_PID_TI_C * T)) * L;
  const Td = (AMIGO_PID_TD_A * L * T) / (AMIGO_PID_TD_B * L + T);
  return tunedFromIdeal({ K, Ti, Td }, filterDivisor);
}

function checked(model: FopdtModel): { Kp: number; L: number; T: number } {
  if (!Number.isFinite(model.k) || model.k === 0) throw new RangeError(`model.k must be a finite non-zero gain, got ${model.k}`);
  if (!Number.isFinite(model.tau) || model.tau < 0) throw new RangeError(`model.tau must be a finite time constant ≥ 0 s, got ${model.tau}`);
  if (!Number.isFinite(model.theta) || !(model.theta > 0)) throw new RangeError(`model.theta must be a dead time > 0 s for AMIGO, got ${model.theta}`);
  return { Kp: model.k, L: model.theta, T: model.tau };
}
