import { aggregateScores } from "../aggregates/aggregate-scores.js";
import { batchStatusName } from "../batch/batch-status.js";
import { evaluateBatch, type BatchResult } from "../batch/evaluate-batch.js";
import type { Structure } from "../batch/structure.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import type { EvaluationOptions } from "../batch/evaluate-batch.js";
import type { SweepPlan } from "./plan-sweep.js";

/** Status of a candidate over the family: the worst of its variants (unstable › invalid › diverged › stable). */
export type SweepRowStatus = "stable" | "unstable" | "diverged" | "invalid";

/** One evaluated candidate of a sweep, with its verdict and the reason as a value. */
export interface SweepRow {
  /** Candidate index in the sweep (range start + position, or `first` + position for vectors). */
  index: number;
  /** Controller parameters in plan.parameters order. */
  params: number[];
  status: SweepRowStatus;
  /** Why the candidate is not stable, one sentence (which variant, what happened); null when stable. */
  reason: string | null;
  /** Aggregate over the family (plan.aggregate), in plan.criteria order; null unless stable. */
  scores: number[] | null;
  /** With more than one variant: F × C per-variant scores, variant-major (NaN where not stable). */
  variantScores?: number[];
  /** The verdict on each variant, in family order (length F). */
  variantStatus: SweepRowStatus[];
  /** Why a rejected candidate was rejected on each variant (null where it was not). */
  variantReasons?: (string | null)[];
}

/** Rows of a chunk, with the aggregate matrix (n × C; NaN for candidates not stable on every variant). */
export interface SweepChunk {
  rows: SweepRow[];
  aggregate: Float64Array;
}

/** Which candidates: an index range of a sampling design, or explicit tunable vectors (n × d) numbered from `first`. */
export type SweepSelection = { start: number; end: number } | { vectors: Float64Array; first: number };

/** The batch one chunk evaluates (the arguments of evaluateBatch; the worker pool takes the same shape). */
export interface SweepBatch {
  family: readonly Plant[];
  structure: Structure;
  candidates: Float64Array;
  scenario: Scenario;
  criteria: readonly CriterionId[];
  evaluation?: EvaluationOptions;
}

/** Evaluates a batch somewhere else (a worker pool); must give evaluateBatch's result. */
export type SweepBatchEvaluator = (batch: SweepBatch) => Promise<BatchResult>;

/**
 * Evaluates candidates of a plan on every variant, in process (evaluateBatch), and returns one row
 * per candidate: its parameters, its status over the family with the reason as a value, the
 * aggregate scores (aggregateScores with plan.aggregate) and, for a family, the per-variant scores.
 * A candidate whose controller is rejected is "invalid" with the rejection's sentence; any other
 * exception propagates (never swallowed).
 *
 * selection: {start, end} for candidates [start, end) of a sampling design, or {vectors, first}
 * for tunable vectors chosen elsewhere (a search's generation), numbered from `first`.
 * Throws a RangeError for a range outside the plan or vectors whose length is not a multiple of d.
 */
export function evaluateSweepChunk(plan: SweepPlan, selection: SweepSelection): SweepChunk {
  const batch = sweepBatch(plan, selection);
  return sweepChunkRows(plan, selection, batch.candidates, evaluateBatch(batch.family, batch.structure, batch.candidates, batch.scenario, batch.criteria, { evaluation: plan.evaluation }));
}

/** evaluateSweepChunk with the batch evaluated by `evaluate` (a worker pool); the same rows. */
export async function evaluateSweepChunkWith(plan: SweepPlan, selection: SweepSelection, evaluate: SweepBatchEvaluator): Promise<SweepChunk> {
  const batch = sweepBatch(plan, selection);
  return sweepChunkRows(plan, selection, batch.candidates, await evaluate(batch));
}

function sweepBatch(plan: SweepPlan, selection: SweepSelection): SweepBatch {
  let candidates: Float64Array;
  if ("vectors" in selection) {
    candidates = selection.vectors;
    if (!(candidates instanceof Float64Array) || (plan.d === 0 ? candidates.length !== 0 : candidates.length % plan.d !== 0)) {
      throw new RangeError(`vectors: give a Float64Array of n × ${plan.d} tunable values`);
    }
    if (!Number.isInteger(selection.first) || selection.first < 0) throw new RangeError("first must be a whole number ≥ 0");
  } else candidates = plan.vectors(selection.start, selection.end);
  return { family: plan.family, structure: plan.structure, candidates, scenario: plan.scenario, criteria: plan.criteria, evaluation: plan.evaluation };
}

const VERDICT_RANK: Readonly<Record<SweepRowStatus, number>> = { stable: 0, diverged: 1, invalid: 2, unstable: 3 };

/** The rows of an evaluated batch (see evaluateSweepChunk). */
function sweepChunkRows(plan: SweepPlan, selection: SweepSelection, candidates: Float64Array, result: BatchResult): SweepChunk {
  const { d, criteria } = plan;
  const n = d === 0 ? 0 : candidates.length / d;
  const nf = plan.family.length;
  const nc = criteria.length;
  const first = "vectors" in selection ? selection.first : selection.start;
  const labels = variantLabels(plan);
  const aggregate = aggregateScores(result.scores, result.status, n, nf, criteria, plan.aggregate);
  const rows: SweepRow[] = [];
  for (let i = 0; i < n; i++) {
    let status: SweepRowStatus = "stable";
    let worstVariant = -1;
    const variantStatus: SweepRowStatus[] = [];
    for (let f = 0; f < nf; f++) {
      const name = batchStatusName(result.status[i * nf + f] as number);
      variantStatus.push(name);
      if (VERDICT_RANK[name] > VERDICT_RANK[status]) {
        status = name;
        worstVariant = f;
      }
    }
    const controller = plan.controllerOf(candidates, i * d);
    const row: SweepRow = {
      index: first + i,
      params: plan.parametersOf(controller),
      status,
      reason: status === "stable" ? null : rowReason(status, result.reasons?.get(i * nf + worstVariant), nf > 1 ? labels[worstVariant] : undefined),
      scores: status === "stable" ? Array.from(aggregate.subarray(i * nc, (i + 1) * nc)) : null,
      variantStatus,
    };
    if (variantStatus.includes("invalid")) row.variantReasons = variantStatus.map((v, f) => (v === "invalid" ? (result.reasons?.get(i * nf + f) ?? null) : null));
    if (nf > 1) row.variantScores = Array.from(result.scores.subarray(i * nf * nc, (i + 1) * nf * nc));
    rows.push(row);
  }
  return { rows, aggregate };
}

function rowReason(status: Exclude<SweepRowStatus, "stable">, rejection: string | undefined, variant: string | undefined): string {
  const on = variant === undefined ? "" : ` on ${variant}`;
  switch (status) {
    case "invalid":
      return `the controller was rejected${on}: ${rejection ?? "its parameters do not make a valid controller"}`;
    case "unstable":
      return `the closed loop is unstable${on}`;
    case "diverged":
      return `the simulation left its divergence bound${on}`;
  }
}

/** Variant names for reasons: the label, else "variant i" (from 1). */
function variantLabels(plan: SweepPlan): string[] {
  const variants = plan.definition.family?.variants ?? [];
  return plan.family.map((_, f) => variants[f]?.label || `variant ${f + 1}`);
}
