import { z } from "zod";
import { textField } from "../schemas/text.js";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import {
  checkComparisonSweepFields,
  comparisonAggregateSchema,
  comparisonFamilySchema,
  comparisonSweepFields,
  withComparisonDefaults,
} from "./sweep-adapter.js";

/** Most contenders of one comparison. */
export const MAX_CONTENDERS = 12;
/** Most tunable parameters of a comparison's structure (the box's dimension). */
export const MAX_COMPARISON_PARAMETERS = 8;
/** Pre-scan size bounds: Sobol points shared by all contenders. */
export const MIN_PRESCAN = 8;
export const MAX_PRESCAN = 65_536;
/**
 * Default budget. The pre-scan of 256 Sobol points (a power of two keeps the design balanced, see
 * sobolDesign) places about 6 points per axis in three dimensions; each contender then refines
 * its 3 best feasible points with at most 120 evaluations each. Sized so that a 5-variant family
 * under a filtered PID, 30 s at dt = 0.01 s, four contenders, runs in a few seconds on two cores
 * (see packages/core/README.md, "Benchmarks").
 */
export const DEFAULT_COMPARISON_BUDGET = { prescan: 256, starts: 3, evaluations: 120, stability: true } as const;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);
const whole = (what: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number` })
    .int(`${what} must be a whole number`)
    .min(min, `${what} must be at least ${min}`)
    .max(max, `${what} must be at most ${max}`);

const criterionId = z.enum(CRITERION_IDS, { error: `unknown criterion; use one of ${CRITERION_IDS.join(", ")}` });

/** One more weighted quadratic cost J = ∫(q·e² + r·(u − u∞)²)dt competing under its own label. */
export const quadraticContenderSchema = z.strictObject({
  criterion: z.literal("quadratic", { error: 'criterion must be "quadratic" (other criteria are given by their id)' }),
  q: finite("q").min(0, "q must be ≥ 0").default(1),
  r: finite("r").min(0, "r must be ≥ 0"),
  label: textField({ label: "label", min: 1, required: "label must not be empty", max: 40 }).optional(),
});

/** A contender: a criterion id, or a weighted quadratic cost { criterion: "quadratic", q?, r, label? }. */
export const contenderSchema = z.union([criterionId, quadraticContenderSchema], {
  error: 'give a criterion id or { "criterion": "quadratic", "q", "r", "label" }',
});

/** A limit on one criterion, held on every variant: { max } or { min }. */
export const constraintSchema = z.union([z.strictObject({ max: finite("max") }), z.strictObject({ min: finite("min") })], {
  error: "give { max: x } or { min: x }",
});

/**
 * How much work a comparison may do: `prescan` Sobol points shared by every contender, then per
 * contender `starts` local refinements from its best feasible pre-scan points, each of at most
 * `evaluations` evaluations (one evaluation = one candidate on every variant); `stability`
 * re-refines every pick with each variant left out and each quadratic weight r halved and doubled.
 */
export const comparisonBudgetSchema = z.strictObject({
  prescan: whole("budget.prescan", MIN_PRESCAN, MAX_PRESCAN).default(DEFAULT_COMPARISON_BUDGET.prescan),
  starts: whole("budget.starts", 1, 16).default(DEFAULT_COMPARISON_BUDGET.starts),
  evaluations: whole("budget.evaluations", 10, 10_000).default(DEFAULT_COMPARISON_BUDGET.evaluations),
  stability: z.boolean({ error: "budget.stability must be true or false" }).default(DEFAULT_COMPARISON_BUDGET.stability),
});

/**
 * A comparison without its family (the server resolves the family from the library):
 * - structure (the controller kind), ranges (the box: { <param>: { min, max, scale? } }, every
 *   axis with max > min; a range's count is ignored), fixed, filter, sampleTime, antiWindup,
 *   scenario and criterionOptions: exactly as in a sweep definition, with the sweeps' checks;
 * - aggregate over the family: {kind:"worst"} | {kind:"mean"} | {kind:"percentile", p};
 * - contenders (1…MAX_CONTENDERS): criterion ids, or { criterion: "quadratic", q (default 1), r,
 *   label } — several quadratic costs with different r may compete; plain "quadratic" takes
 *   criterionOptions' q and r;
 * - judges: criterion ids scored on every pick without being optimised (none a contender);
 * - constraints: { "<criterion id>": { max } | { min } }. A constraint holds per variant: "Ms ≤ 1.6"
 *   means Ms ≤ 1.6 on every variant of the family, not on the aggregate; a candidate that breaks it
 *   on any variant — or on which the criterion does not apply (NaN) — is out;
 * - budget: see comparisonBudgetSchema; seed: the scramble of the pre-scan's Sobol design
 *   (default 1); the same definition and seed give the same picks.
 */
const definitionObject = z.strictObject({
  ...comparisonSweepFields,
  aggregate: comparisonAggregateSchema,
  contenders: z.array(contenderSchema).min(1, "give at least one contender").max(MAX_CONTENDERS, `at most ${MAX_CONTENDERS} contenders`),
  judges: z.array(criterionId).max(CRITERION_IDS.length, "list each judge once").default([]),
  constraints: z.record(z.string(), constraintSchema).default({}),
  budget: comparisonBudgetSchema.default(() => ({ ...DEFAULT_COMPARISON_BUDGET })),
  seed: z.number({ error: "seed must be a number" }).int("seed must be a whole number").default(1),
});

export const comparisonDefinitionSchema = definitionObject.overwrite(withComparisonDefaults).superRefine(checkDefinition);

/**
 * The spec of `loopyard compare`: a comparison definition with its family written inline as in
 * `loopyard sweep`: { name?, variants: [{ label?, plant, parameters? }] }, 1…20 variants (labels
 * default to v1, v2, …).
 */
export const comparisonSpecSchema = definitionObject
  .extend({ family: comparisonFamilySchema })
  .overwrite(withComparisonDefaults)
  .superRefine((spec, ctx) => {
    const labels = spec.family.variants.map((v, i) => v.label || `v${i + 1}`);
    if (new Set(labels).size !== labels.length) ctx.addIssue({ code: "custom", path: ["family", "variants"], message: "give each variant a different label" });
    checkDefinition(spec, ctx);
  });

/** The sweeps' checks of the shared fields, then the comparison's own (definitionIssue). */
function checkDefinition(definition: ComparisonDefinition, ctx: z.RefinementCtx): void {
  let failed = false;
  const counting = {
    value: ctx.value,
    addIssue: (issue: Parameters<z.RefinementCtx["addIssue"]>[0]) => {
      failed = true;
      ctx.addIssue(issue);
    },
  } as z.RefinementCtx;
  checkComparisonSweepFields(definition, definitionCriteria(definition), definition.budget.prescan, definition.seed, counting);
  if (failed) return;
  const issue = definitionIssue(definition);
  if (issue) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
}

/** Every registry criterion a definition names (contenders, judges, constraint keys that are ids). */
function definitionCriteria(definition: ComparisonDefinition): CriterionId[] {
  const ids = new Set<CriterionId>();
  for (const c of definition.contenders) ids.add(typeof c === "string" ? c : "quadratic");
  for (const j of definition.judges) ids.add(j);
  for (const key of Object.keys(definition.constraints)) if (isCriterionId(key)) ids.add(key);
  return [...ids];
}

export type ComparisonDefinition = z.output<typeof definitionObject>;
export type ComparisonDefinitionInput = z.input<typeof definitionObject>;
export type ComparisonSpec = z.output<typeof comparisonSpecSchema>;
export type QuadraticContender = z.output<typeof quadraticContenderSchema>;
export type Contender = z.output<typeof contenderSchema>;
export type ComparisonBudget = z.output<typeof comparisonBudgetSchema>;

/**
 * Checks a parsed definition beyond its shape, as one issue with a field path and a sentence
 * (null when it holds): distinct contenders and labels, judges not already contenders, constraint
 * keys that are criterion ids, a box with max > min on every ranged parameter and at most
 * MAX_COMPARISON_PARAMETERS of them. planComparison throws a RangeError with the same sentence.
 */
export function definitionIssue(definition: ComparisonDefinition): { path: (string | number)[]; message: string } | null {
  const tunable = Object.entries(definition.ranges);
  if (tunable.length === 0) return { path: ["ranges"], message: "give at least one parameter a range; the comparison searches that box" };
  if (tunable.length > MAX_COMPARISON_PARAMETERS) {
    return { path: ["ranges"], message: `at most ${MAX_COMPARISON_PARAMETERS} parameters with a range` };
  }
  for (const [name, axis] of tunable) {
    if (!(axis.max > axis.min)) return { path: ["ranges", name, "max"], message: "max must exceed min; a comparison searches a box with some width" };
  }
  const keys = new Set<string>();
  for (const [i, contender] of definition.contenders.entries()) {
    const key = contenderKey(contender);
    if (typeof contender !== "string" && (CRITERION_IDS as readonly string[]).includes(key)) {
      return { path: ["contenders", i, "label"], message: `"${key}" is a criterion id; give the quadratic cost a label of its own` };
    }
    if (keys.has(key)) {
      return {
        path: ["contenders", i],
        message: typeof contender === "string" ? `${key} is listed twice` : `"${key}" is used twice; give each quadratic cost its own label and weights`,
      };
    }
    keys.add(key);
  }
  for (const [i, judge] of definition.judges.entries()) {
    if (keys.has(judge)) return { path: ["judges", i], message: `${judge} is already a contender or listed before; every contender is a column of the cross-score too` };
    keys.add(judge);
  }
  for (const name of Object.keys(definition.constraints)) {
    if (!(CRITERION_IDS as readonly string[]).includes(name)) {
      return { path: ["constraints", name], message: `not a criterion id; use one of ${CRITERION_IDS.join(", ")}` };
    }
  }
  return null;
}

/** The key of a contender's column: its criterion id, or a quadratic cost's label (default "J(r=…)" or "J(q=…, r=…)"). */
export function contenderKey(contender: Contender): string {
  if (typeof contender === "string") return contender;
  if (contender.label !== undefined) return contender.label;
  return contender.q === 1 ? `J(r=${contender.r})` : `J(q=${contender.q}, r=${contender.r})`;
}

/** Whether a value is a criterion id. */
export function isCriterionId(value: string): value is CriterionId {
  return (CRITERION_IDS as readonly string[]).includes(value);
}
