import { comparisonInputSchema, CRITERION_IDS, type ComparisonDetailDto, type CriterionId, type SweepDetailDto } from "@loopyard/core";
import type { Resolver } from "react-hook-form";
import { dottedPath, fieldErrors, type FieldIssue } from "../../forms/field-errors.js";
import { toResolverErrors } from "../../forms/resolver-errors.js";
import { parameterKey } from "../sweeps/structure-choices.js";
import { formatOverrides, fromAggregate, parseOverrides } from "../sweeps/sweep-design-values.js";
import { formFromSweep } from "../sweeps/sweep-prefill.js";
import { defaultSweepForm, formFieldOf, SWEEP_FORM_FIELDS, toSweepInput, type SweepFormContext, type SweepFormValues } from "../sweeps/sweep-form-values.js";

/**
 * The comparison form: the sweep form's values for what the two share (family, structure with its
 * box — a range's min and max, a range with min = max is a fixed value —, scenario, aggregate),
 * plus what only a comparison has: contenders (criteria, and weighted quadratic costs by r),
 * judges, constraints, budget and seed.
 */
export interface ComparisonFormValues extends SweepFormValues {
  contenders: CriterionId[];
  /** Weights r of extra quadratic contenders J = ∫(q·e² + r·u²)dt with q = 1, as typed: "0.01, 0.1". */
  quadraticWeights: string;
  judges: CriterionId[];
  constraints: { criterion: CriterionId; bound: "max" | "min"; limit: number }[];
  budget: { prescan: number; starts: number; evaluations: number; stability: boolean };
  seed: number;
}

/** Contenders a comparison starts with: the integral criteria the trade argues about. */
export const DEFAULT_CONTENDERS: readonly CriterionId[] = ["iae", "itae", "ise"];
/** Judges a comparison starts with: what the product cares about besides the tuning objective. */
export const DEFAULT_JUDGES: readonly CriterionId[] = ["overshoot", "settlingTime", "upeak", "tv", "ms", "gainMargin", "phaseMargin"];

export function defaultComparisonForm(plantRevisionId = ""): ComparisonFormValues {
  const base = defaultSweepForm(plantRevisionId);
  // A comparison searches a box: log axes for the gains, and kd from 0.
  base.ranges.kp = { min: 0.2, max: 10, count: 2, scale: "log" };
  base.ranges.ki = { min: 0.02, max: 2, count: 2, scale: "log" };
  base.ranges.kd = { min: 0, max: 10, count: 2, scale: "linear" };
  return {
    ...base,
    contenders: [...DEFAULT_CONTENDERS],
    quadraticWeights: "0.1, 1",
    judges: [...DEFAULT_JUDGES],
    constraints: [{ criterion: "ms", bound: "max", limit: 2 }],
    budget: { prescan: 256, starts: 3, evaluations: 120, stability: true },
    seed: 1,
  };
}

/** The r values typed for quadratic contenders, or a sentence saying what is wrong. */
export function parseWeights(text: string): { ok: true; values: number[] } | { ok: false; message: string } {
  const parts = text.split(/[,;\s]+/).filter((p) => p !== "");
  const values = parts.map(Number);
  const bad = parts.find((p, i) => !Number.isFinite(values[i]) || (values[i] as number) < 0);
  if (bad !== undefined) return { ok: false, message: `“${bad}” is not a weight; type numbers ≥ 0 separated by commas, e.g. 0.01, 0.1` };
  return { ok: true, values };
}

/** A weight as a label: J(r=0.1). */
export function weightLabel(r: number): string {
  return `J(r=${Number(r.toPrecision(6))})`;
}

/** The form values as the API's comparison input. */
export function toComparisonInput(values: ComparisonFormValues, context: SweepFormContext): Record<string, unknown> {
  const sweep = toSweepInput({ ...values, criteria: ["iae"] }, context);
  // The box: a range's min and max (its count is not used); a range with min = max is a fixed value.
  const ranges: Record<string, { min: number; max: number; scale?: "linear" | "log" }> = {};
  const fixed: Record<string, number> = {};
  for (const [name, range] of Object.entries(sweep.ranges)) {
    if (range.min === range.max) fixed[name] = range.min;
    else ranges[name] = { min: range.min, max: range.max, ...(range.scale ? { scale: range.scale } : {}) };
  }
  const weights = parseWeights(values.quadraticWeights ?? "");
  const constraints: Record<string, { max: number } | { min: number }> = {};
  for (const c of values.constraints ?? []) constraints[c.criterion] = c.bound === "max" ? { max: c.limit } : { min: c.limit };
  return {
    name: sweep.name,
    family: sweep.family ?? { variants: [{ plantRevisionId: values.plantRevisionId, ...(values.firstVariant?.label ? { label: values.firstVariant.label } : {}) }] },
    structure: sweep.structure ?? "pid",
    ranges,
    ...(Object.keys(fixed).length > 0 ? { fixed } : {}),
    ...(sweep.filter ? { filter: sweep.filter } : {}),
    ...(sweep.sampleTime !== undefined ? { sampleTime: sweep.sampleTime } : {}),
    ...(sweep.antiWindup ? { antiWindup: sweep.antiWindup } : {}),
    scenario: sweep.scenario,
    ...(sweep.criterionOptions ? { criterionOptions: sweep.criterionOptions } : {}),
    aggregate: { kind: values.aggregate.kind, ...(values.aggregate.kind === "percentile" ? { p: values.aggregate.p } : {}) },
    contenders: [
      ...(Array.isArray(values.contenders) ? values.contenders : []),
      ...(weights.ok ? weights.values.map((r) => ({ criterion: "quadratic", q: 1, r, label: weightLabel(r) })) : []),
    ],
    judges: Array.isArray(values.judges) ? values.judges : [],
    constraints,
    budget: values.budget,
    seed: values.seed,
  };
}

