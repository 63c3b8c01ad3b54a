import { aggregateScores } from "../aggregates/aggregate-scores.js";
import type { DeploymentSheetDto, DeploymentVariantDto, FormDto } from "../api/deployment-sheet-dto.js";
import type { ScoreValue } from "../api/dto.js";
import { STATUS_DIVERGED, STATUS_STABLE } from "../batch/batch-status.js";
import type { Controller } from "../controllers/controller.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { criterionSense } from "../criteria/criterion-sense.js";
import { CRITERIA } from "../criteria/registry.js";
import { evaluateCandidate } from "../evaluation/evaluate-candidate.js";
import { MAX_SIMULATION_SAMPLES } from "../limits.js";
import type { ActuatorLimits } from "../plants/actuator-limits.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant } from "../plants/plant.js";
import type { LoopTrace } from "../simulation/loop-trace.js";
import { discreteControllerLoopStability } from "../stability/sampled-loop-stability.js";
import { deployablePid } from "./deployable-pid.js";
import { DEPLOYMENT_CAUTION, DeploymentSheetError, type DeploymentDesign, type DeploymentSheetRequest } from "./deployment-design.js";
import { deploymentSheet } from "./deployment-sheet.js";
import { differenceEquations } from "./difference-equations.js";
import { DISCRETE_PID_COEFFICIENTS, DISCRETIZATION_METHODS, type DiscretePid, type DiscretePidCoefficients } from "./discrete-pid.js";
import { discretePidRealization } from "./discrete-pid-realization.js";
import { FIXED_POINT_FORMATS } from "./fixed-point.js";
import { simulateSampledLoop } from "./simulate-sampled-loop.js";

/** The sample time may be at most this fraction of the scenario's horizon (the re-simulation must see the loop settle). */
export const MAX_SAMPLE_TIME_FRACTION = 0.1;

/** Halvings of h tried to suggest a sample time at which an unstable sampled loop becomes stable. */
const SUGGESTION_HALVINGS = 16;

/** The margins every sheet shows (continuous loop). */
const MARGINS = ["gainMargin", "phaseMargin", "ms"] as const satisfies readonly CriterionId[];

const MEANINGS: Record<keyof DiscretePidCoefficients, string> = {
  pr: "proportional gain on r (kp·b)",
  py: "proportional gain on y (kp)",
  bi1: "integral gain on e[k]",
  bi0: "integral gain on e[k−1]",
  ad: "derivative filter pole",
  dr: "derivative gain on Δr (c·bd)",
  dy: "derivative gain on Δy (bd)",
  at: "anti-windup tracking gain h/Tt",
};

/**
 * The deployment sheet of a design (DeploymentSheetDto): the controller's parallel, ideal and series
 * forms and set-point weights (pidForms), its difference equations at the reader's sample time and
 * method with back-calculation anti-windup, output limits and rate limit (discretizePid), optionally
 * the coefficients in Q15 or Q31 (roundToFixedPoint); on every variant the continuous loop's scores
 * and margins (evaluateCandidate), and for linear plants the sampled loop re-simulated with the exact
 * and with the rounded coefficients (simulateSampledLoop, each time criterion of the registry on its
 * trace; frequency criteria are not recomputed for the sampled loop); the family's aggregates.
 *
 * The output limits are those every variant's actuator obeys (the largest min, the smallest max and
 * rate; a note when the variants differ). The tracking time follows the design's anti-windup
 * (back-calculation's tt; none: off; conditional integration, which has no difference equation
 * here: the default √(Ti·Td) with a note).
 *
 * Refuses, with a DeploymentSheetError naming the field:
 * - a sample time that is not a finite number > 0, an unknown method or format ("invalid");
 * - a controller that is not P, PI, PID or 2-DOF PID; a sample time above a tenth of the horizon;
 *   a re-simulation of more than MAX_SIMULATION_SAMPLES samples; a sample time at which the sampled
 *   loop (difference equations, limits not reached) is unstable on some variant
 *   (discreteControllerLoopStability) while the continuous loop is stable — with the largest of
 *   h/2, h/4, … at which it is stable everywhere ("unsuitable").
 */
