import { evaluateSweepChunkWith, planSweep, SweepPlanError } from "@loopyard/core";
import type { Plant, SweepBatchEvaluator, SweepInputParsed, SweepPlan, SweepRow } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRevisionById } from "../plants/plant-repository.js";
import type { CandidateRow } from "./candidate-repository.js";

/** Everything needed to evaluate any candidate range of a sweep: core's plan of its frozen definition. */
export interface SweepEvaluationContext {
  sweepId: string;
  definition: SweepInputParsed;
  plan: SweepPlan;
}

/** The variants of a definition: its family, or the one plant revision. */
export function definitionVariants(definition: SweepInputParsed): { plantRevisionId: string; label?: string; parameters?: Record<string, number> }[] {
  return definition.family?.variants ?? [{ plantRevisionId: definition.plantRevisionId }];
}

/**
 * Core's plan of a stored definition, its variants' revisions read by id (any workspace: the sweep
 * was checked when it was created). Throws a SweepPlanError when a revision no longer exists or the
 * plants no longer fit.
 */
export async function loadSweepPlan(db: Database, definition: SweepInputParsed): Promise<SweepPlan> {
  return planSweep(definition, await loadSweepModels(db, definition));
}

/** The models of a definition's variants, in family order (see loadSweepPlan). */
export async function loadSweepModels(db: Database, definition: SweepInputParsed): Promise<Plant[]> {
  const models: Plant[] = [];
  for (const [i, variant] of definitionVariants(definition).entries()) {
    const revision = await findRevisionById(db, variant.plantRevisionId);
    if (!revision) throw new SweepPlanError(definition.family ? `family.variants.${i}.plantRevisionId` : "plantRevisionId", "a plant revision of this sweep no longer exists");
    models.push(revision.model);
  }
  return models;
}

export async function loadEvaluationContext(db: Database, sweepId: string, definition: SweepInputParsed): Promise<SweepEvaluationContext> {
  return { sweepId, definition, plan: await loadSweepPlan(db, definition) };
}

/**
 * A core row as stored: a rejected controller ("invalid") is stored as "diverged" with its reason
 * as the candidate's error (the API's three statuses); unstable and diverged rows keep error null.
 */
export function storedRow(row: SweepRow): CandidateRow {
  const stored: CandidateRow = {
    index: row.index,
    params: row.params,
    status: row.status === "invalid" ? "diverged" : row.status,
    scores: row.scores,
  };
  if (row.variantScores !== undefined) stored.variantScores = row.variantScores;
  if (row.status === "invalid") stored.error = row.reason;
  return stored;
}

/** Candidates [start, end) of a sampling design through core evaluateSweepChunk, as stored rows. */
export async function evaluateRange(context: SweepEvaluationContext, start: number, end: number, evaluate: SweepBatchEvaluator): Promise<CandidateRow[]> {
  return (await evaluateSweepChunkWith(context.plan, { start, end }, evaluate)).rows.map(storedRow);
}

/**
 * evaluateRange for explicit tunable vectors (n × d, e.g. a search's generation) stored from index
 * `first`; also returns the aggregate (n × C, NaN for candidates not stable on every variant).
 */
export async function evaluateCandidates(
  context: SweepEvaluationContext,
  vectors: Float64Array,
  first: number,
  evaluate: SweepBatchEvaluator,
): Promise<{ rows: CandidateRow[]; aggregate: Float64Array }> {
  const chunk = await evaluateSweepChunkWith(context.plan, { vectors, first }, evaluate);
  return { rows: chunk.rows.map(storedRow), aggregate: chunk.aggregate };
}
