import { DEFAULT_SWEEP_CRITERIA, MAX_FAMILY_VARIANTS, sweepInputSchema, type ControllerKind, type CriterionId, type ScenarioKind, type SweepInput } from "@loopyard/core";
import type { Resolver } from "react-hook-form";
import { dottedPath, fieldErrors, type FieldIssue } from "../../forms/field-errors.js";
import { toResolverErrors } from "../../forms/resolver-errors.js";
import { ALL_PARAMETER_KEYS, parameterKey, parameterRows } from "./structure-choices.js";
import {
  DEFAULT_AGGREGATE,
  defaultDesign,
  parseOverrides,
  toAggregate,
  toDesign,
  toFamily,
  type AggregateValues,
  type DesignValues,
  type VariantValues,
} from "./sweep-design-values.js";

export interface RangeValues {
  min: number;
  max: number;
  count: number;
  /** How values spread from min to max: evenly ("linear") or evenly in decades ("log", min > 0). */
  scale?: "linear" | "log";
}

export type AntiWindupChoice = "default" | "back-calculation" | "conditional" | "none";

/**
 * What the sweep form holds. Ranges are kept for every structure's parameters (keyed without
 * brackets: k[2] → k2), so switching the structure keeps what was typed; only the chosen
 * structure's rows are sent. Other paths follow sweepInputSchema so that errors land on the fields.
 */
export interface SweepFormValues {
  name: string;
  plantRevisionId: string;
  /** Label and parameter overrides of the first variant (the plant and revision above). */
  firstVariant: { label: string; parameters: string };
  /** The family's other variants, second to last. */
  variants: VariantValues[];
  design: DesignValues;
  aggregate: AggregateValues;
  structure: ControllerKind;
  ranges: Record<string, RangeValues>;
  filter: { mode: "ratio" | "fixed"; n: number; tf: number };
  sampled: boolean;
  sampleTime: number;
  antiWindup: { kind: AntiWindupChoice; tt: number };
  scenario: {
    kind: ScenarioKind;
    horizon: number;
    dt: number;
    setpoint: number;
    load: { size: number; time: number };
    noiseOn: boolean;
    noise: { sd: number; seed: number };
  };
  criteria: CriterionId[];
  criterionOptions: {
    q: number;
    r: number;
    settlingBand: number;
    /** ISE, effort and quadratic over an infinite horizon (criterionOptions.horizon "infinite"). */
    infiniteHorizon: boolean;
    /** The performance weight of wsNorm, W = (s/M + ωB)/(s + ωB·A) (sent as the preset). */
    weight: { M: number; omegaB: number; A: number };
  };
}

/** Criteria that criterionOptions.horizon "infinite" changes. */
export const INFINITE_HORIZON_CRITERIA: readonly CriterionId[] = ["ise", "effort", "quadratic"];

/**
 * Default performance weight: peak of |S| at most M = 2 (a common robustness target, Skogestad &
 * Postlethwaite 2005, §2.8.2, from memory), steady-state |S| at most A = 1e-4 (integral action), and ωB = 0.1 rad/s,
 * the order of the closed-loop bandwidth of the Ember plates (time constants of 2 to 20 s).
 */
export const DEFAULT_PERFORMANCE_WEIGHT = { M: 2, omegaB: 0.1, A: 1e-4 } as const;

/** What the form needs to know of the chosen plant revision: its state names (for state feedback). */
export interface SweepFormContext {
  stateNames: readonly string[];
}


export const SWEEP_FORM_FIELDS = [
  "name",
  "plantRevisionId",
  "variants",
  "firstVariant.label",
  "firstVariant.parameters",
  ...Array.from({ length: MAX_FAMILY_VARIANTS - 1 }, (_, i) => [`variants.${i}.plantRevisionId`, `variants.${i}.label`, `variants.${i}.parameters`]).flat(),
  "design",
  "design.count",
  "design.seed",
  "design.criterion",
  "design.starts",
  "design.iterations",
  "design.population",
  "design.generations",
  "aggregate",
  "aggregate.p",
  "structure",
  "ranges",
  ...ALL_PARAMETER_KEYS.flatMap((k) => [`ranges.${k}`, `ranges.${k}.min`, `ranges.${k}.max`, `ranges.${k}.count`]),
  "filter",
  "filter.n",
  "filter.tf",
  "sampleTime",
  "antiWindup",
  "antiWindup.tt",
  "scenario",
  "scenario.kind",
  "scenario.horizon",
  "scenario.dt",
  "scenario.setpoint",
  "scenario.load",
  "scenario.load.size",
  "scenario.load.time",
  "scenario.noise",
  "scenario.noise.sd",
  "scenario.noise.seed",
  "criteria",
  "criterionOptions.q",
  "criterionOptions.r",
  "criterionOptions.settlingBand",
  "criterionOptions.horizon",
  "criterionOptions.weight",
  "criterionOptions.weight.M",
  "criterionOptions.weight.omegaB",
  "criterionOptions.weight.A",
] as const;

