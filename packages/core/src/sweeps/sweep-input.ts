import { z } from "zod";
import { textField } from "../schemas/text.js";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import { antiWindupSchema, CONTROLLER_KINDS, type ControllerKind } from "../controllers/controller.js";
import { controllerParameter } from "../controllers/controller-parameters.js";
import { DEFAULT_DERIVATIVE_FILTER, derivativeFilterSchema } from "../controllers/derivative-filter.js";
import {
  assertValidStructure,
  OPTIONAL_STRUCTURE_PARAMETERS,
  StructureError,
  STRUCTURE_PARAMETERS,
  structureParameterNames,
  type Structure,
} from "../batch/structure.js";
import { gridDesign } from "../batch/grid-design.js";
import { latinHypercube } from "../batch/latin-hypercube.js";
import { seededRandomDesign } from "../batch/random-design.js";
import { sobolDesign } from "../batch/sobol-design.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { sensitivityWeightSchema } from "../frequency/sensitivity-weight-schema.js";
import {
  MAX_FAMILY_VARIANTS,
  MAX_TITLE_LENGTH,
  MAX_SEARCH_GENERATIONS,
  MAX_SEARCH_ITERATIONS,
  MAX_SEARCH_POPULATION,
  MAX_SEARCH_STARTS,
  MAX_SIMULATION_SAMPLES,
  MAX_STATE_FEEDBACK_GAINS,
  MAX_SWEEP_CANDIDATES,
  MAX_SWEEP_PARAMETERS,
} from "../limits.js";
import { searchBudget } from "./search-budget.js";

export { DEFAULT_DERIVATIVE_FILTER, derivativeFilterSchema, type DerivativeFilter } from "../controllers/derivative-filter.js";
export { MAX_FAMILY_VARIANTS, MAX_SIMULATION_SAMPLES, MAX_SWEEP_CANDIDATES } from "../limits.js";

/**
 * Criteria a sweep scores when none are chosen: the four of the first version, so sweeps stored
 * without a criteria list keep their meaning as CRITERION_IDS grows.
 */
export const DEFAULT_SWEEP_CRITERIA: readonly CriterionId[] = ["iae", "ise", "itae", "effort"];

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);

/**
 * One swept parameter from `min` to `max` (inclusive) on a `scale` (default "linear"; "log" spreads
 * values evenly in decades and needs min > 0). A grid design takes `count` values (default 1); the
 * other designs ignore `count` and draw the design's own count of candidates from the box. The sign
 * rules depend on the parameter and are checked by sweepInputSchema (see parameterSign).
 */
export const parameterRangeSchema = z
  .object({
    min: finite("min"),
    max: finite("max"),
    count: z
      .number()
      .int("count must be a whole number")
      .min(1, "count must be at least 1")
      .max(MAX_SWEEP_CANDIDATES, `count must be at most ${MAX_SWEEP_CANDIDATES}`)
      .default(1),
    scale: z.enum(["linear", "log"], { error: 'scale must be "linear" or "log"' }).optional(),
  })
  .refine((r) => r.max >= r.min, { message: "max must be ≥ min", path: ["max"] })
  .refine((r) => r.count === 1 || r.max > r.min, { message: "with more than one value, max must exceed min", path: ["max"] })
  .refine((r) => r.scale !== "log" || r.min > 0, { message: "a log scale needs min > 0", path: ["min"] });

export type ParameterRange = z.infer<typeof parameterRangeSchema>;


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

