import {
  canCancelSweep,
  CRITERION_IDS,
  DEFAULT_MAX_CONCURRENT_SWEEPS,
  MAX_SWEEP_CANDIDATES,
  nonDominatedSort,
  orientForMinimisation,
  paretoFront,
  planSweep,
  SweepPlanError,
} from "@loopyard/core";
import type {
  CandidateDto,
  CriterionId,
  FrontDto,
  Plant,
  ResponseDto,
  SweepDetailDto,
  SweepInputParsed,
  SweepSummaryDto,
} from "@loopyard/core";
import type { ComputeFailure } from "@loopyard/core/pool";
import { limitExceeded, type Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import { findPlantIdByName, findRevisionInWorkspace } from "../plants/plant-repository.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findCandidate, findCandidates } from "./candidate-repository.js";
import { candidateListJson, LIST_VARIANT_SCORES_UP_TO, stableScoresFast } from "./candidate-list-json.js";
import { definitionVariants, loadSweepModels } from "./sweep-evaluation.js";
import { fromScoreValue } from "./score-value.js";
import { float64Column, int32Column, pointColumnsBytes } from "./points-repository.js";
import { sweepVariantPlant } from "./sweep-variant-plant.js";
import { countActiveSweeps, findSweepDetail, insertSweep, listSweepSummaries, markSweepCancelled } from "./sweep-repository.js";

export const SWEEP_NOT_FOUND = "There is no such sweep in this workspace.";

export async function listSweeps(db: Database, access: MemberAccess): Promise<SweepSummaryDto[]> {
  return listSweepSummaries(db, access.workspace.id);
}

export async function getSweep(db: Database, access: MemberAccess, sweepId: string): Promise<SweepDetailDto> {
  const detail = await findSweepDetail(db, access.workspace.id, sweepId);
  if (!detail) throw notFound(SWEEP_NOT_FOUND);
  return detail;
}

/** Per-workspace limits of sweeps (LOOPYARD_MAX_CANDIDATES, LOOPYARD_MAX_CONCURRENT_SWEEPS). */
export interface SweepLimits {
  /** Most candidates in one sweep. */
  maxCandidates: number;
  /** Most sweeps queued or running at once in one workspace. */
  maxConcurrentSweeps: number;
}

export const DEFAULT_SWEEP_LIMITS: SweepLimits = { maxCandidates: MAX_SWEEP_CANDIDATES, maxConcurrentSweeps: DEFAULT_MAX_CONCURRENT_SWEEPS };

/** Starts a stored sweep, or stops a cancelled one's jobs (the job system). */
export type SweepStarter = (sweepId: string) => Promise<void>;

/** What the sweep routes ask of the job system. */
export interface SweepJobControl {
  start: SweepStarter;
  cancel: SweepStarter;
}

/**
 * Checks the limits and every variant of the family (a revision of this workspace, parameters that
 * fit, a structure that fits), stores the queued sweep (its definition frozen from here on) and
 * starts it as jobs.
 */
export async function createSweep(
  db: Database,
  startSweep: SweepStarter,
  access: MemberAccess,
  input: SweepInputParsed,
  limits: SweepLimits = DEFAULT_SWEEP_LIMITS,
): Promise<SweepDetailDto> {
  const models: Plant[] = [];
  for (const [i, variant] of definitionVariants(input).entries()) {
    const field = input.family ? `family.variants.${i}.plantRevisionId` : "plantRevisionId";
    const revision = await findRevisionInWorkspace(db, access.workspace.id, variant.plantRevisionId);
    if (!revision) throw badRequest(`${field}: there is no such plant revision in this workspace`, field);
    await assertLabelFitsRevision(db, access.workspace.id, variant.label, revision, i);
    models.push(revision.model);
  }
  let plan;
  try {
    plan = planSweep(input, models);
  } catch (error) {
    if (error instanceof SweepPlanError) throw badRequest(error.message, error.field);
    throw error;
  }
  const total = plan.budget;
  if (total > limits.maxCandidates) {
    throw new HttpError(
      422,
      `This sweep has ${total} candidates, more than the ${limits.maxCandidates} one sweep may hold in this workspace; lower the counts (or the design's count), or ask an admin to raise LOOPYARD_MAX_CANDIDATES.`,
    );
  }
  const active = await countActiveSweeps(db, access.workspace.id);
  if (active >= limits.maxConcurrentSweeps) {
    throw new HttpError(
      409,
      `${access.workspace.name} already runs ${active} sweeps, the most allowed at once; wait for one to finish or cancel one, then start this sweep again.`,
    );
  }
  const sweepId = await insertSweep(db, {
    workspaceId: access.workspace.id,
    createdBy: access.user.id,
    definition: input,
    total,
  });
  await startSweep(sweepId);
  return getSweep(db, access, sweepId);
}

/**
 * A variant's label may not name another plant of the workspace: a label left from an earlier
 * choice of plant ("Ember 200 plate" on an Ember 400 revision) would show wrong names against real
 * numbers in the per-variant table. Labels that name no plant, or the revision's own, are fine.
 */
async function assertLabelFitsRevision(db: Database, workspaceId: string, label: string | undefined, revision: { plantId: string; name: string }, i: number): Promise<void> {
  if (!label || label === revision.name) return;
  const named = await findPlantIdByName(db, workspaceId, label);
  if (named !== null && named !== revision.plantId) {
    const field = `family.variants.${i}.label`;
    throw badRequest(`${field}: “${label}” is the name of another plant; this variant is ${revision.name}, so change the label or leave it empty`, field);
  }
}

/** Cancels a queued or running sweep: workers skip its remaining chunks; chunks already stored are kept. */
export async function cancelSweep(db: Database, stopJobs: SweepStarter, access: MemberAccess, sweepId: string): Promise<SweepDetailDto> {
  const sweep = await getSweep(db, access, sweepId);
  if (!canCancelSweep({ role: access.role, userId: access.user.id }, sweep.createdBy.id)) {
    throw new HttpError(403, `Only ${sweep.createdBy.name} (who started this sweep), a lead or an admin can cancel it; you are ${access.role === "engineer" ? "an" : "a"} ${access.role}.`);
  }
  if (!(await markSweepCancelled(db, sweepId))) {
    throw new HttpError(409, `This sweep is already ${sweep.status}; only a queued or running sweep can be cancelled.`);
  }
  await stopJobs(sweepId);
  return getSweep(db, access, sweepId);
}

/** Most candidates one candidate list returns; larger sweeps get a sample (CandidateListDto.sampled). */
export const CANDIDATE_LIST_LIMIT = 100_000;

/**
 * The candidates of a sweep by index as the JSON text of a CandidateListDto (written from
 * PostgreSQL's text form, see candidateListJson). Over CANDIDATE_LIST_LIMIT stored candidates:
 * every ⌈done / limit⌉-th index (a deterministic sample of at most the limit) plus every candidate
 * of the front for the default axes, with `sampled: true` and `total`. Per-variant scores come
 * with sweeps of at most LIST_VARIANT_SCORES_UP_TO candidates (otherwise from getCandidate).
 */
export async function listCandidatesJson(db: Database, access: MemberAccess, sweepId: string): Promise<string> {
  const sweep = await getSweep(db, access, sweepId);
  const nc = sweep.criteria.length;
  const withVariants = sweep.family.length > 1 && sweep.total <= LIST_VARIANT_SCORES_UP_TO;
  const head = `{"parameters":${JSON.stringify(sweep.parameters)},"criteria":${JSON.stringify(sweep.criteria)}`;
  if (sweep.done <= CANDIDATE_LIST_LIMIT) {
    const { json, count } = await candidateListJson(db, sweepId, { criteria: nc, withVariants });
    return `${head},"candidates":${json},"sampled":false,"total":${count}}`;
  }
  const stride = Math.ceil(sweep.done / CANDIDATE_LIST_LIMIT);
  const front = await frontOf(db, sweep, {});
  const { json } = await candidateListJson(db, sweepId, { criteria: nc, withVariants, stride, extra: front.indices });
  return `${head},"candidates":${json},"sampled":true,"total":${sweep.done}}`;
}

/** One stored candidate with its per-variant scores. */
export async function getCandidate(db: Database, access: MemberAccess, sweepId: string, index: number): Promise<CandidateDto> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = await findCandidate(db, sweepId, index, sweep.criteria.length);
  if (!stored) throw notFound(`This sweep has no stored candidate ${index}.`);
  return stored;
}

