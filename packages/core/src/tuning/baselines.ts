import type { Plant } from "../plants/plant.js";
import { amigoPi, amigoPid } from "./amigo.js";
import { halfRule, type FopdtModel, type SopdtModel } from "./fopdt-half-rule.js";
import { imcPid, lambdaPi } from "./lambda-imc.js";
import { simcPi, simcPid, type SeriesGains } from "./simc.js";
import { assertFilterDivisor, DEFAULT_FILTER_DIVISOR, type TunedPid } from "./tuned-pid.js";
import { ultimatePoint, type UltimatePoint } from "./ultimate-point.js";
import { zieglerNichols } from "./ziegler-nichols.js";

/** The published tuning rules Loopyard draws as baselines. */
export type BaselineRule = "ziegler-nichols" | "simc" | "amigo" | "lambda" | "imc";
/** Controller variant of a baseline. */
export type BaselineVariant = "p" | "pi" | "pid";

/** The model a rule was computed from. */
export type BaselineModel =
  | ({ kind: "ultimate-point"; method: "frequency-response" } & UltimatePoint)
  | ({ kind: "fopdt"; method: "half-rule" } & FopdtModel)
  | ({ kind: "sopdt"; method: "half-rule" } & SopdtModel);

/** One rule's result: the controller, or why the rule does not apply to the plant. */
export type Baseline =
  | ({
      ok: true;
      rule: BaselineRule;
      variant: BaselineVariant;
      label: string;
      model: BaselineModel;
      /** The paper's series form (SIMC PID only). */
      series?: SeriesGains;
      /** Design choices: τc of SIMC, λ of lambda/IMC, N of the derivative filter. */
      tuning: { tauC?: number; lambda?: number; filterDivisor: number };
      note: string;
    } & TunedPid)
  | { ok: false; rule: BaselineRule; variant: BaselineVariant; label: string; reason: string };

/** Options of baselines: the design choices the rules leave open. */
export interface BaselineOptions {
  /** Derivative filter divisor N, tf = Td/N (default DEFAULT_FILTER_DIVISOR = 10). */
  filterDivisor?: number;
  /** SIMC closed-loop time constant τc [s] (default θ of the fit; τ1/10 when θ = 0). */
  tauC?: number;
  /** Lambda/IMC closed-loop time constant λ [s] (default max(τ, θ) of the FOPDT fit). */
  lambda?: number;
}

/** Every baseline, in display order. */
export const BASELINE_RULES: readonly { rule: BaselineRule; variant: BaselineVariant; label: string }[] = [
  { rule: "ziegler-nichols", variant: "p", label: "Ziegler–Nichols P" },
  { rule: "ziegler-nichols", variant: "pi", label: "Ziegler–Nichols PI" },
  { rule: "ziegler-nichols", variant: "pid", label: "Ziegler–Nichols PID" },
  { rule: "simc", variant: "pi", label: "SIMC PI" },
  { rule: "simc", variant: "pid", label: "SIMC PID" },
  { rule: "amigo", variant: "pi", label: "AMIGO PI" },
  { rule: "amigo", variant: "pid", label: "AMIGO PID" },
  { rule: "lambda", variant: "pi", label: "Lambda PI" },
  { rule: "imc", variant: "pid", label: "IMC PID" },
];

/**
 * The published tuning rules computed from a plant model, one entry per rule and variant of
 * BASELINE_RULES, `ok: false` with a reason where a rule does not apply:
 *
 * - Ziegler–Nichols P/PI/PID from the ultimate point of the model's frequency response
 *   (ultimatePoint, zieglerNichols);
 * - SIMC PI from the half-rule FOPDT fit, SIMC PID from the half-rule SOPDT fit (halfRule, simcPi,
 *   simcPid);
 * - AMIGO PI/PID from the half-rule FOPDT fit (amigoPi, amigoPid; needs θ > 0);
 * - lambda PI and IMC PID from the half-rule FOPDT fit (lambdaPi, imcPid).
 *
 * Controllers are parallel PIDs (kind "pid", ki = 0 / kd = 0 where the variant has none) with the
 * derivative filter tf = Td/N. Throws a RangeError naming a bad plant field or option.
 */