export function buildDeploymentSheet(design: DeploymentDesign, request: DeploymentSheetRequest): DeploymentSheetDto {
  const h = request.sampleTime;
  if (typeof h !== "number" || !Number.isFinite(h) || h <= 0) {
    throw new DeploymentSheetError("sampleTime", `The sample time must be a number of seconds greater than 0 (e.g. 0.001 for 1 kHz); got ${String(h)}.`, "invalid");
  }
  if (!(DISCRETIZATION_METHODS as readonly string[]).includes(request.method)) {
    throw new DeploymentSheetError("method", `The method must be tustin or backward-euler; got “${String(request.method)}”.`, "invalid");
  }
  const format = request.format ?? null;
  if (format !== null && !(format in FIXED_POINT_FORMATS)) {
    throw new DeploymentSheetError("format", `The fixed-point format must be q15 or q31 (or left out for none); got “${String(format)}”.`, "invalid");
  }
  if (design.variants.length === 0) throw new DeploymentSheetError("variants", "The design has no plant variant to deploy on.", "unsuitable");
  const kind = design.controller.kind;
  if (kind !== "p" && kind !== "pi" && kind !== "pid" && kind !== "pid2dof") {
    throw new DeploymentSheetError(
      "controller",
      `The deployment sheet covers P, PI, PID and two-degree-of-freedom PID controllers; this design is a ${kind === "lead-lag" ? "lead–lag" : "state-feedback"} controller.`,
      "unsuitable",
    );
  }
  const { horizon, dt } = design.scenario;
  if (h > MAX_SAMPLE_TIME_FRACTION * horizon) {
    throw new DeploymentSheetError(
      "sampleTime",
      `A sample time of ${fmt(h)} s is too coarse for the scenario's ${fmt(horizon)} s horizon: choose at most ${fmt(MAX_SAMPLE_TIME_FRACTION * horizon)} s, so the re-simulated loop is seen to settle.`,
      "unsuitable",
    );
  }
  // simulateSampledLoop's grid: hs = h/⌈h/dt⌉ ≤ dt, horizon/hs + 1 samples.
  const hs = h / Math.max(1, Math.ceil(h / dt - 1e-9));
  const samples = Math.round(horizon / hs) + 1;
  if (samples > MAX_SIMULATION_SAMPLES) {
    throw new DeploymentSheetError(
      "sampleTime",
      `At h = ${fmt(h)} s the re-simulation of the ${fmt(horizon)} s horizon would take ${samples.toLocaleString("en-GB")} samples, more than the ${MAX_SIMULATION_SAMPLES.toLocaleString("en-GB")} allowed; choose h ≥ ${fmt(horizon / (MAX_SIMULATION_SAMPLES - 1))} s.`,
      "unsuitable",
    );
  }

  const notes: string[] = [];
  const limits = commonLimits(design, notes);
  const trackingTime = designTrackingTime(design.controller, notes);
  const sheet = deploymentSheet(design.controller, {
    sampleTime: h,
    method: request.method,
    limits,
    ...(trackingTime !== undefined ? { trackingTime } : {}),
    ...(format ? { fixedPoint: { format } } : {}),
  });
  notes.push(...sheet.notes);
  const pid = deployablePid(design.controller);
  const criteria = design.criteria;
  const continuousController = { ...design.controller } as Controller;
  delete continuousController.sampleTime;
  const wanted = [...new Set<CriterionId>([...criteria, ...MARGINS])];
  const label = (i: number) => design.variants[i]?.label ?? `variant ${i + 1}`;

  const variants: DeploymentVariantDto[] = [];
  for (const [i, variant] of design.variants.entries()) {
    const continuous = evaluateCandidate(variant.plant, continuousController, design.scenario, wanted, {
      poles: false,
      ...(design.criterionOptions ? { criterion: design.criterionOptions } : {}),
    });
    const scoresOf = (s: Record<CriterionId, number> | null) => (s ? criteria.map((id) => scoreValue(s[id])) : null);
    const entry: DeploymentVariantDto = {
      label: variant.label,
      revision: variant.revision ?? null,
      sampledPoleRadius: null,
      margins: {
        gainMargin: scoreValue(continuous.scores?.gainMargin ?? Number.NaN),
        phaseMargin: scoreValue(continuous.scores?.phaseMargin ?? Number.NaN),
        ms: scoreValue(continuous.scores?.ms ?? Number.NaN),
      },
      continuous: { status: continuous.status, scores: scoresOf(continuous.scores) },
      sampled: null,
      rounded: null,
    };
    if (variant.plant.kind === "nonlinear") {
      entry.skipped = "A nonlinear plant is not re-simulated with the difference equations; its continuous scores are shown.";
      variants.push(entry);
      continue;
    }
    const plant = variant.plant as LinearPlant;
    const verdict = sampledVerdict(plant, sheet.discrete);
    entry.sampledPoleRadius = verdict.radius;
    if (verdict.stable === false) {
      if (continuous.status === "unstable") {
        throw new DeploymentSheetError("design", `This design is unstable on ${label(i)} even in continuous time, so no sample time makes it deployable; choose another design.`, "unsuitable");
      }
      const better = stableSampleTime(design, sheet.discrete.pid, request, limits, trackingTime);
      throw new DeploymentSheetError(
        "sampleTime",
        `At h = ${fmt(h)} s (${request.method === "tustin" ? "Tustin" : "backward Euler"}) the sampled loop is unstable on ${label(i)}` +
          (verdict.radius !== null ? ` (a closed-loop pole at |z| = ${verdict.radius.toPrecision(3)})` : "") +
          `: sample faster${better !== null ? `; it is stable on every variant at h = ${fmt(better)} s` : ""}.`,
        "unsuitable",
      );
    }
    entry.sampled = sampledScores(plant, sheet.discrete, design, criteria);
    if (sheet.fixedPoint) {
      entry.rounded = sampledScores(plant, sheet.fixedPoint.discrete, design, criteria);
      const roundedVerdict = sampledVerdict(plant, sheet.fixedPoint.discrete);
      if (roundedVerdict.stable === false) notes.push(`With the ${format!.toUpperCase()} coefficients the sampled loop is unstable on ${label(i)}; use ${format === "q15" ? "Q31" : "a floating-point implementation"} or another scaling.`);
    }
    variants.push(entry);
  }

  const aggregate = design.aggregate ?? { kind: "worst" as const };
  const aggregateOf = (pick: (v: DeploymentVariantDto) => { ok: boolean; scores: ScoreValue[] | null } | null): ScoreValue[] => {
    const F = variants.length;
    const C = criteria.length;
    const scores = new Float64Array(F * C);
    const status = new Uint8Array(F);
    for (const [f, v] of variants.entries()) {
      const entry = pick(v);
      status[f] = entry && entry.ok && entry.scores ? STATUS_STABLE : STATUS_DIVERGED;
      for (let c = 0; c < C; c++) scores[f * C + c] = fromScoreValue(entry?.scores?.[c] ?? null);
    }
    return Array.from(aggregateScores(scores, status, 1, F, criteria, aggregate), scoreValue);
  };
  const hasSampled = variants.some((v) => v.sampled !== null);
  const dto: DeploymentSheetDto = {
    version: 1,
    request: { sampleTime: h, method: request.method, format },
    controller: { kind, parameters: controllerParameters(design.controller) },
    forms: formsDto(sheet.forms),
    discrete: {
      method: sheet.discrete.method,
      sampleTime: h,
      coefficients: DISCRETE_PID_COEFFICIENTS.map((name) => ({ name, value: sheet.discrete.coefficients[name], meaning: MEANINGS[name] })),
      equations: differenceEquations(sheet.discrete),
      limits: {
        min: finiteOrNull(sheet.discrete.limits.min),
        max: finiteOrNull(sheet.discrete.limits.max),
        rate: finiteOrNull(limits.rate ?? Number.POSITIVE_INFINITY),
        step: finiteOrNull(sheet.discrete.limits.step),
      },
      trackingTime: finiteOrNull(sheet.discrete.trackingTime),
    },
    fixedPoint: sheet.fixedPoint
      ? {
          format: sheet.fixedPoint.report.format,
          fractionalBits: sheet.fixedPoint.report.fractionalBits,
          coefficients: sheet.fixedPoint.report.coefficients.map((c) => ({ ...c })),
          equations: differenceEquations(sheet.fixedPoint.discrete),
        }
      : null,
    criteria: criteria.map((id) => ({ id, label: CRITERIA[id].label, unit: CRITERIA[id].unit, better: criterionSense(id) })),
    variants,
    aggregate: {
      kind: aggregate,
      continuous: aggregateOf((v) => ({ ok: v.continuous.status === "stable", scores: v.continuous.scores })),
      sampled: hasSampled ? aggregateOf((v) => (v.sampled ? { ok: v.sampled.status === "ok", scores: v.sampled.scores } : null)) : criteria.map(() => null),
      rounded: sheet.fixedPoint && hasSampled ? aggregateOf((v) => (v.rounded ? { ok: v.rounded.status === "ok", scores: v.rounded.scores } : null)) : null,
    },
    scenario: design.scenario,
    notes,
    caution: DEPLOYMENT_CAUTION,
  };
  if (pid.kd !== 0 && request.method === "backward-euler" && h > pid.tf) {
    dto.notes.push(`At h = ${fmt(h)} s > tf = ${fmt(pid.tf)} s backward Euler blurs the derivative filter (its pole tf/(tf + h) = ${sheet.discrete.coefficients.ad.toPrecision(3)}); a shorter sample time keeps the design's derivative action.`);
  }
  return dto;
}

