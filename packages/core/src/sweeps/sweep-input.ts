import { z } from "zod";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import { CONTROLLER_KINDS, controllerSchema, type ControllerKind } from "../controllers/controller.js";
import {
  assertValidStructure,
  OPTIONAL_STRUCTURE_PARAMETERS,
  STRUCTURE_PARAMETERS,
  structureParameterNames,
  type Structure,
} from "../batch/structure.js";
import { gridDesign } from "../batch/grid-design.js";
import { sensitivityWeightSchema } from "../frequency/sensitivity-weight-schema.js";

/** Largest number of candidates one sweep may hold in this version (grid product). */
export const MAX_SWEEP_CANDIDATES = 5000;
/**
 * Criteria a sweep scores when none are chosen: the four of the first version, so sweeps stored
 * without a criteria list keep their meaning as CRITERION_IDS grows.
 */
export const DEFAULT_SWEEP_CRITERIA: readonly CriterionId[] = ["iae", "ise", "itae", "effort"];
/** Largest number of time samples one simulation may take (horizon / dt). */
export const MAX_SIMULATION_SAMPLES = 200_000;
/** Derivative filter of pid and pid2dof sweeps that give neither a filter nor tf: tf = kd/(10·kp). */
export const DEFAULT_DERIVATIVE_FILTER = { mode: "ratio", n: 10 } as const;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);

/**
 * One swept parameter: `count` values spaced evenly from `min` to `max` (inclusive). The sign
 * rules depend on the parameter and are checked by sweepInputSchema (see PARAMETER_SIGN).
 */
export const parameterRangeSchema = z
  .object({
    min: finite("min"),
    max: finite("max"),
    count: z.number().int("count must be a whole number").min(1, "count must be at least 1").max(1000, "count must be at most 1000"),
  })
  .refine((r) => r.max >= r.min, { message: "max must be ≥ min", path: ["max"] })
  .refine((r) => r.count === 1 || r.max > r.min, { message: "with more than one value, max must exceed min", path: ["max"] });

export type ParameterRange = z.infer<typeof parameterRangeSchema>;

/**
 * Derivative filter of a swept pid or pid2dof: either a fixed time constant `tf` [s],
 * or `tf = kd / (n · kp)` (the filter is n times faster than the derivative time Td = kd/kp).
 */
export const derivativeFilterSchema = z.discriminatedUnion("mode", [
  z.object({ mode: z.literal("fixed"), tf: finite("tf").min(0, "tf must be ≥ 0 s") }),
  z.object({ mode: z.literal("ratio"), n: finite("n").gt(0, "n must be > 0") }),
]);

export type DerivativeFilter = z.infer<typeof derivativeFilterSchema>;

/**
 * The scenario of a sweep (see Scenario in simulation/scenario.ts): kind (default setpoint-step),
 * horizon and dt [s], optional setpoint step size, load step {size, time} at the plant input and
 * measurement noise {sd, seed}. Omitted fields take the Scenario defaults of the kind.
 */
export const sweepScenarioSchema = z.object({
  kind: z.enum(["setpoint-step", "load-step", "combined"], { error: 'kind must be "setpoint-step", "load-step" or "combined"' }).default("setpoint-step"),
  horizon: finite("horizon").gt(0, "horizon must be > 0 s").max(1e5, "horizon must be at most 1e5 s"),
  dt: finite("time step").gt(0, "time step must be > 0 s"),
  setpoint: finite("setpoint").optional(),
  load: z.object({ size: finite("load size"), time: finite("load time").min(0, "load time must be ≥ 0 s") }).optional(),
  noise: z
    .object({
      sd: finite("noise sd").min(0, "noise sd must be ≥ 0"),
      seed: z.number({ error: "noise seed must be a number" }).int("noise seed must be a whole number"),
    })
    .optional(),
});

/**
 * Options of the criteria: quadratic weights q, r (≥ 0), the settling band (a fraction in (0, 1)),
 * the horizon of ise, effort and quadratic ("simulated" or "infinite", see CriterionOptions) and
 * the sensitivity weight of wsNorm.
 */
export const criterionOptionsSchema = z.object({
  q: finite("q").min(0, "q must be ≥ 0").optional(),
  r: finite("r").min(0, "r must be ≥ 0").optional(),
  settlingBand: finite("settlingBand").gt(0, "settlingBand must be > 0").lt(1, "settlingBand must be < 1 (a fraction, 0.02 = 2 %)").optional(),
  horizon: z.enum(["simulated", "infinite"], { error: 'horizon must be "simulated" or "infinite"' }).optional(),
  /** Weight W(s) of the weighted-sensitivity norm ‖W·S‖∞ (criterion wsNorm): {num, den} or the performance preset. */
  weight: sensitivityWeightSchema.optional(),
});

