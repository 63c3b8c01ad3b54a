import type { BatchResult } from "../batch/evaluate-batch.js";
import { batchStatusName, type BatchStatus } from "../batch/batch-status.js";
import { axisValue, type ParameterSpace } from "../batch/parameter-space.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { aggregateRows, comparisonRows, isFeasible } from "./comparison-rows.js";

/**
 * A parameter sits on a bound of the box when its unit coordinate (axisValue's w: linear, or in
 * log(value) on a log axis) is within this of 0 or 1 — a thousandth of the axis, ten times the
 * refinement's stopping tolerance (REFINE_X_TOLERANCE), so a simplex pressed against a face counts.
 */
export const AT_BOUND_TOLERANCE = 1e-3;

/** Which bound of the box a parameter of a pick sits on. */
export interface PickBound {
  parameter: string;
  bound: "min" | "max";
}

/**
 * The pick of one contender: the best candidate of its column's aggregate within the box and the
 * constraints, scored on every column and variant.
 */
export interface ComparisonPick {
  /** The contender's column key. */
  contender: string;
  /** false when no candidate was stable on every variant and within the constraints (see reason). */
  found: boolean;
  reason?: string;
  /** Tunable parameter values by name, and as a vector in the structure's order. */
  params: Record<string, number>;
  vector: number[];
  /** Parameters on a bound of the box: then the box, not the criterion, chose them. */
  atBound: PickBound[];
  /** The aggregate over the family of every column (plan.columns order). */
  aggregates: number[];
  /** perVariant[f][k]: column k on variant f. */
  perVariant: number[][];
  status: BatchStatus[];
  /** The registry criteria behind the columns, per variant (base.scores[f][c]), for re-weighting. */
  base: { criteria: CriterionId[]; scores: number[][] };
  /** Evaluations spent on this pick (candidates, each on every variant). */
  evaluations: number;
  /** Whether the local refinement met its tolerances (false: its budget ran out first). */
  converged: boolean;
  /** Set when another contender's pick was better on this contender's column and was taken over (see reconcilePicks). */
  adoptedFrom?: string;
}

/**
 * The pick of contender `contender` at the parameter vector `vector`, from a batch result of that
 * one candidate over plan.criteria on every variant.
 */
export function scorePick(
  plan: ComparisonPlan,
  contender: string,
  vector: ArrayLike<number>,
  batch: BatchResult,
  work: { evaluations: number; converged: boolean },
): ComparisonPick {
  const rows = comparisonRows(plan, plan.criteria, batch, 1);
  const aggregates = Array.from(aggregateRows(plan, rows, false));
  const nf = plan.variants.length;
  const nk = plan.columns.length;
  const nc = plan.criteria.length;
  const values = Array.from(vector);
  const params: Record<string, number> = {};
  plan.parameters.forEach((name, j) => (params[name] = values[j]));
  const feasible = isFeasible(rows, 0);
  return {
    contender,
    found: feasible,
    ...(feasible ? {} : { reason: "the refined candidate is not stable on every variant or breaks a constraint" }),
    params,
    vector: values,
    atBound: boundsOf(plan.space, values),
    aggregates,
    perVariant: Array.from({ length: nf }, (_, f) => Array.from(rows.scores.subarray(f * nk, (f + 1) * nk))),
    status: Array.from(rows.status, (s) => batchStatusName(s)),
    base: { criteria: [...plan.criteria], scores: Array.from({ length: nf }, (_, f) => Array.from(batch.scores.subarray(f * nc, (f + 1) * nc))) },
    evaluations: work.evaluations,
    converged: work.converged,
  };
}

/** A contender without a pick, and why. */
export function missingPick(plan: ComparisonPlan, contender: string, reason: string, evaluations = 0): ComparisonPick {
  const nk = plan.columns.length;
  return {
    contender,
    found: false,
    reason,
    params: {},
    vector: [],
    atBound: [],
    aggregates: new Array<number>(nk).fill(NaN),
    perVariant: plan.variants.map(() => new Array<number>(nk).fill(NaN)),
    status: [],
    base: { criteria: [...plan.criteria], scores: [] },
    evaluations,
    converged: false,
  };
}

/** The unit coordinate w ∈ [0, 1] of a value on an axis: the inverse of axisValue. */
export function unitCoordinate(axis: ParameterSpace[number], value: number): number {
  const w =
    axis.scale === "log"
      ? (Math.log(value) - Math.log(axis.min)) / (Math.log(axis.max) - Math.log(axis.min))
      : (value - axis.min) / (axis.max - axis.min);
  return Math.min(1, Math.max(0, w));
}

/** The value of every axis at unit coordinates w (axisValue). */
export function boxValues(space: ParameterSpace, w: ArrayLike<number>): Float64Array {
  return Float64Array.from(space, (axis, j) => axisValue(axis, w[j]));
}

function boundsOf(space: ParameterSpace, values: readonly number[]): PickBound[] {
  const out: PickBound[] = [];
  space.forEach((axis, j) => {
    const w = unitCoordinate(axis, values[j]);
    if (w <= AT_BOUND_TOLERANCE) out.push({ parameter: axis.name, bound: "min" });
    else if (w >= 1 - AT_BOUND_TOLERANCE) out.push({ parameter: axis.name, bound: "max" });
  });
  return out;
}
