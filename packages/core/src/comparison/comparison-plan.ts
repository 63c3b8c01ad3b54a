import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import { criterionSense } from "../criteria/criterion-sense.js";
import { QUADRATIC_DEFAULT_Q, QUADRATIC_DEFAULT_R } from "../criteria/quadratic.js";
import { CRITERIA } from "../criteria/registry.js";
import {
  contenderKey,
  definitionIssue,
  isCriterionId,
  type ComparisonBudget,
  type ComparisonDefinition,
} from "./comparison-definition.js";
import { comparisonSetup, type ComparisonSetup, type ComparisonVariant } from "./sweep-adapter.js";

/**
 * One column of a comparison's cross-score: a contender (optimised) or a judge (only scored).
 * A quadratic column carries its weights and is computed from ISE and effort as
 * J = q·ISE + r·Effort — the quadratic criterion's own identity (criteria/quadratic.ts), so any
 * number of weightings cost one simulation.
 */
export interface ComparisonColumn {
  /** The criterion id, or a quadratic contender's label; unique within the comparison. */
  key: string;
  /** For tables: the registry's label, or the quadratic contender's label. */
  label: string;
  role: "contender" | "judge";
  criterion: CriterionId;
  better: "smaller" | "larger";
  unit: string;
  /** Quadratic columns only: J = q·ISE + r·Effort. */
  weights?: { q: number; r: number };
}

/** A limit a candidate must meet on every variant: value ≤ limit ("max") or ≥ limit ("min"). */
export interface ComparisonConstraint {
  criterion: CriterionId;
  bound: "max" | "min";
  limit: number;
  /** e.g. "Ms ≤ 1.6". */
  label: string;
}

/** Everything the steps of a comparison need, derived once by planComparison. */
export interface ComparisonPlan {
  definition: ComparisonDefinition;
  setup: ComparisonSetup;
  variants: readonly string[];
  /** Tunable parameter names in candidate-vector order. */
  parameters: readonly string[];
  /** The box, one axis per tunable parameter. */
  space: ParameterSpace;
  aggregate: Aggregate;
  /** Contenders first (in the definition's order), then judges. */
  columns: readonly ComparisonColumn[];
  /** columns[0 … contenders − 1] are the contenders. */
  contenders: number;
  constraints: readonly ComparisonConstraint[];
  /** The registry criteria evaluated for a full row (every column and constraint), in CRITERION_IDS order. */
  criteria: readonly CriterionId[];
  budget: ComparisonBudget;
  seed: number;
}

/**
 * Plans a comparison of a parsed definition (comparisonDefinitionSchema) on a resolved family:
 * the columns (contenders, then judges), the constraints, the registry criteria to evaluate, the
 * structure, box and scenario (through the sweep adapter). Pure; allocates nothing that grows with
 * the budget (planSweep plans the pre-scan's Sobol design; its points are drawn when asked for).
 * Throws a RangeError naming the field for a definition the schema let through but the engine
 * refuses (definitionIssue), an empty family, or a SweepPlanError when the plants do not fit.
 */
export function planComparison(definition: ComparisonDefinition, family: readonly ComparisonVariant[]): ComparisonPlan {
  const issue = definitionIssue(definition);
  if (issue) throw new RangeError(`${issue.path.join(".")}: ${issue.message}`);
  const options = definition.criterionOptions ?? {};
  const columns: ComparisonColumn[] = definition.contenders.map((contender) => {
    if (typeof contender === "string") {
      const weights = contender === "quadratic" ? { q: options.q ?? QUADRATIC_DEFAULT_Q, r: options.r ?? QUADRATIC_DEFAULT_R } : undefined;
      return column(contender, CRITERIA[contender].label, "contender", contender, weights);
    }
    const key = contenderKey(contender);
    return column(key, key, "contender", "quadratic", { q: contender.q, r: contender.r });
  });
  for (const judge of definition.judges) {
    const weights = judge === "quadratic" ? { q: options.q ?? QUADRATIC_DEFAULT_Q, r: options.r ?? QUADRATIC_DEFAULT_R } : undefined;
    columns.push(column(judge, CRITERIA[judge].label, "judge", judge, weights));
  }
  const constraints: ComparisonConstraint[] = Object.entries(definition.constraints).map(([id, limit]) => {
    if (!isCriterionId(id)) throw new RangeError(`constraints.${id}: not a criterion id`);
    const bound = "max" in limit ? "max" : "min";
    const value = "max" in limit ? limit.max : limit.min;
    return { criterion: id, bound, limit: value, label: `${CRITERIA[id].label} ${bound === "max" ? "≤" : "≥"} ${value}` };
  });
  const needed = new Set<CriterionId>();
  for (const c of columns) for (const id of baseCriteriaOf(c)) needed.add(id);
  for (const c of constraints) needed.add(c.criterion);
  const criteria = CRITERION_IDS.filter((id) => needed.has(id));
  const setup = comparisonSetup(definition, family, criteria, definition.budget.prescan, definition.seed);
  return {
    definition,
    setup,
    variants: setup.variants,
    parameters: setup.structure.tunable,
    space: setup.space,
    aggregate: definition.aggregate,
    columns,
    contenders: definition.contenders.length,
    constraints,
    criteria,
    budget: definition.budget,
    seed: definition.seed,
  };
}

/** The registry criteria a column is computed from: ISE and effort for a quadratic column, else its own criterion. */
export function baseCriteriaOf(column: ComparisonColumn): CriterionId[] {
  return column.weights ? (column.weights.r === 0 ? ["ise"] : column.weights.q === 0 ? ["effort"] : ["ise", "effort"]) : [column.criterion];
}

/** The registry criteria a refinement of contender k evaluates: its column's and every constraint's, in CRITERION_IDS order. */
export function refinementCriteria(plan: ComparisonPlan, k: number): CriterionId[] {
  const needed = new Set<CriterionId>(baseCriteriaOf(plan.columns[k]));
  for (const c of plan.constraints) needed.add(c.criterion);
  return CRITERION_IDS.filter((id) => needed.has(id));
}

function column(key: string, label: string, role: "contender" | "judge", criterion: CriterionId, weights?: { q: number; r: number }): ComparisonColumn {
  return { key, label, role, criterion, better: criterionSense(criterion), unit: CRITERIA[criterion].unit, ...(weights ? { weights } : {}) };
}