/** The controller schema's own anti-windup field (none, back-calculation with tt, conditional). */
const antiWindupSchema = controllerSchema.options[0].shape.antiWindup;

/**
 * Which values a parameter may take in a sweep: "non-negative" (≥ 0: gains of P, PI, PID and 2-DOF
 * PID, setpoint weights, lead–lag gain, tf), "positive" (> 0: lead–lag times, sample time) or "any"
 * (state-feedback gains k[i] and the reference gain n may be negative).
 */
export function parameterSign(kind: ControllerKind, name: string): "non-negative" | "positive" | "any" {
  if (kind === "state-feedback" && name !== "sampleTime") return "any";
  if (name === "tLead" || name === "tLag" || name === "sampleTime") return "positive";
  return "non-negative";
}

/**
 * What a user submits to start a grid sweep on one plant revision (version 2).
 *
 * - `structure`: a controller kind (CONTROLLER_KINDS, default "pid").
 * - `ranges`: the swept parameters by name, each `{min, max, count}`; `fixed`: the other parameters
 *   of the structure by name. Every required parameter of the structure (STRUCTURE_PARAMETERS;
 *   state feedback: k[0] … k[m−1], n with m the plant's state count, checked by the server against
 *   the revision) is either ranged or fixed; a count-1 range works like a fixed value.
 * - `filter` (pid, pid2dof): how tf is derived; without it and without tf, tf = kd/(10·kp)
 *   (DEFAULT_DERIVATIVE_FILTER). A sweep that ranges or fixes tf has no filter.
 * - `sampleTime` [s] (≥ scenario.dt): a sampled controller; `antiWindup`: as the controller's.
 * - `scenario`, `criteria` (default DEFAULT_SWEEP_CRITERIA), `criterionOptions`.
 *
 * Definitions of version 1 (`structure: "pid"`, ranges kp, ki, kd, a filter, a setpoint-step
 * scenario) parse to the same sweep.
 */