const wholeCount = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number` })
    .int(`${what} must be a whole number`)
    .min(1, `${what} must be at least 1`)
    .max(max, `${what} must be at most ${max}`);
const seedSchema = z.number({ error: "seed must be a number" }).int("seed must be a whole number");

/**
 * How a sweep chooses its candidates (default grid):
 * - grid: the product of the ranges' counts, row-major (first parameter slowest);
 * - latin-hypercube, random: `count` candidates drawn with `seed` (same seed, same candidates);
 * - sobol: the first `count` points of a Sobol sequence (scrambled when a seed is given);
 * - search nelder-mead: `starts` multi-start simplex searches of at most `iterations` iterations
 *   each, on the aggregate of `criterion`, within a budget of starts × iterations evaluations;
 *   search nsga2: an initial population and `generations` offspring generations of `population`,
 *   every criterion of the sweep an objective (larger-is-better ones negated).
 * Non-grid designs ignore the ranges' counts.
 */
export const sweepDesignSchema = z.union(
  [
    z.object({ kind: z.literal("grid") }),
    z.object({ kind: z.literal("latin-hypercube"), count: wholeCount("design.count", MAX_SWEEP_CANDIDATES), seed: seedSchema }),
    z.object({ kind: z.literal("sobol"), count: wholeCount("design.count", MAX_SWEEP_CANDIDATES), seed: seedSchema.optional() }),
    z.object({ kind: z.literal("random"), count: wholeCount("design.count", MAX_SWEEP_CANDIDATES), seed: seedSchema }),
    z.object({
      kind: z.literal("search"),
      method: z.literal("nelder-mead"),
      criterion: z.enum(CRITERION_IDS, { error: `unknown criterion; use one of ${CRITERION_IDS.join(", ")}` }),
      starts: wholeCount("starts", MAX_SEARCH_STARTS),
      iterations: wholeCount("iterations", MAX_SEARCH_ITERATIONS),
      seed: seedSchema,
    }),
    z.object({
      kind: z.literal("search"),
      method: z.literal("nsga2"),
      population: wholeCount("population", MAX_SEARCH_POPULATION),
      generations: wholeCount("generations", MAX_SEARCH_GENERATIONS),
      seed: seedSchema,
    }),
  ],
  { error: 'design must be {kind:"grid"}, latin-hypercube/random {count, seed}, sobol {count, seed?} or search (nelder-mead or nsga2)' },
);

export type SweepDesign = z.infer<typeof sweepDesignSchema>;

/** How a criterion is combined over the family's variants (default worst case). */
export const sweepAggregateSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("worst") }),
    z.object({ kind: z.literal("mean") }),
    z.object({ kind: z.literal("percentile"), p: finite("p").min(0, "p must be ≥ 0").max(100, "p must be ≤ 100") }),
  ],
  { error: 'aggregate must be {kind:"worst"}, {kind:"mean"} or {kind:"percentile", p}' },
);

export type SweepAggregate = z.infer<typeof sweepAggregateSchema>;

/**
/** Which saved family revision a sweep's or a comparison's variants came from (see sweepFamilySchema.source). */
export const familySourceSchema = z.object({
  familyId: z.string().uuid("familyId must be a family's id"),
  familyRevisionId: z.string().uuid("familyRevisionId must be a family revision's id"),
  number: z.number().int("number must be a whole revision number").min(1, "revisions start at 1"),
});

export type FamilySource = z.infer<typeof familySourceSchema>;

/**
 * The plant variants of a sweep: plant revisions, each with an optional label and, for a
 * nonlinear plant, overrides of its parameters. The first variant's revision is the sweep's
 * `plantRevisionId`.
 */
export const sweepFamilySchema = z.object({
  name: textField({ label: "family name", max: MAX_TITLE_LENGTH }).optional(),
  /**
   * The library family revision these variants were expanded from (expandFamily), filled in by the
   * server when a definition names `familyRevisionId`; absent for a family built ad hoc.
   */
  source: familySourceSchema.optional(),
  variants: z
    .array(
      z.object({
        plantRevisionId: z.string().uuid("choose a plant revision"),
        label: textField({ label: "label", max: MAX_TITLE_LENGTH }).optional(),
        parameters: z.record(z.string(), finite("every variant parameter")).optional(),
      }),
    )
    .min(1, "give at least one variant")
    .max(MAX_FAMILY_VARIANTS, `a family holds at most ${MAX_FAMILY_VARIANTS} variants`),
});

export type SweepFamily = z.infer<typeof sweepFamilySchema>;


/**
 * Which values a parameter may take in a sweep, read from the controller's parameter table
 * (CONTROLLER_PARAMETERS' sweepSign, else sign): "non-negative" (≥ 0: gains of P, PI, PID and 2-DOF
 * PID, setpoint weights, lead–lag gain, tf), "positive" (> 0: lead–lag times, sample time) or "any"
 * (state-feedback gains k[i] and the reference gain n may be negative). "any" for unknown names.
 */
export function parameterSign(kind: ControllerKind, name: string): "non-negative" | "positive" | "any" {
  const entry = controllerParameter(kind, name);
  return entry ? (entry.sweepSign ?? entry.sign) : "any";
}

/** A parameter name as a record key: short, and at most MAX_SWEEP_PARAMETERS of them (checked before any name list is built). */
const parameterRecord = <T extends z.ZodType>(value: T, what: string) =>
  z
    .record(z.string().max(40, "a parameter name has at most 40 characters"), value)
    .refine((r) => Object.keys(r).length <= MAX_SWEEP_PARAMETERS, { message: `give at most ${MAX_SWEEP_PARAMETERS} ${what}` });

/**
 * The fields of a sweep definition shared by the web form, the server and the CLI (the CLI's
 * family carries plants inline instead of revisions, see the CLI's sweepSpecSchema).
 */
export const sweepDefinitionFields = {
  structure: z.enum(CONTROLLER_KINDS, { error: `structure must be one of ${CONTROLLER_KINDS.join(", ")}` }).default("pid"),
  ranges: parameterRecord(parameterRangeSchema, "ranges"),
  fixed: parameterRecord(finite("every fixed parameter"), "fixed values").optional(),
  filter: derivativeFilterSchema.optional(),
  sampleTime: finite("sampleTime").gt(0, "sampleTime must be > 0 s").optional(),
  antiWindup: antiWindupSchema,
  scenario: sweepScenarioSchema,
  criteria: z
    .array(z.enum(CRITERION_IDS, { error: `unknown criterion; use one of ${CRITERION_IDS.join(", ")}` }))
    .min(1, "choose at least one criterion")
    .max(CRITERION_IDS.length, "list each criterion once")
    .refine((ids) => new Set(ids).size === ids.length, { message: "list each criterion once" })
    .default(() => [...DEFAULT_SWEEP_CRITERIA]),
  criterionOptions: criterionOptionsSchema.optional(),
  design: sweepDesignSchema.default(() => ({ kind: "grid" as const })),
  aggregate: sweepAggregateSchema.default(() => ({ kind: "worst" as const })),
};

/** What every sweep definition holds once parsed (web/server input and CLI spec alike). */
export interface SweepShape {
  structure: ControllerKind;
  ranges: Record<string, ParameterRange>;
  fixed?: Record<string, number> | undefined;
  filter?: z.output<typeof derivativeFilterSchema> | undefined;
  sampleTime?: number | undefined;
  antiWindup?: z.output<typeof antiWindupSchema>;
  scenario: z.output<typeof sweepScenarioSchema>;
  criteria: CriterionId[];
  criterionOptions?: z.output<typeof criterionOptionsSchema> | undefined;
  design: SweepDesign;
  aggregate: SweepAggregate;
  plantRevisionId?: string;
  familyRevisionId?: string | undefined;
  family?: { name?: string | undefined; source?: FamilySource | undefined; variants: readonly { label?: string | undefined; parameters?: Record<string, number> | undefined; plantRevisionId?: string }[] } | undefined;
}

/** pid and pid2dof without a filter and without tf keep the version-1 default filter. */
export function withDefaultFilter<S extends SweepShape>(s: S): S {
  const tfGiven = "tf" in s.ranges || (s.fixed !== undefined && "tf" in s.fixed);
  if ((s.structure === "pid" || s.structure === "pid2dof") && s.filter === undefined && !tfGiven) {
    return { ...s, filter: { ...DEFAULT_DERIVATIVE_FILTER } };
  }
  return s;
}

/**
 * The checks of a sweep definition beyond its fields' own, stated once for the web form, the
 * server and the CLI: names known for the structure (state gains k[i] bounded by
 * MAX_STATE_FEEDBACK_GAINS before any name list is built), every required one given once, signs,
 * sample time, family, design, candidate count, simulation size and the derivative filter. Each
 * problem is an issue on its field whose message reads on its own (no field prefix; the field
 * travels as the path, see sweepIssueSentence).
 */
export function checkSweepDefinition(s: SweepShape, ctx: z.RefinementCtx): void {
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
  // State gains first: k[i] beyond the largest plant is refused before the structure lists its names.
  let gainsOk = true;
  for (const [where, names] of [["ranges", rangeNames], ["fixed", Object.keys(fixed)]] as const) {
    for (const name of names) {
      const gain = /^k\[(\d+)\]$/.exec(name);
      if (kind === "state-feedback" && gain && Number(gain[1]) >= MAX_STATE_FEEDBACK_GAINS) {
        gainsOk = false;
        issue([where, name], `state feedback takes at most ${MAX_STATE_FEEDBACK_GAINS} gains k[0]…k[${MAX_STATE_FEEDBACK_GAINS - 1}], one per plant state; "${name}" is beyond them`);
      }
    }
  }
  if (!gainsOk) return;
  const structure = sweepStructure(s);
  let required: string[];
  try {
    required = structureParameterNames(structure);
  } catch (error) {
    if (!(error instanceof StructureError)) throw error;
    issue(["structure"], error.reason);
    return;
  }
  const allowed = new Set([...required, ...OPTIONAL_STRUCTURE_PARAMETERS]);
  const allowedList = [...allowed].join(", ");
  let namesOk = true;
  for (const name of rangeNames) {
    if (!allowed.has(name)) {
      namesOk = false;
      const hint = name === "tf" && s.filter ? "; tf comes from the filter (remove the filter to range tf)" : `; use ${allowedList}`;
      issue(["ranges", name], `"${name}" is not a parameter of ${kind}${hint}`);
    }
  }
  for (const name of Object.keys(fixed)) {
    if (!allowed.has(name)) {
      namesOk = false;
      issue(["fixed", name], `"${name}" is not a parameter of ${kind}; use ${allowedList}`);
    } else if (name in s.ranges) {
      namesOk = false;
      issue(["fixed", name], `${name} is also ranged; a parameter is either swept or fixed`);
    }
  }
  if (s.sampleTime !== undefined && ("sampleTime" in s.ranges || "sampleTime" in fixed)) {
    namesOk = false;
    issue(["sampleTime"], "sampleTime is given twice (also in ranges or fixed); give it once");
  }
  for (const name of required) {
    if (!(name in s.ranges) && !(name in fixed)) {
      namesOk = false;
      issue(["ranges", name], `${kind} needs ${name}; sweep it (ranges) or give a fixed value (fixed)`);
    }
  }
  if (namesOk) {
    try {
      assertValidStructure(structure);
    } catch (error) {
      if (!(error instanceof StructureError)) throw error;
      issue(["ranges"], error.reason);
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

  // Family, design and the size of the sweep and of each simulation.
  if (s.family?.source !== undefined && s.familyRevisionId !== s.family.source.familyRevisionId) {
    issue(["familyRevisionId"], "familyRevisionId must be the family revision the variants came from (family.source)");
  }
  if (s.familyRevisionId !== undefined && s.family?.source === undefined) {
    issue(["family"], "a sweep on a saved family gets its variants from familyRevisionId; send the definition to the server, which fills them in");
  }
  const firstVariant = s.family?.variants[0];
  if (firstVariant?.plantRevisionId !== undefined && s.plantRevisionId !== undefined && firstVariant.plantRevisionId !== s.plantRevisionId) {
    issue(["plantRevisionId"], "plantRevisionId must be the revision of the family's first variant");
  }
  if (s.design.kind === "search" && s.design.method === "nelder-mead" && !s.criteria.includes(s.design.criterion)) {
    issue(["design", "criterion"], `the search criterion must be one of the sweep's criteria (${s.criteria.join(", ")})`);
  }
  const total = sweepCandidateCount(s);
  if (total > MAX_SWEEP_CANDIDATES) {
    issue(
      s.design.kind === "grid" ? ["ranges"] : ["design"],
      `${total} candidates is more than the ${MAX_SWEEP_CANDIDATES} allowed per sweep; ${s.design.kind === "grid" ? "lower the counts" : "lower the design's count"}`,
    );
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
      issue(where("kp"), "with the ratio filter tf = kd/(n·kp), kp must be > 0 wherever kd is non-zero; raise kp min or use a fixed tf");
    }
  }
  if (isPidLike && !s.filter) {
    const kd = bounds("kd");
    const tf = bounds("tf");
    if (kd && tf && kd.max > 0 && tf.min === 0) {
      issue(where("tf"), "tf must be > 0 s when kd can be non-zero: the derivative needs its filter");
    }
  }
}