/** The sampled loop's verdict with the discrete PID's own difference equations (limits not reached). */
function sampledVerdict(plant: LinearPlant, discrete: DiscretePid): { stable: boolean | null; radius: number | null } {
  const model = linearPlantModel(plant);
  const verdict = discreteControllerLoopStability(model.ss, model.delay, discrete.sampleTime, discretePidRealization(discrete));
  const radius = verdict.poles.length > 0 ? Math.max(...verdict.poles.map((z) => Math.hypot(z.re, z.im))) : null;
  return { stable: verdict.stable, radius };
}

/** The largest of h/2, h/4, … (at most SUGGESTION_HALVINGS halvings) at which the sampled loop is stable on every linear variant; null if none. */
function stableSampleTime(design: DeploymentDesign, pid: ReturnType<typeof deployablePid>, request: DeploymentSheetRequest, limits: ActuatorLimits, trackingTime: number | undefined): number | null {
  let h = request.sampleTime;
  for (let k = 0; k < SUGGESTION_HALVINGS; k++) {
    h /= 2;
    const candidate = deploymentSheet({ kind: "pid2dof", ...pid }, { sampleTime: h, method: request.method, limits, ...(trackingTime !== undefined ? { trackingTime } : {}) }).discrete;
    const everywhere = design.variants.every((v) => v.plant.kind === "nonlinear" || sampledVerdict(v.plant as LinearPlant, candidate).stable !== false);
    if (everywhere) return h;
  }
  return null;
}

