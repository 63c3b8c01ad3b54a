import { aggregateScores, assertValidController, batchStatusName, controllerFromVector, sweepCandidateCount } from "@loopyard/core";
import type { BatchResult, CriterionId, Plant, SweepInputParsed } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRevisionById } from "../plants/plant-repository.js";
import type { CandidateRow } from "./candidate-repository.js";
import { candidateParams, structureProblem, sweepPlan, type SweepPlan } from "./sweep-plan.js";

/** Everything needed to evaluate any candidate range of a sweep, derived once from its frozen definition. */
export interface SweepEvaluationContext {
  sweepId: string;
  definition: SweepInputParsed;
  /** The plant of each variant, in family order (parameter overrides applied). */
  family: Plant[];
  plan: SweepPlan;
  criteria: CriterionId[];
  total: number;
}

/** A sweep whose definition cannot be evaluated at all (a missing revision, a structure that does not fit). */
export class SweepDefinitionError extends Error {
  override name = "SweepDefinitionError";
}

/** The variants of a definition: its family, or the one plant revision. */
export function definitionVariants(definition: SweepInputParsed): { plantRevisionId: string; label?: string; parameters?: Record<string, number> }[] {
  return definition.family?.variants ?? [{ plantRevisionId: definition.plantRevisionId }];
}

/** A variant's plant: the revision's model, a nonlinear plant's parameters overridden by the variant's. */
export function variantPlant(model: Plant, parameters: Record<string, number> | undefined): Plant {
  if (!parameters || Object.keys(parameters).length === 0) return model;
  if (model.kind !== "nonlinear") {
    throw new SweepDefinitionError("variant parameters apply to nonlinear plants only; give a separate revision for a linear variant");
  }
  for (const name of Object.keys(parameters)) {
    if (!(name in (model.parameters ?? {}))) {
      throw new SweepDefinitionError(`the plant has no parameter “${name}”; use ${Object.keys(model.parameters ?? {}).join(", ") || "none"}`);
    }
  }
  return { ...model, parameters: { ...model.parameters, ...parameters } };
}

export async function loadEvaluationContext(db: Database, sweepId: string, definition: SweepInputParsed): Promise<SweepEvaluationContext> {
  const family: Plant[] = [];
  for (const variant of definitionVariants(definition)) {
    const revision = await findRevisionById(db, variant.plantRevisionId);
    if (!revision) throw new SweepDefinitionError("a plant revision of this sweep no longer exists");
    family.push(variantPlant(revision.model, variant.parameters));
  }
  const plan = sweepPlan(definition);
  for (const plant of family) {
    const problem = structureProblem(plan.structure, plant);
    if (problem) throw new SweepDefinitionError(problem);
  }
  return { sweepId, definition, family, plan, criteria: [...definition.criteria], total: sweepCandidateCount(definition) };
}

/** Runs evaluateBatch (in process or on a pool) on candidates of the context's plan. */
export type BatchEvaluator = (context: SweepEvaluationContext, candidates: Float64Array) => Promise<BatchResult>;

/**
 * Evaluates candidates [start, end) on every variant and turns the result into stored rows: the
 * aggregate over the family (core aggregateScores with the definition's aggregate) as `scores`,
 * the per-variant scores as `variantScores` (more than one variant), and the candidate status:
 * unstable when unstable on some variant, else diverged when diverged or rejected on some variant
 * (with the reason), else stable.
 */
export async function evaluateRange(context: SweepEvaluationContext, start: number, end: number, evaluate: BatchEvaluator): Promise<CandidateRow[]> {
  const { plan } = context;
  const n = plan.d === 0 ? 0 : plan.candidates.length / plan.d;
  if (!(Number.isInteger(start) && Number.isInteger(end) && 0 <= start && start < end && end <= n)) {
    throw new RangeError(`chunk [${start}, ${end}) lies outside the sweep's ${n} candidates`);
  }
  return (await evaluateCandidates(context, plan.candidates.subarray(start * plan.d, end * plan.d), start, evaluate)).rows;
}

/**
 * evaluateRange for explicit tunable vectors (n × d, e.g. a search's generation) stored from index
 * `first`; also returns the aggregate (n × C, NaN for candidates not stable on every variant).
 */
export async function evaluateCandidates(
  context: SweepEvaluationContext,
  candidates: Float64Array,
  first: number,
  evaluate: BatchEvaluator,
): Promise<{ rows: CandidateRow[]; aggregate: Float64Array }> {
  const { plan, family, criteria } = context;
  const n = plan.d === 0 ? 0 : candidates.length / plan.d;
  const start = first;
  const nf = family.length;
  const nc = criteria.length;
  const result = await evaluate(context, candidates);
  const aggregate = aggregateScores(result.scores, result.status, n, nf, criteria, context.definition.aggregate ?? { kind: "worst" });
  const rows: CandidateRow[] = [];
  for (let i = 0; i < n; i++) {
    const controller = controllerFromVector(plan.structure, candidates, i * plan.d);
    let status: CandidateRow["status"] = "stable";
    let invalid = false;
    for (let f = 0; f < nf; f++) {
      const name = batchStatusName(result.status[i * nf + f] as number);
      if (name === "unstable") status = "unstable";
      else if ((name === "diverged" || name === "invalid") && status !== "unstable") status = "diverged";
      if (name === "invalid") invalid = true;
    }
    const row: CandidateRow = {
      index: start + i,
      params: candidateParams(plan, controller),
      status,
      scores: status === "stable" ? Array.from(aggregate.subarray(i * nc, (i + 1) * nc)) : null,
    };
    if (nf > 1) row.variantScores = Array.from(result.scores.subarray(i * nf * nc, (i + 1) * nf * nc));
    if (status === "diverged" && invalid) row.error = rejectionReason(controller);
    rows.push(row);
  }
  return { rows, aggregate };
}

/** Why core rejected a candidate's controller (its RangeError's sentence). */
function rejectionReason(controller: Parameters<typeof assertValidController>[0]): string {
  try {
    assertValidController(controller);
  } catch (error) {
    return `the controller was rejected: ${error instanceof Error ? error.message : String(error)}`;
  }
  return "the controller was rejected on some variant";
}