export const sweepInputSchema = z
  .object({
    name: z.string().trim().min(1, "give the sweep a name").max(120, "keep the name under 120 characters"),
    plantRevisionId: z.string().uuid("choose a plant revision"),
    structure: z.enum(CONTROLLER_KINDS, { error: `structure must be one of ${CONTROLLER_KINDS.join(", ")}` }).default("pid"),
    ranges: z.record(z.string(), parameterRangeSchema),
    fixed: z.record(z.string(), finite("every fixed parameter")).optional(),
    filter: derivativeFilterSchema.optional(),
    sampleTime: finite("sampleTime").gt(0, "sampleTime must be > 0 s").optional(),
    antiWindup: antiWindupSchema,
    scenario: sweepScenarioSchema,
    criteria: z
      .array(z.enum(CRITERION_IDS, { error: `unknown criterion; use one of ${CRITERION_IDS.join(", ")}` }))
      .min(1, "choose at least one criterion")
      .refine((ids) => new Set(ids).size === ids.length, { message: "list each criterion once" })
      .default(() => [...DEFAULT_SWEEP_CRITERIA]),
    criterionOptions: criterionOptionsSchema.optional(),
  })
  .overwrite((s) => {
    // pid and pid2dof without a filter and without tf keep the version-1 default filter.
    const tfGiven = "tf" in s.ranges || (s.fixed !== undefined && "tf" in s.fixed);
    if ((s.structure === "pid" || s.structure === "pid2dof") && s.filter === undefined && !tfGiven) {
      return { ...s, filter: { ...DEFAULT_DERIVATIVE_FILTER } };
    }
    return s;
  })
  .superRefine((s, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
    const fixed = s.fixed ?? {};
    const rangeNames = Object.keys(s.ranges);
    if (rangeNames.length === 0) issue(["ranges"], "sweep at least one parameter (a range with count 1 is fine)");
    if (s.criteria.includes("wsNorm") && s.criterionOptions?.weight === undefined) {
      issue(["criterionOptions", "weight"], "the weighted-sensitivity norm needs a weight W(s): give num/den or the performance preset (M, omegaB, A)");
    }

    // Names: known for the structure, none both ranged and fixed, every required one given.
    const kind = s.structure;
    const isPidLike = kind === "pid" || kind === "pid2dof";
    if (s.filter !== undefined && !isPidLike) issue(["filter"], `a derivative filter applies to pid and pid2dof only, not ${kind}`);
    const structure = sweepStructure(s as SweepInputParsed);
    let required: string[];
    try {
      required = structureParameterNames(structure);
    } catch (error) {
      issue(["structure"], error instanceof Error ? error.message : String(error));
      return;
    }
    const allowed = new Set([...required, ...OPTIONAL_STRUCTURE_PARAMETERS]);
    const allowedList = [...allowed].join(", ");
    let namesOk = true;
    for (const name of rangeNames) {
      if (!allowed.has(name)) {
        namesOk = false;
        const hint = name === "tf" && s.filter ? "; tf comes from the filter (remove the filter to range tf)" : `; use ${allowedList}`;
        issue(["ranges", name], `ranges.${name}: "${name}" is not a parameter of ${kind}${hint}`);
      }
    }
    for (const name of Object.keys(fixed)) {
      if (!allowed.has(name)) {
        namesOk = false;
        issue(["fixed", name], `fixed.${name}: "${name}" is not a parameter of ${kind}; use ${allowedList}`);
      } else if (name in s.ranges) {
        namesOk = false;
        issue(["fixed", name], `fixed.${name}: ${name} is also ranged; a parameter is either swept or fixed`);
      }
    }
    if (s.sampleTime !== undefined && ("sampleTime" in s.ranges || "sampleTime" in fixed)) {
      namesOk = false;
      issue(["sampleTime"], "sampleTime is given twice (also in ranges or fixed); give it once");
    }
    for (const name of required) {
      if (!(name in s.ranges) && !(name in fixed)) {
        namesOk = false;
        issue(["ranges", name], `ranges.${name}: ${kind} needs ${name}; sweep it (ranges) or give a fixed value (fixed)`);
      }
    }
    if (namesOk) {
      try {
        assertValidStructure(structure);
      } catch (error) {
        issue(["ranges"], error instanceof Error ? error.message.replace(/^structure\.(tunable|fixed)/, "ranges") : String(error));
      }
    }

    // Signs and sample time.
    const bounds = (name: string): { min: number; max: number } | undefined => {
      const r = s.ranges[name];
      if (r) return r;
      const v = fixed[name] ?? (name === "sampleTime" ? s.sampleTime : undefined);
      return v === undefined ? undefined : { min: v, max: v };
    };
    const where = (name: string): (string | number)[] =>
      name in s.ranges ? ["ranges", name, "min"] : name === "sampleTime" && s.sampleTime !== undefined ? ["sampleTime"] : ["fixed", name];
    for (const name of allowed) {
      const b = bounds(name);
      if (!b) continue;
      const sign = parameterSign(kind, name);
      if (sign === "non-negative" && b.min < 0) issue(where(name), `${name} must be ≥ 0`);
      if (sign === "positive" && !(b.min > 0)) issue(where(name), `${name} must be > 0 s`);
    }
    const ts = bounds("sampleTime");
    if (ts && ts.min > 0 && ts.min < s.scenario.dt) {
      issue(where("sampleTime"), `sampleTime must be ≥ the time step (${s.scenario.dt} s)`);
    }

    // Size of the grid and of each simulation.
    const total = rangeNames.reduce((n, name) => n * (s.ranges[name]?.count ?? 1), 1);
    if (total > MAX_SWEEP_CANDIDATES) {
      issue(["ranges"], `${total} candidates is more than the ${MAX_SWEEP_CANDIDATES} allowed per sweep; lower the counts`);
    }
    const samples = s.scenario.horizon / s.scenario.dt;
    if (samples > MAX_SIMULATION_SAMPLES) {
      issue(
        ["scenario", "dt"],
        `horizon/dt gives ${Math.ceil(samples)} samples, more than ${MAX_SIMULATION_SAMPLES}; raise the time step or shorten the horizon`,
      );
    }
    if (s.scenario.dt > s.scenario.horizon / 10) issue(["scenario", "dt"], "the time step must be at most a tenth of the horizon");
    if (s.scenario.load && s.scenario.load.time >= s.scenario.horizon) {
      issue(["scenario", "load", "time"], "the load step must come before the end of the horizon");
    }

    // The derivative filter.
    if (isPidLike && s.filter) {
      const kd = bounds("kd");
      const kp = bounds("kp");
      if (s.filter.mode === "fixed" && s.filter.tf === 0 && kd && kd.max > 0) {
        issue(["filter", "tf"], "tf must be > 0 s when kd can be non-zero: the derivative needs its filter");
      }
      if (s.filter.mode === "ratio" && kp && kd && kp.min === 0 && kd.max > 0) {
        issue(
          where("kp"),
          "with the ratio filter tf = kd/(n·kp), kp must be > 0 wherever kd is non-zero; raise kp min or use a fixed tf",
        );
      }
    }
    if (isPidLike && !s.filter) {
      const kd = bounds("kd");
      const tf = bounds("tf");
      if (kd && tf && kd.max > 0 && tf.min === 0) {
        issue(where("tf"), "tf must be > 0 s when kd can be non-zero: the derivative needs its filter");
      }
    }
  });