/** Fields of the comparison form an error may land on. */
export const COMPARISON_FORM_FIELDS = [
  ...SWEEP_FORM_FIELDS,
  "contenders",
  "quadraticWeights",
  "judges",
  "constraints",
  ...Array.from({ length: 12 }, (_, i) => [`constraints.${i}.limit`]).flat(),
  "budget.prescan",
  "budget.starts",
  "budget.evaluations",
  "seed",
] as const;

/** The form field of a comparison input's path: the box at the structure's rows, quadratic contenders at the weights. */
export function comparisonFieldOf(path: readonly PropertyKey[] | string): string {
  const dotted = dottedPath(path);
  const contender = /^contenders\.(\d+)/.exec(dotted);
  if (contender) return "contenders";
  if (/^judges/.test(dotted)) return "judges";
  if (/^constraints/.test(dotted)) return "constraints";
  return formFieldOf(dotted);
}

export const comparisonFormResolver: Resolver<ComparisonFormValues, SweepFormContext, Record<string, unknown>> = async (values, context) => {
  const input = toComparisonInput(values, context ?? { stateNames: [] });
  const parsed = comparisonInputSchema.safeParse(input);
  const own: FieldIssue[] = [];
  const weights = parseWeights(values.quadraticWeights ?? "");
  if (!weights.ok) own.push({ path: "quadraticWeights", message: weights.message });
  const overrides = (text: string | undefined, path: string) => {
    const result = parseOverrides(text ?? "");
    if (!result.ok) own.push({ path, message: result.message });
  };
  overrides(values.firstVariant?.parameters, "firstVariant.parameters");
  (values.variants ?? []).forEach((v, i) => overrides(v.parameters, `variants.${i}.parameters`));
  if (parsed.success && own.length === 0) return { values: input, errors: {} };
  const issues = [...(parsed.success ? [] : parsed.error.issues.map((i) => ({ path: comparisonFieldOf(i.path), message: i.message }))), ...own];
  return { values: {}, errors: toResolverErrors<ComparisonFormValues>(fieldErrors(issues, COMPARISON_FORM_FIELDS)) };
};

/** The form filled from a sweep ("Compare criteria on this sweep's family"): its family, structure, box and scenario. */
export function formFromSweepDetail(sweep: SweepDetailDto): ComparisonFormValues {
  const base = formFromSweep(sweep);
  const form = defaultComparisonForm(base.plantRevisionId);
  return { ...form, ...base, name: `${sweep.name}: which criterion?`.slice(0, 120), contenders: form.contenders, judges: form.judges, constraints: form.constraints, budget: form.budget, seed: form.seed, quadraticWeights: form.quadraticWeights, criteria: base.criteria };
}

/** The form filled from a stored comparison ("Run again with changes"). */
export function formFromComparison(detail: ComparisonDetailDto): ComparisonFormValues {
  const d = detail.definition;
  const first = d.family.variants[0];
  const form = defaultComparisonForm(first?.plantRevisionId ?? "");
  form.name = `${detail.name} (again)`.slice(0, 120);
  form.firstVariant = { label: first?.label ?? "", parameters: formatOverrides(first?.parameters) };
  form.variants = d.family.variants.slice(1).map((v, i) => ({ plantId: detail.family[i + 1]?.plantId ?? "", plantRevisionId: v.plantRevisionId, label: v.label ?? "", labelTyped: v.label !== undefined && v.label !== detail.family[i + 1]?.plantName, parameters: formatOverrides(v.parameters) }));
  form.structure = d.structure;
  for (const [name, axis] of Object.entries(d.ranges)) form.ranges[parameterKey(name)] = { min: axis.min, max: axis.max, count: 2, scale: axis.scale ?? "linear" };
  for (const [name, value] of Object.entries(d.fixed ?? {})) form.ranges[parameterKey(name)] = { min: value, max: value, count: 1, scale: "linear" };
  if (d.filter) form.filter = d.filter.mode === "ratio" ? { ...form.filter, mode: "ratio", n: d.filter.n } : { ...form.filter, mode: "fixed", tf: d.filter.tf };
  if (d.sampleTime !== undefined) {
    form.sampled = true;
    form.sampleTime = d.sampleTime;
  }
  const s = d.scenario;
  form.scenario = {
    kind: s.kind,
    horizon: s.horizon,
    dt: s.dt,
    setpoint: s.setpoint ?? 1,
    load: s.load ?? form.scenario.load,
    noiseOn: s.noise !== undefined,
    noise: s.noise ?? form.scenario.noise,
  };
  form.aggregate = fromAggregate(d.aggregate);
  form.contenders = d.contenders.filter((c): c is CriterionId => typeof c === "string");
  form.quadraticWeights = d.contenders.flatMap((c) => (typeof c === "string" ? [] : [String(c.r)])).join(", ");
  form.judges = [...d.judges];
  form.constraints = Object.entries(d.constraints).map(([criterion, limit]) => ({ criterion: criterion as CriterionId, bound: "max" in limit ? "max" : "min", limit: "max" in limit ? limit.max : limit.min }));
  form.budget = { ...d.budget };
  form.seed = d.seed;
  return form;
}

/** Every criterion id the form can offer, in registry order. */
export const ALL_CRITERIA: readonly CriterionId[] = CRITERION_IDS;
