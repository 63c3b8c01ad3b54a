import { DEFAULT_SWEEP_CRITERIA, sweepInputSchema, type CriterionId, type SweepInput } from "@loopyard/core";
import type { Resolver } from "react-hook-form";
import { fieldErrors } from "../../forms/field-errors.js";
import { toResolverErrors } from "../../forms/resolver-errors.js";

interface RangeValues {
  min: number;
  max: number;
  count: number;
}

/** What the sweep form holds; paths match sweepInputSchema so that schema and server errors land on the fields. */
export interface SweepFormValues {
  name: string;
  plantRevisionId: string;
  ranges: { kp: RangeValues; ki: RangeValues; kd: RangeValues };
  filter: { mode: "ratio" | "fixed"; n: number; tf: number };
  scenario: { horizon: number; dt: number };
  criteria: CriterionId[];
}

export const SWEEP_FORM_FIELDS = [
  "name",
  "plantRevisionId",
  "ranges",
  ...(["kp", "ki", "kd"] as const).flatMap((p) => [`ranges.${p}.min`, `ranges.${p}.max`, `ranges.${p}.count`]),
  "filter.n",
  "filter.tf",
  "scenario.horizon",
  "scenario.dt",
  "criteria",
] as const;

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

export function defaultSweepForm(plantRevisionId = "", horizon = 60): SweepFormValues {
  return {
    name: "",
    plantRevisionId,
    ranges: {
      kp: { min: 0.5, max: 5, count: 5 },
      ki: { min: 0.05, max: 1, count: 5 },
      kd: { min: 0, max: 4, count: 3 },
    },
    filter: { mode: "ratio", n: 10, tf: 0.1 },
    scenario: { horizon, dt: defaultTimeStep(horizon) },
    criteria: [...DEFAULT_SWEEP_CRITERIA],
  };
}

/** The form values as the API's sweep input (only the chosen filter's number is sent). */
export function toSweepInput(values: SweepFormValues): SweepInput {
  return {
    name: values.name,
    plantRevisionId: values.plantRevisionId,
    structure: "pid",
    ranges: values.ranges,
    filter: values.filter.mode === "ratio" ? { mode: "ratio", n: values.filter.n } : { mode: "fixed", tf: values.filter.tf },
    scenario: { kind: "setpoint-step", horizon: values.scenario.horizon, dt: values.scenario.dt },
    criteria: Array.isArray(values.criteria) ? values.criteria : values.criteria ? [values.criteria] : [],
  };
}

/** react-hook-form resolver: checks the input with the shared sweepInputSchema and puts each problem at its field. */
export const sweepFormResolver: Resolver<SweepFormValues, unknown, SweepInput> = async (values) => {
  const input = toSweepInput(values);
  const parsed = sweepInputSchema.safeParse(input);
  if (parsed.success) return { values: input, errors: {} };
  return { values: {}, errors: toResolverErrors<SweepFormValues>(fieldErrors(parsed.error.issues, SWEEP_FORM_FIELDS)) };
};