/**
 * The form field of an API or schema path: brackets of state gains dropped ("ranges.k[0].min" →
 * "ranges.k0.min"), and a fixed value shown at its row ("fixed.kd" → "ranges.kd.min").
 */
export function formFieldOf(path: readonly PropertyKey[] | string): string {
  const dotted = parameterKey(dottedPath(path));
  // family.variants.0.* is the first variant (plant and revision above); the others are variants.(i − 1).*
  const variant = /^family\.variants\.(\d+)(?:\.(plantRevisionId|label|parameters)(?:\..*)?)?$/.exec(dotted);
  if (variant) {
    const i = Number(variant[1]);
    const field = variant[2];
    if (!field) return i === 0 ? "plantRevisionId" : `variants.${i - 1}.plantRevisionId`;
    if (i === 0) return field === "plantRevisionId" ? "plantRevisionId" : `firstVariant.${field}`;
    return `variants.${i - 1}.${field}`;
  }
  if (dotted === "family" || dotted === "family.variants") return "variants";
  const fixed = /^fixed\.([^.]+)$/.exec(dotted);
  return fixed ? `ranges.${fixed[1]}.min` : dotted;
}

/** Problems keyed by form field. */
export function sweepFieldErrors(issues: readonly FieldIssue[]): Record<string, string> {
  return fieldErrors(
    issues.map((i) => ({ path: formFieldOf(i.path), message: i.message })),
    SWEEP_FORM_FIELDS,
  );
}

/** Time samples per simulation the form proposes by default (horizon / dt). */
const DEFAULT_SAMPLES = 1000;

/** A round time step close to horizon / DEFAULT_SAMPLES: 1, 2 or 5 times a power of ten. */
export function defaultTimeStep(horizon: number): number {
  const raw = horizon / DEFAULT_SAMPLES;
  if (!(raw > 0) || !Number.isFinite(raw)) return 0.01;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].find((m) => m * decade >= raw * 0.999) ?? 10;
  return Number((step * decade).toPrecision(12));
}

/** Starting grids per parameter: a few values over a range that suits plants of unit gain. */
const DEFAULT_RANGES: Record<string, RangeValues> = {
  kp: { min: 0.5, max: 5, count: 5 },
  ki: { min: 0.05, max: 1, count: 5 },
  kd: { min: 0, max: 4, count: 3 },
  b: { min: 0.5, max: 1, count: 2 },
  c: { min: 0, max: 0, count: 1 },
  k: { min: 0.5, max: 5, count: 6 },
  tLead: { min: 1, max: 10, count: 5 },
  tLag: { min: 0.1, max: 1, count: 3 },
  n: { min: 1, max: 1, count: 1 },
};

function defaultRanges(): Record<string, RangeValues> {
  const ranges: Record<string, RangeValues> = { ...DEFAULT_RANGES };
  for (let i = 0; i < 10; i++) ranges[`k${i}`] = i < 3 ? { min: 0, max: 2, count: 3 } : { min: 0, max: 0, count: 1 };
  return ranges;
}

export function defaultSweepForm(plantRevisionId = "", horizon = 60): SweepFormValues {
  return {
    name: "",
    plantRevisionId,
    firstVariant: { label: "", parameters: "" },
    variants: [],
    design: defaultDesign(),
    aggregate: { ...DEFAULT_AGGREGATE },
    structure: "pid",
    ranges: defaultRanges(),
    filter: { mode: "ratio", n: 10, tf: 0.1 },
    sampled: false,
    sampleTime: 0.1,
    antiWindup: { kind: "default", tt: 1 },
    scenario: {
      kind: "setpoint-step",
      horizon,
      dt: defaultTimeStep(horizon),
      setpoint: 1,
      load: { size: 1, time: 0 },
      noiseOn: false,
      noise: { sd: 0.01, seed: 1 },
    },
    criteria: [...DEFAULT_SWEEP_CRITERIA],
    criterionOptions: { q: 1, r: 1, settlingBand: 0.02, infiniteHorizon: false, weight: { ...DEFAULT_PERFORMANCE_WEIGHT } },
  };
}

