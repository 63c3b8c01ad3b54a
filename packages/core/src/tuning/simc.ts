import type { FopdtModel, SopdtModel } from "./fopdt-half-rule.js";
import { DEFAULT_FILTER_DIVISOR, tunedFromIdeal, type IdealGains, type TunedPid } from "./tuned-pid.js";

/** SIMC integral time limit factor: τI = min(τ1, 4(τc + θ)). */
export const SIMC_INTEGRAL_FACTOR = 4;
/**
 * Default τc when the model has no dead time (θ = 0): τc = θ would ask for infinite gain, and the
 * paper leaves τc free then; we take τc = τ1/10 (our choice).
 */
export const SIMC_DELAY_FREE_TAU_C_FRACTION = 0.1;

/** The series (cascade) form Kc·(τI·s + 1)/(τI·s)·(τD·s + 1) of the SIMC PID. */
export interface SeriesGains {
  Kc: number;
  tauI: number;
  tauD: number;
}

/** A SIMC result: the tuned controller, the τc used, and for the PID the paper's series form. */
export interface SimcTuning extends TunedPid {
  tauC: number;
  series?: SeriesGains;
}

/**
 * The default closed-loop time constant of SIMC: τc = θ ("tight control", Skogestad 2003 §4),
 * or τ1·SIMC_DELAY_FREE_TAU_C_FRACTION when θ = 0.
 */
export function simcDefaultTauC(theta: number, tau1: number): number {
  return theta > 0 ? theta : SIMC_DELAY_FREE_TAU_C_FRACTION * tau1;
}

/**
 * SIMC PI for a first-order plus dead time model k·e^(−θs)/(τ1·s + 1):
 *
 *   Kc = (1/k)·τ1/(τc + θ),   τI = min(τ1, 4(τc + θ)),   default τc = θ (simcDefaultTauC).
 *
 * Ideal form K = Kc, Ti = τI. Throws a RangeError naming a bad model field or τc.
 * Reference: S. Skogestad, "Simple analytic rules for model reduction and PID controller tuning",
 * Journal of Process Control 13 (2003) 291–309, Table 1 / eq. (20)–(21) (equation numbers from memory).
 */
export function simcPi(model: FopdtModel, tauC?: number, filterDivisor: number = DEFAULT_FILTER_DIVISOR): SimcTuning {
  assertModel(model.k, model.tau, model.theta, "model.tau");
  const tc = tauC ?? simcDefaultTauC(model.theta, model.tau);
  assertTauC(tc, model.theta);
  const Kc = model.tau / (model.k * (tc + model.theta));
  const tauI = Math.min(model.tau, SIMC_INTEGRAL_FACTOR * (tc + model.theta));
  return { ...tunedFromIdeal({ K: Kc, Ti: tauI, Td: 0 }, filterDivisor), tauC: tc };
}

/**
 * SIMC PID for a second-order plus dead time model k·e^(−θs)/((τ1·s + 1)(τ2·s + 1)), in the
 * paper's series form
 *
 *   c(s) = Kc·(τI·s + 1)/(τI·s)·(τD·s + 1),   Kc = (1/k)·τ1/(τc + θ),   τI = min(τ1, 4(τc + θ)),   τD = τ2,
 *
 * converted to the ideal form by multiplying out (Skogestad 2003, eq. (36) — from memory):
 *
 *   K = Kc·(1 + τD/τI),   Ti = τI·(1 + τD/τI) = τI + τD,   Td = τD/(1 + τD/τI),
 *
 * then to parallel gains with the derivative filter tf = Td/N (the paper gives none).
 * Default τc = θ (simcDefaultTauC). Throws a RangeError naming a bad model field or τc.
 */
export function simcPid(model: SopdtModel, tauC?: number, filterDivisor: number = DEFAULT_FILTER_DIVISOR): SimcTuning {
  assertModel(model.k, model.tau1, model.theta, "model.tau1");
  if (!Number.isFinite(model.tau2) || model.tau2 < 0 || model.tau2 > model.tau1) {
    throw new RangeError(`model.tau2 must be a finite number in [0, tau1], got ${model.tau2}`);
  }
  const tc = tauC ?? simcDefaultTauC(model.theta, model.tau1);
  assertTauC(tc, model.theta);
  const series: SeriesGains = {
    Kc: model.tau1 / (model.k * (tc + model.theta)),
    tauI: Math.min(model.tau1, SIMC_INTEGRAL_FACTOR * (tc + model.theta)),
    tauD: model.tau2,
  };
  return { ...tunedFromIdeal(seriesToIdeal(series), filterDivisor), tauC: tc, series };
}

/** Series (interacting) PID Kc(1 + 1/(τI s))(1 + τD s) to the ideal form (see simcPid). */
export function seriesToIdeal(series: SeriesGains): IdealGains {
  const f = 1 + series.tauD / series.tauI;
  return { K: series.Kc * f, Ti: series.tauI * f, Td: series.tauD / f };
}

function assertModel(k: number, tau: number, theta: number, tauField: string): void {
  if (!Number.isFinite(k) || k === 0) throw new RangeError(`model.k must be a finite non-zero gain, got ${k}`);
  if (!Number.isFinite(tau) || !(tau > 0)) throw new RangeError(`${tauField} must be a finite time constant > 0 s, got ${tau}`);
  if (!Number.isFinite(theta) || theta < 0) throw new RangeError(`model.theta must be a finite dead time ≥ 0 s, got ${theta}`);
}

function assertTauC(tc: number, theta: number): void {
  if (!Number.isFinite(tc) || tc < 0 || !(tc + theta > 0)) throw new RangeError(`tauC must be a finite number ≥ 0 s with tauC + θ > 0, got ${tc}`);
}