function sampledScores(plant: LinearPlant, discrete: DiscretePid, design: DeploymentDesign, criteria: readonly CriterionId[]): { status: LoopTrace["status"]; scores: ScoreValue[] | null } {
  const trace = simulateSampledLoop(plant, discrete, design.scenario);
  if (trace.status === "diverged") return { status: "diverged", scores: null };
  return {
    status: trace.status,
    scores: criteria.map((id) => (CRITERIA[id].kind === "time" ? scoreValue(CRITERIA[id].compute(trace, design.criterionOptions)) : null)),
  };
}

/** Limits every variant's actuator obeys: the largest min, the smallest max and rate. */
function commonLimits(design: DeploymentDesign, notes: string[]): ActuatorLimits {
  const all = design.variants.map((v) => v.plant.actuator ?? {});
  const pick = (key: keyof ActuatorLimits, choose: (a: number, b: number) => number) => {
    const values = all.map((a) => a[key]).filter((v): v is number => v !== undefined);
    return values.length > 0 ? values.reduce((a, b) => choose(a, b)) : undefined;
  };
  const limits: ActuatorLimits = {};
  const min = pick("min", Math.max);
  const max = pick("max", Math.min);
  const rate = pick("rate", Math.min);
  if (min !== undefined) limits.min = min;
  if (max !== undefined) limits.max = max;
  if (rate !== undefined) limits.rate = rate;
  if (min !== undefined && max !== undefined && !(max > min)) {
    throw new DeploymentSheetError("variants", `The variants' actuators have no common range (largest min ${fmt(min)} ≥ smallest max ${fmt(max)}); deploy on fewer variants.`, "unsuitable");
  }
  const same = all.every((a) => a.min === all[0]!.min && a.max === all[0]!.max && a.rate === all[0]!.rate);
  if (!same) notes.push("The variants' actuators differ; the difference equations use the limits all of them obey (the largest minimum, the smallest maximum and rate).");
  return limits;
}