export type SweepInput = z.input<typeof sweepInputSchema>;
export type SweepInputParsed = z.output<typeof sweepInputSchema>;

/**
 * The structure a sweep evaluates: its kind; the ranged parameters as `tunable`, in the order of
 * the structure's parameter names (structureParameterNames; sampleTime last); every other
 * parameter in `fixed` (the top-level sampleTime included); the filter of pid and pid2dof; the
 * anti-windup. Does not validate (sweepInputSchema has).
 */
export function sweepStructure(input: SweepInputParsed): Structure {
  const kind = input.structure;
  const fixed: Record<string, number> = { ...(input.fixed ?? {}) };
  if (input.sampleTime !== undefined) fixed.sampleTime = input.sampleTime;
  const filter = kind === "pid" || kind === "pid2dof" ? input.filter : undefined;
  const names = orderedNames(kind, Object.keys(input.ranges), Object.keys(fixed), filter !== undefined);
  const tunable = names.filter((name) => name in input.ranges);
  // Names the structure does not know keep their place at the end, so validation can name them.
  for (const name of Object.keys(input.ranges)) if (!tunable.includes(name)) tunable.push(name);
  const structure: Structure = { kind, tunable, fixed };
  if (filter !== undefined) structure.filter = filter;
  if (input.antiWindup !== undefined) structure.antiWindup = input.antiWindup;
  return structure;
}

/**
 * Every parameter of a sweep's controllers in display order — the structure's names (tf included
 * when the filter derives it), then sampleTime when the sweep has one. These are the names of
 * SweepDetailDto.parameters and the order of CandidateDto.params.
 */
export function sweepParameterNames(input: SweepInputParsed): string[] {
  const structure = sweepStructure(input);
  const names = structureParameterNames(structure);
  if (structure.filter !== undefined) names.splice(names.indexOf("kd") + 1, 0, "tf");
  if ("sampleTime" in input.ranges || "sampleTime" in structure.fixed) names.push("sampleTime");
  return names;
}

/** Number of candidates of a sweep's grid: the product of the range counts. */
export function sweepCandidateCount(input: SweepInputParsed): number {
  return Object.values(input.ranges).reduce((n, r) => n * r.count, 1);
}

/**
 * The grid of a sweep (gridDesign over the ranges): `names` = sweepStructure(input).tunable,
 * `values` row-major (n × names.length) with the first name varying slowest and the last fastest;
 * each range gives `count` values evenly spaced from min to max inclusive (count 1: min alone).
 * For version-1 sweeps this is the order and the values of gridCandidates (kp, ki, kd).
 */
export function sweepCandidates(input: SweepInputParsed): { names: string[]; values: Float64Array } {
  const names = [...sweepStructure(input).tunable];
  if (names.length === 0) return { names, values: new Float64Array(0) };
  const ranges = names.map((name) => input.ranges[name] as ParameterRange);
  const values = gridDesign(
    names.map((name, i) => ({ name, min: ranges[i]!.min, max: ranges[i]!.max })),
    ranges.map((r) => r.count),
  );
  return { names, values };
}

/** Required names of the kind in its order (state feedback: from the k[i] given), then sampleTime. */
function orderedNames(kind: ControllerKind, ranged: string[], fixed: string[], hasFilter: boolean): string[] {
  let names: string[];
  if (kind === "state-feedback") {
    names = structureParameterNames({ kind, tunable: ranged, fixed: Object.fromEntries(fixed.map((n) => [n, 0])) });
  } else {
    const base = STRUCTURE_PARAMETERS[kind] ?? [];
    names = hasFilter ? base.filter((n) => n !== "tf") : [...base];
  }
  return [...names, ...OPTIONAL_STRUCTURE_PARAMETERS];
}