/**
 * What a user submits to start a sweep (version 3): the sweep definition the web form builds and
 * the server stores.
 *
 * - `family` (optional): the plant variants; without it the sweep has one variant,
 *   `plantRevisionId`. With it, `plantRevisionId` stays required and must be the first variant's
 *   revision (so every stored definition names a plant revision).
 * - `design` (default grid), `aggregate` over the family (default worst case); ranges may carry a
 *   `scale` ("log" needs min > 0).
 * - `structure`: a controller kind (CONTROLLER_KINDS, default "pid").
 * - `ranges`: the swept parameters by name, each `{min, max, count}`; `fixed`: the other parameters
 *   of the structure by name. Every required parameter of the structure (STRUCTURE_PARAMETERS;
 *   state feedback: k[0] … k[m−1], n with m the plant's state count, checked by planSweep against
 *   the plants) is either ranged or fixed; a count-1 range works like a fixed value.
 * - `filter` (pid, pid2dof): how tf is derived; without it and without tf, tf = kd/(10·kp)
 *   (DEFAULT_DERIVATIVE_FILTER). A sweep that ranges or fixes tf has no filter.
 * - `sampleTime` [s] (≥ scenario.dt): a sampled controller; `antiWindup`: as the controller's.
 * - `scenario`, `criteria` (default DEFAULT_SWEEP_CRITERIA), `criterionOptions`.
 *
 * Definitions of version 1 (`structure: "pid"`, ranges kp, ki, kd, a filter, a setpoint-step
 * scenario) parse to the same sweep. Checks: checkSweepDefinition.
 */