export function baselines(plant: Plant, options: BaselineOptions = {}): Baseline[] {
  const filterDivisor = options.filterDivisor ?? DEFAULT_FILTER_DIVISOR;
  assertFilterDivisor(filterDivisor);
  if (options.tauC !== undefined && (!Number.isFinite(options.tauC) || options.tauC < 0)) throw new RangeError(`tauC must be a finite number ≥ 0 s, got ${options.tauC}`);
  if (options.lambda !== undefined && (!Number.isFinite(options.lambda) || !(options.lambda > 0))) throw new RangeError(`lambda must be a finite number > 0 s, got ${options.lambda}`);
  const point = ultimatePoint(plant);
  const fit = halfRule(plant);
  return BASELINE_RULES.map(({ rule, variant, label }): Baseline => {
    const skip = (reason: string): Baseline => ({ ok: false, rule, variant, label, reason });
    if (rule === "ziegler-nichols") {
      if (!point.ok) return skip(point.reason);
      const model: BaselineModel = { kind: "ultimate-point", method: "frequency-response", ...point.point };
      return { ok: true, rule, variant, label, model, ...zieglerNichols(point.point, variant, filterDivisor), tuning: { filterDivisor }, note: "Ziegler & Nichols 1942, ultimate-sensitivity rule, ideal form" };
    }
    if (!fit.ok) return skip(fit.reason);
    const fopdt: BaselineModel = { kind: "fopdt", method: "half-rule", ...fit.fopdt };
    if (rule === "simc" && variant === "pi") {
      if (options.tauC !== undefined && options.tauC + fit.fopdt.theta === 0) return skip("tauC + θ must be > 0; the fit has no dead time");
      const t = simcPi(fit.fopdt, options.tauC, filterDivisor);
      return { ok: true, rule, variant, label, model: fopdt, controller: t.controller, ideal: t.ideal, tuning: { tauC: t.tauC, filterDivisor }, note: "Skogestad 2003, SIMC PI on the half-rule FOPDT fit" };
    }
    if (rule === "simc") {
      if (!(fit.sopdt.tau2 > 0)) return skip("the SOPDT fit has a single lag (τ2 = 0); SIMC PID reduces to the SIMC PI");
      if (options.tauC !== undefined && options.tauC + fit.sopdt.theta === 0) return skip("tauC + θ must be > 0; the fit has no dead time");
      // The half rule's τ2 + τ3/2 can exceed τ1 (three equal lags: τ1 = 1, τ2 = 1.5); the SOPDT model is
      // symmetric in its lags, and SIMC wants the dominant one as τ1, so they are ordered first.
      const ordered = { ...fit.sopdt, tau1: Math.max(fit.sopdt.tau1, fit.sopdt.tau2), tau2: Math.min(fit.sopdt.tau1, fit.sopdt.tau2) };
      const t = simcPid(ordered, options.tauC, filterDivisor);
      const sopdt: BaselineModel = { kind: "sopdt", method: "half-rule", ...ordered };
      const caution = ordered.tau2 < ordered.theta ? "; τ2 < θ: the paper advises PI here (from memory)" : "";
      return { ok: true, rule, variant, label, model: sopdt, controller: t.controller, ideal: t.ideal, series: t.series, tuning: { tauC: t.tauC, filterDivisor }, note: `Skogestad 2003, SIMC PID (series form τD = τ2) on the half-rule SOPDT fit${caution}` };
    }
    if (rule === "amigo") {
      if (!(fit.fopdt.theta > 0)) return skip("the FOPDT fit has no dead time (θ = 0); AMIGO needs θ > 0");
      const t: TunedPid = variant === "pi" ? amigoPi(fit.fopdt, filterDivisor) : amigoPid(fit.fopdt, filterDivisor);
      return { ok: true, rule, variant, label, model: fopdt, ...t, tuning: { filterDivisor }, note: "Åström & Hägglund 2004, AMIGO on the half-rule FOPDT fit (no setpoint weights)" };
    }
    const t = rule === "lambda" ? lambdaPi(fit.fopdt, options.lambda, filterDivisor) : imcPid(fit.fopdt, options.lambda, filterDivisor);
    const note = rule === "lambda" ? "lambda tuning (Dahlin 1968) on the half-rule FOPDT fit" : "Rivera, Morari & Skogestad 1986, IMC-PID with first-order Padé, on the half-rule FOPDT fit";
    return { ok: true, rule, variant, label, model: fopdt, controller: t.controller, ideal: t.ideal, tuning: { lambda: t.lambda, filterDivisor }, note };
  });
}