/** Checks that a front axis names one of the sweep's criteria; otherwise a 400 naming the parameter. */
export function frontAxis(parameter: "x" | "y" | "criteria", value: string | undefined, criteria: readonly CriterionId[], fallback: CriterionId): CriterionId {
  if (value === undefined || value === "") return fallback;
  if ((criteria as readonly string[]).includes(value)) return value as CriterionId;
  const known = (CRITERION_IDS as readonly string[]).includes(value);
  const problem = known ? `this sweep did not score “${value}”` : `“${value}” is not a criterion`;
  throw badRequest(`${parameter}: ${problem}; choose one of ${criteria.join(", ")}`, parameter);
}

/**
 * The front of a sweep on its AGGREGATE scores (stable candidates with finite scores; larger-is-
 * better criteria turned with orientForMinimisation):
 * - x, y (defaults: the first and the last criterion): paretoFront, indices by x ascending;
 * - `criteria=a,b,c` (two or more): nonDominatedSort over those k objectives; `indices` = rank 0 by
 *   index, `ranks` = the rank of every candidate with finite scores on all k.
 */
export async function getFront(
  db: Database,
  access: MemberAccess,
  sweepId: string,
  query: { x?: string; y?: string; criteria?: string },
): Promise<FrontDto> {
  return frontWithCandidates(db, await getSweep(db, access, sweepId), query);
}