export const sweepInputSchema = z
  .object({
    name: textField({ label: "name", min: 1, required: "give the sweep a name", max: MAX_TITLE_LENGTH }),
    plantRevisionId: z.string().uuid("choose a plant revision"),
    ...sweepDefinitionFields,
    family: sweepFamilySchema.optional(),
    /**
     * A saved family revision to sweep over instead of listing variants: the server expands it
     * (expandFamily) into `family` (with `family.source`) and `plantRevisionId` before this schema
     * parses the definition, and the stored sweep keeps it.
     */
    familyRevisionId: z.string().uuid("choose a family revision").optional(),
  })
  .overwrite(withDefaultFilter)
  .superRefine(checkSweepDefinition);

export type SweepInput = z.input<typeof sweepInputSchema>;
export type SweepInputParsed = z.output<typeof sweepInputSchema>;

/**
 * The structure a sweep evaluates: its kind; the ranged parameters as `tunable`, in the order of
 * the structure's parameter names (structureParameterNames; sampleTime last); every other
 * parameter in `fixed` (the top-level sampleTime included); the filter of pid and pid2dof; the
 * anti-windup. Does not validate (sweepInputSchema has).
 */
export function sweepStructure(input: SweepShape): Structure {
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
export function sweepParameterNames(input: SweepShape): string[] {
  const structure = sweepStructure(input);
  const names = structureParameterNames(structure);
  if (structure.filter !== undefined) names.splice(names.indexOf("kd") + 1, 0, "tf");
  if ("sampleTime" in input.ranges || "sampleTime" in structure.fixed) names.push("sampleTime");
  return names;
}

/**
 * Number of candidates of a sweep: the product of the range counts for a grid, the design's count
 * for latin-hypercube, sobol and random, the evaluation budget of a search (nelder-mead: starts ×
 * iterations, the most evaluations the search may use; nsga2: population × (generations + 1), the
 * initial population and its offspring generations).
 */
export function sweepCandidateCount(input: SweepShape): number {
  const design = input.design ?? { kind: "grid" };
  switch (design.kind) {
    case "grid":
      return Object.values(input.ranges).reduce((n, r) => n * (r.count ?? 1), 1);
    case "latin-hypercube":
    case "sobol":
    case "random":
      return design.count;
    case "search":
      return searchBudget(design);
  }
}

/** The parameter space of a sweep: one axis per tunable name (sweepStructure order) with its scale. */
export function sweepSpace(input: SweepShape): ParameterSpace {
  return sweepStructure(input).tunable.map((name) => {
    const r = input.ranges[name] as ParameterRange;
    return { name, min: r.min, max: r.max, scale: r.scale ?? "linear" };
  });
}

/** Thrown by sweepCandidates for a design without a fixed candidate list (search designs). */
export class UnsupportedDesignError extends Error {
  override name = "UnsupportedDesignError";
}

/**
 * The candidates of a sweep with a sampling design: `names` = sweepStructure(input).tunable,
 * `values` row-major (n × names.length).
 * - grid (gridDesign over the ranges): the first name varying slowest and the last fastest; each
 *   range gives `count` values from min to max inclusive, evenly on its scale (count 1: min alone).
 *   For version-1 sweeps this is the order and the values of gridCandidates (kp, ki, kd).
 * - latin-hypercube, random: latinHypercube / seededRandomDesign with the design's count and seed;
 *   sobol: sobolDesign, scrambled with the seed when one is given.
 * Deterministic: the same definition gives the same bytes, so workers regenerate any chunk.
 * Search designs choose their candidates as they go: this throws an UnsupportedDesignError for
 * them.
 */
export function sweepCandidates(input: SweepShape): { names: string[]; values: Float64Array } {
  const names = [...sweepStructure(input).tunable];
  if (names.length === 0) return { names, values: new Float64Array(0) };
  const space = sweepSpace(input);
  const design = input.design ?? { kind: "grid" };
  switch (design.kind) {
    case "grid":
      return { names, values: gridDesign(space, names.map((name) => (input.ranges[name] as ParameterRange).count ?? 1)) };
    case "latin-hypercube":
      return { names, values: latinHypercube(space, design.count, design.seed, MAX_SWEEP_CANDIDATES) };
    case "random":
      return { names, values: seededRandomDesign(space, design.count, design.seed, MAX_SWEEP_CANDIDATES) };
    case "sobol":
      return {
        names,
        values: sobolDesign(space, design.count, design.seed === undefined ? {} : { scramble: { seed: design.seed } }, MAX_SWEEP_CANDIDATES),
      };
    default:
      throw new UnsupportedDesignError("search designs choose candidates as they run; they have no fixed list");
  }
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