/** The counts of the rows the chosen structure sweeps, in row order. */
export function structureCounts(values: Pick<SweepFormValues, "structure" | "ranges">, context: SweepFormContext): number[] {
  return parameterRows(values.structure, context.stateNames).map((row) => values.ranges?.[row.key]?.count ?? Number.NaN);
}

/** The form values as the API's sweep input: only the chosen structure's rows and the fields its scenario uses. */
export function toSweepInput(values: SweepFormValues, context: SweepFormContext): SweepInput {
  const kind = values.structure;
  const ranges: Record<string, RangeValues> = {};
  for (const row of parameterRows(kind, context.stateNames)) {
    const r = values.ranges?.[row.key] ?? { min: Number.NaN, max: Number.NaN, count: Number.NaN };
    // Designs that draw their own count ignore the ranges' counts (sent as typed, so "run again" keeps them).
    ranges[row.name] = { min: r.min, max: r.count === 1 && Number.isNaN(r.max) ? r.min : r.max, count: r.count };
    if (r.scale === "log") ranges[row.name].scale = "log";
  }
  const s = values.scenario;
  const input: SweepInput = {
    name: values.name,
    plantRevisionId: values.plantRevisionId,
    structure: kind,
    ranges,
    scenario: {
      kind: s.kind,
      horizon: s.horizon,
      dt: s.dt,
      ...(s.kind !== "load-step" ? { setpoint: s.setpoint } : {}),
      ...(s.kind !== "setpoint-step" ? { load: { size: s.load.size, time: s.load.time } } : {}),
      ...(s.noiseOn ? { noise: { sd: s.noise.sd, seed: s.noise.seed } } : {}),
    },
    criteria: Array.isArray(values.criteria) ? values.criteria : values.criteria ? [values.criteria] : [],
  };
  if (values.design) input.design = toDesign(values.design);
  if (values.aggregate && (values.variants?.length ?? 0) > 0) input.aggregate = toAggregate(values.aggregate);
  const family = toFamily({ plantRevisionId: values.plantRevisionId, ...(values.firstVariant ?? { label: "", parameters: "" }) }, values.variants ?? []);
  if (family) input.family = family;
  if (kind === "pid" || kind === "pid2dof") {
    input.filter = values.filter.mode === "ratio" ? { mode: "ratio", n: values.filter.n } : { mode: "fixed", tf: values.filter.tf };
  }
  if (values.sampled) input.sampleTime = values.sampleTime;
  const aw = values.antiWindup;
  if (aw.kind === "none" || aw.kind === "conditional") input.antiWindup = { kind: aw.kind };
  if (aw.kind === "back-calculation") input.antiWindup = { kind: "back-calculation", tt: aw.tt };
  const options: NonNullable<SweepInput["criterionOptions"]> = {};
  if (input.criteria?.includes("quadratic")) Object.assign(options, { q: values.criterionOptions.q, r: values.criterionOptions.r });
  if (input.criteria?.includes("settlingTime")) options.settlingBand = values.criterionOptions.settlingBand;
  if (values.criterionOptions.infiniteHorizon && input.criteria?.some((c) => INFINITE_HORIZON_CRITERIA.includes(c))) options.horizon = "infinite";
  if (input.criteria?.includes("wsNorm")) {
    const w = values.criterionOptions.weight ?? DEFAULT_PERFORMANCE_WEIGHT;
    options.weight = { preset: "performance", M: w.M, omegaB: w.omegaB, A: w.A };
  }
  if (Object.keys(options).length > 0) input.criterionOptions = options;
  return input;
}

/** react-hook-form resolver: checks the input with the shared sweepInputSchema and puts each problem at its field. */
export const sweepFormResolver: Resolver<SweepFormValues, SweepFormContext, SweepInput> = async (values, context) => {
  const input = toSweepInput(values, context ?? { stateNames: [] });
  const parsed = sweepInputSchema.safeParse(input);
  // Overrides that do not read as name = value lists are the form's own problem (the schema never sees the text).
  const overrideIssues: FieldIssue[] = [];
  const checkOverrides = (text: string | undefined, path: string) => {
    const result = parseOverrides(text ?? "");
    if (!result.ok) overrideIssues.push({ path, message: result.message });
  };
  checkOverrides(values.firstVariant?.parameters, "firstVariant.parameters");
  (values.variants ?? []).forEach((v, i) => checkOverrides(v.parameters, `variants.${i}.parameters`));
  if (parsed.success && overrideIssues.length === 0) return { values: input, errors: {} };
  const issues = [...(parsed.success ? [] : parsed.error.issues), ...overrideIssues];
  return { values: {}, errors: toResolverErrors<SweepFormValues>(sweepFieldErrors(issues)) };
};