/** The tracking time the design's anti-windup asks for (undefined: the default √(Ti·Td)). */
function designTrackingTime(controller: Controller, notes: string[]): number | undefined {
  const aw = controller.antiWindup;
  if (!aw) return undefined;
  if (aw.kind === "none") return Number.POSITIVE_INFINITY;
  if (aw.kind === "back-calculation") return aw.tt;
  notes.push("The design uses conditional integration; the difference equations use back-calculation with the default tracking time √(Ti·Td) instead.");
  return undefined;
}

function controllerParameters(controller: Controller): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, value] of Object.entries(controller)) if (typeof value === "number") out[name] = value;
  return out;
}

function formsDto(forms: ReturnType<typeof deploymentSheet>["forms"]): DeploymentSheetDto["forms"] {
  const ideal: FormDto<{ gain: number; integralTime: number | null; derivativeTime: number; filterDivisor: number | null }> = forms.ideal.exists
    ? { exists: true, gain: forms.ideal.gain, integralTime: finiteOrNull(forms.ideal.integralTime), derivativeTime: forms.ideal.derivativeTime, filterDivisor: finiteOrNull(forms.ideal.filterDivisor) }
    : { exists: false, reason: forms.ideal.reason };
  const series: FormDto<{ gain: number; integralTime: number | null; derivativeTime: number; filterTime: number }> = forms.series.exists
    ? { exists: true, gain: forms.series.gain, integralTime: finiteOrNull(forms.series.integralTime), derivativeTime: forms.series.derivativeTime, filterTime: forms.series.filterTime }
    : { exists: false, reason: forms.series.reason };
  return { parallel: { ...forms.parallel }, ideal, series, weights: { ...forms.weights } };
}

function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** A score as it goes out in JSON: finite as is, ±Infinity as "inf"/"-inf", NaN as null. */
function scoreValue(value: number): ScoreValue {
  if (Number.isFinite(value)) return value;
  if (value === Number.POSITIVE_INFINITY) return "inf";
  if (value === Number.NEGATIVE_INFINITY) return "-inf";
  return null;
}

function fromScoreValue(value: ScoreValue): number {
  if (typeof value === "number") return value;
  if (value === "inf") return Number.POSITIVE_INFINITY;
  if (value === "-inf") return Number.NEGATIVE_INFINITY;
  return Number.NaN;
}

/** A time or value for a sentence: up to 4 significant digits. */
function fmt(value: number): string {
  return Number(value.toPrecision(4)).toString();
}