/** The front of a sweep already read (see getFront), with its candidates. */
export async function frontWithCandidates(db: Database, sweep: SweepDetailDto, query: { x?: string; y?: string; criteria?: string }): Promise<FrontDto> {
  const front = await frontOf(db, sweep, query);
  return { ...front, candidates: await findCandidates(db, sweep.id, front.indices, sweep.criteria.length) };
}

/** The front of a sweep (see getFront) without its candidates. */
export async function frontOf(db: Database, sweep: SweepDetailDto, query: { x?: string; y?: string; criteria?: string }): Promise<FrontDto> {
  const sweepId = sweep.id;
  const { criteria } = sweep;
  const x = frontAxis("x", query.x, criteria, criteria[0] as CriterionId);
  const y = frontAxis("y", query.y, criteria, criteria[criteria.length - 1] as CriterionId);
  if (query.criteria !== undefined && query.criteria !== "") {
    const scored = await stableScoresFast(db, sweepId);
    const chosen = query.criteria.split(",").map((id) => frontAxis("criteria", id.trim(), criteria, criteria[0] as CriterionId));
    if (chosen.length < 2 || new Set(chosen).size !== chosen.length) {
      throw badRequest("criteria: list two or more different criteria of the sweep, separated by commas", "criteria");
    }
    const k = chosen.length;
    const columns = chosen.map((id) => orientForMinimisation(Float64Array.from(scored, (c) => c.scores[criteria.indexOf(id)] ?? Number.NaN), id));
    // Keep the candidates finite on every chosen criterion; the others have no rank.
    const kept: number[] = [];
    for (let i = 0; i < scored.length; i++) if (columns.every((col) => Number.isFinite(col[i]))) kept.push(i);
    const objectives = new Float64Array(kept.length * k);
    kept.forEach((i, row) => columns.forEach((col, j) => (objectives[row * k + j] = col[i] as number)));
    const rank = nonDominatedSort(objectives, kept.length, k);
    const indices = kept.filter((_, row) => rank[row] === 0).map((i) => (scored[i] as { index: number }).index);
    return {
      x,
      y,
      indices,
      criteria: chosen,
      ranks: { indices: kept.map((i) => (scored[i] as { index: number }).index), ranks: Array.from(rank) },
    };
  }
  // Only finite scores count: read just the stable candidates finite on both axes, and only those two scores.
  const columns = await pointColumnsBytes(db, sweepId, { xAt: criteria.indexOf(x), yAt: criteria.indexOf(y), paramAt: [] });
  const indices = int32Column(columns.indices);
  const xs = orientForMinimisation(float64Column(columns.xs), x);
  const ys = orientForMinimisation(float64Column(columns.ys), y);
  const positions = paretoFront(xs, ys);
  return { x, y, indices: positions.map((p) => indices[p] as number) };
}

/**
 * Closed-loop response of one candidate under the sweep's scenario, simulated on demand with core
 * simulateLoop (≤ 2000 points per trace) on one variant of the family (the first by default), on the
 * server's compute pool under a work budget and time limit (422 past them). The controller is
 * rebuilt from the stored parameters with the sweep's structure (controllerFromVector), exactly as
 * the runner evaluated it.
 */
export async function getCandidateResponse(
  db: Database,
  compute: Compute,
  access: MemberAccess,
  sweepId: string,
  index: number,
  variant = 0,
): Promise<ResponseDto> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) {
    throw notFound(
      index < sweep.total
        ? `Candidate ${index} of this sweep has not been evaluated yet; try again when the sweep has progressed.`
        : `This sweep has candidates 0 to ${sweep.total - 1}; there is no candidate ${index}.`,
    );
  }
  const models = await loadSweepModels(db, sweep.definition);
  sweepVariantPlant(planSweep(sweep.definition, models), variant);
  const outcome = await compute.run("candidateResponse", { definition: sweep.definition, models, params: stored.params, variant });
  if (!outcome.ok) throw responseRefusal(outcome);
  const trace = outcome.value;
  return {
    index,
    params: Object.fromEntries(sweep.parameters.map((name, i) => [name, stored.params[i] as number])),
    status: stored.status,
    t: trace.t,
    r: trace.r,
    y: trace.y,
    u: trace.u,
  };
}

/** The answer for a candidate whose response could not be computed: 422 past a limit, 409 otherwise. */
function responseRefusal(failure: ComputeFailure): HttpError {
  const limited = limitExceeded(failure, "This candidate's response", "choose another candidate, or a scenario with a shorter horizon.");
  if (limited) return limited;
  if (failure.kind === "ill-posed") {
    return new HttpError(
      409,
      "This candidate makes the loop ill-posed (1 + C·G vanishes at high frequency), so it has no response to show; choose another candidate.",
    );
  }
  return new HttpError(409, `This candidate could not be simulated (${failure.reason}); choose another candidate.`);
}

