import type { FopdtModel } from "./fopdt-half-rule.js";
import { DEFAULT_FILTER_DIVISOR, tunedFromIdeal, type TunedPid } from "./tuned-pid.js";

/** Padé factor: e^(−θs) ≈ (1 − θs/2)/(1 + θs/2) in the IMC-PID derivation. */
const PADE_HALF = 2;

/** A lambda or IMC result: the tuned controller and the closed-loop time constant λ used. */
export interface LambdaTuning extends TunedPid {
  lambda: number;
}

/**
 * Default closed-loop time constant λ = max(τ, θ): the closed loop as fast as the open loop, and
 * never faster than the dead time (a conservative, common choice for lambda tuning — common
 * practice; Rivera et al. 1986 ask for λ > 0.8θ with the Padé PID, which this satisfies).
 */
export function defaultLambda(model: FopdtModel): number {
  return Math.max(model.tau, model.theta);
}

/**
 * Lambda-tuned PI for k·e^(−θs)/(τs + 1): the IMC design with the dead time taken as
 * e^(−θs) ≈ 1 − θs and the filter 1/(λs + 1), which cancels the plant lag:
 *
 *   Kc = τ/(k(λ + θ)),   Ti = τ,   default λ = max(τ, θ).
 *
 * Throws a RangeError naming a bad model field or λ.
 * References: E. B. Dahlin, "Designing and tuning digital controllers", Instruments and Control
 * Systems 41(6) (1968) 77–83; K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §6.5
 * (lambda tuning: K = T/(Kp(L + Tcl)), Ti = T — section from memory).
 */
export function lambdaPi(model: FopdtModel, lambda?: number, filterDivisor: number = DEFAULT_FILTER_DIVISOR): LambdaTuning {
  checkModel(model);
  const l = lambda ?? defaultLambda(model);
  checkLambda(l);
  return { ...tunedFromIdeal({ K: model.tau / (model.k * (l + model.theta)), Ti: model.tau, Td: 0 }, filterDivisor), lambda: l };
}

/**
 * IMC-PID for k·e^(−θs)/(τs + 1) with the first-order Padé approximant of the dead time and the
 * IMC filter 1/(λs + 1). With q = (τs + 1)(1 + θs/2)/(k(λs + 1)) the feedback controller
 * c = q/(1 − g̃q) = (τs + 1)(θs/2 + 1)/(k(λ + θ/2)s); multiplied out into the ideal form:
 *
 *   Kc = (2τ + θ)/(k(2λ + θ)),   Ti = τ + θ/2,   Td = τθ/(2τ + θ),
 *
 * with the derivative filter tf = Td/N (N = DEFAULT_FILTER_DIVISOR unless given; the paper's
 * variant with its own filter is not used). Default λ = max(τ, θ).
 * Throws a RangeError naming a bad model field or λ.
 * Reference: D. E. Rivera, M. Morari and S. Skogestad, "Internal model control. 4. PID controller
 * design", Ind. Eng. Chem. Process Des. Dev. 25 (1986) 252–265, Table I (first-order lag with
 * dead time, PID row — table layout from memory; the formulas re-derived above).
 */
export function imcPid(model: FopdtModel, lambda?: number, filterDivisor: number = DEFAULT_FILTER_DIVISOR): LambdaTuning {
  checkModel(model);
  const l = lambda ?? defaultLambda(model);
  checkLambda(l);
  const { k, tau, theta } = model;
  const K = (PADE_HALF * tau + theta) / (k * (PADE_HALF * l + theta));
  const Ti = tau + theta / PADE_HALF;
  const Td = (tau * theta) / (PADE_HALF * tau + theta);
  return { ...tunedFromIdeal({ K, Ti, Td }, filterDivisor), lambda: l };
}

function checkModel(model: FopdtModel): void {
  if (!Number.isFinite(model.k) || model.k === 0) throw new RangeError(`model.k must be a finite non-zero gain, got ${model.k}`);
  if (!Number.isFinite(model.tau) || !(model.tau > 0)) throw new RangeError(`model.tau must be a finite time constant > 0 s, got ${model.tau}`);
  if (!Number.isFinite(model.theta) || model.theta < 0) throw new RangeError(`model.theta must be a finite dead time ≥ 0 s, got ${model.theta}`);
}

function checkLambda(l: number): void {
  if (!Number.isFinite(l) || !(l > 0)) throw new RangeError(`lambda must be a finite closed-loop time constant > 0 s, got ${l}`);
}
