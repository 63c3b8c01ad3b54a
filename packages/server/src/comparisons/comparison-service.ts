import { contenderKey, controllerFromVector, downsampleIndices, frequencyResponse, IllPosedLoopError, loopTransferFunction, pick, simulateLoop, thinFrequencyResponse } from "@loopyard/core";
import type {
  ComparisonAcrossDto,
  ComparisonDetailDto,
  ComparisonInput,
  ComparisonPick,
  ComparisonPlan,
  ComparisonResponsesDto,
  ComparisonSummaryDto,
  ComparisonVariantDto,
  LinearPlant,
  PickResponseDto,
} from "@loopyard/core";
import { inArray } from "drizzle-orm";
import type PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { plantRevision } from "../db/schema.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import { findRevisionInWorkspace } from "../plants/plant-repository.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { ComparisonDefinitionError, planOf, resolveFamily, storedInput, worstVariantOf } from "./comparison-engine.js";
import { advanceComparison, cancelComparisonJobs, prescanChunks } from "./comparison-jobs.js";
import {
  comparisonProgress,
  countActiveComparisons,
  findComparisonInWorkspace,
  insertComparison,
  listComparisonRecords,
  listFinishedResults,
  loadPicks,
  loadResult,
  markComparisonCancelled,
  type ComparisonRecord,
} from "./comparison-repository.js";

export const COMPARISON_NOT_FOUND = "There is no such comparison in this workspace.";
/** Most comparisons queued or running at once in one workspace. */
export const MAX_CONCURRENT_COMPARISONS = 3;
/** Points of |S(jω)| sent per pick. */
export const SENSITIVITY_POINTS = 300;

/** What the comparison routes ask of the job system. */
export interface ComparisonJobControl {
  /** The started pg-boss, once it is. */
  boss(): Promise<PgBoss>;
}

/** The variants of a stored comparison as the pages name them (labels as the engine names them). */
async function familyOf(db: Database, input: ComparisonInput): Promise<ComparisonVariantDto[]> {
  const variants = input.family?.variants ?? [];
  const ids = [...new Set(variants.map((v) => v.plantRevisionId))];
  const revisions =
    ids.length === 0
      ? []
      : await db
          .select({ id: plantRevision.id, plantId: plantRevision.plantId, number: plantRevision.number, name: plantRevision.name })
          .from(plantRevision)
          .where(inArray(plantRevision.id, ids));
  const seen = new Set<string>();
  return variants.map((variant, i) => {
    const revision = revisions.find((r) => r.id === variant.plantRevisionId);
    const plantName = revision?.name ?? "(missing revision)";
    let label = variant.label && variant.label !== "" ? variant.label : plantName;
    if (seen.has(label)) label = `${label} #${i + 1}`;
    seen.add(label);
    return { label, plantId: revision?.plantId ?? "", revisionId: variant.plantRevisionId, revisionNumber: revision?.number ?? 0, plantName };
  });
}

async function summaries(db: Database, records: readonly ComparisonRecord[]): Promise<ComparisonSummaryDto[]> {
  const progress = await comparisonProgress(db, records);
  return Promise.all(
    records.map(async (record) => {
      const input = storedInput(record.definition);
      return {
        id: record.id,
        name: record.name,
        status: record.status,
        contenders: (input.contenders ?? []).map((c) => contenderKey(c)),
        judges: [...(input.judges ?? [])],
        structure: input.structure ?? "",
        family: await familyOf(db, input),
        progress: progress.get(record.id) as ComparisonSummaryDto["progress"],
        createdAt: record.createdAt.toISOString(),
        finishedAt: record.finishedAt ? record.finishedAt.toISOString() : null,
        createdBy: record.createdBy,
        error: record.error,
      };
    }),
  );
}

export async function listComparisons(db: Database, access: MemberAccess): Promise<ComparisonSummaryDto[]> {
  return summaries(db, await listComparisonRecords(db, access.workspace.id));
}

async function findRecord(db: Database, access: MemberAccess, comparisonId: string): Promise<ComparisonRecord> {
  const record = await findComparisonInWorkspace(db, access.workspace.id, comparisonId);
  if (!record) throw notFound(COMPARISON_NOT_FOUND);
  return record;
}

export async function getComparison(db: Database, access: MemberAccess, comparisonId: string): Promise<ComparisonDetailDto> {
  const record = await findRecord(db, access, comparisonId);
  const [summary] = await summaries(db, [record]);
  return { ...(summary as ComparisonSummaryDto), definition: storedInput(record.definition) };
}

/**
 * Checks every variant (a revision of this workspace, parameters that fit), plans the comparison
 * with core (its refusals become 400s naming the field), checks the workspace's limit, stores the
 * queued comparison with its pre-scan chunks and pending picks (frozen from here on) and enqueues
 * its first jobs.
 */
export async function createComparison(db: Database, jobs: ComparisonJobControl, access: MemberAccess, input: ComparisonInput): Promise<ComparisonDetailDto> {
  for (const [i, variant] of input.family.variants.entries()) {
    const field = `family.variants.${i}.plantRevisionId`;
    if (!(await findRevisionInWorkspace(db, access.workspace.id, variant.plantRevisionId))) throw badRequest(`${field}: there is no such plant revision in this workspace`, field);
  }
  let plan: ComparisonPlan;
  try {
    plan = planOf(input, await resolveFamily(db, input));
  } catch (error) {
    if (error instanceof ComparisonDefinitionError) {
      const field = /^([\w.]+):/.exec(error.message)?.[1];
      throw badRequest(error.message, field);
    }
    throw error;
  }
  const active = await countActiveComparisons(db, access.workspace.id);
  if (active >= MAX_CONCURRENT_COMPARISONS) {
    throw new HttpError(
      409,
      `${access.workspace.name} already runs ${active} comparisons, the most allowed at once; wait for one to finish or cancel one, then start this comparison again.`,
    );
  }
  const total = plan.budget.prescan;
  const comparisonId = await insertComparison(db, {
    workspaceId: access.workspace.id,
    createdBy: access.user.id,
    name: input.name,
    definition: input,
    prescanTotal: total,
    contenders: plan.contenders,
    chunks: prescanChunks(total, plan.variants.length),
  });
  await advanceComparison(db, await jobs.boss(), comparisonId);
  return getComparison(db, access, comparisonId);
}

/** Cancels a queued or running comparison: its queued jobs are cancelled; a piece being worked finishes. */
export async function cancelComparison(db: Database, jobs: ComparisonJobControl, access: MemberAccess, comparisonId: string): Promise<ComparisonDetailDto> {
  const record = await findRecord(db, access, comparisonId);
  if (!(await markComparisonCancelled(db, comparisonId))) {
    throw new HttpError(409, `This comparison is already ${record.status}; only a queued or running comparison can be cancelled.`);
  }
  await cancelComparisonJobs(db, await jobs.boss(), comparisonId);
  return getComparison(db, access, comparisonId);
}

/**
 * The stored analysis of a finished comparison (core's ComparisonAnalysis) as JSON text, every
 * number as in ScoreValue: finite as is, ±∞ as "inf" / "-inf" (a regret against a best of 0, a
 * settling time never reached), NaN as null (not scored, does not apply).
 */
export async function getComparisonResultJson(db: Database, access: MemberAccess, comparisonId: string): Promise<string> {
  const result = await getComparisonResult(db, access, comparisonId);
  return JSON.stringify(result, (_key, value: unknown) =>
    typeof value === "number" && !Number.isFinite(value) ? (Number.isNaN(value) ? null : value > 0 ? "inf" : "-inf") : value,
  );
}

/** The stored analysis of a finished comparison. */
export async function getComparisonResult(db: Database, access: MemberAccess, comparisonId: string): Promise<unknown> {
  const record = await findRecord(db, access, comparisonId);
  if (record.status !== "finished") {
    const why: Record<string, string> = {
      queued: "it is queued; its result is ready when it finishes",
      running: "it is still running; its result is ready when it finishes",
      failed: `it failed (${record.error ?? "see its page"}); start it again`,
      cancelled: "it was cancelled before it finished; start it again to get a result",
    };
    throw new HttpError(409, `This comparison has no result yet: ${why[record.status] ?? record.status}.`);
  }
  const result = await loadResult<unknown>(db, comparisonId);
  if (result === null) throw new HttpError(409, "This comparison finished without a stored result; start it again.");
  return result;
}

/**
 * The closed-loop responses of every pick on one variant (`variant` in family order), or each pick
 * on its own worst variant (`variant` null: the variant that sets its contender's aggregate): y(t),
 * u(t) simulated with core simulateLoop under the comparison's scenario (≤ 2000 points per trace)
 * and |S(jω)| from core frequencyResponse (linear plants; ≤ SENSITIVITY_POINTS points).
 */
export async function getPickResponses(db: Database, access: MemberAccess, comparisonId: string, variant: number | null): Promise<ComparisonResponsesDto> {
  const record = await findRecord(db, access, comparisonId);
  const input = storedInput(record.definition);
  const count = input.family?.variants.length ?? 0;
  if (variant !== null && !(variant < count)) {
    throw badRequest(`variant: this comparison's family has variants 0 to ${count - 1}; there is no variant ${variant}`, "variant");
  }
  const picks = (await loadPicks<ComparisonPick>(db, comparisonId)).map((p) => p.pick);
  if (picks.length === 0) throw new HttpError(409, "No pick of this comparison is found yet; the responses appear once its contenders are refined.");
  let plan: ComparisonPlan;
  try {
    plan = planOf(input, await resolveFamily(db, input));
  } catch (error) {
    if (error instanceof ComparisonDefinitionError) throw new HttpError(409, `The comparison can no longer be simulated: ${error.message}.`);
    throw error;
  }
  const family = await familyOf(db, input);
  return {
    variant,
    picks: picks.map((p) => {
      const k = plan.columns.findIndex((c) => c.key === p.contender);
      const f = variant ?? worstVariantOf(plan, p, k);
      return pickResponse(plan, p, f, family[f]?.label ?? `variant ${f + 1}`);
    }),
  };
}

function pickResponse(plan: ComparisonPlan, p: ComparisonPick, f: number, variantLabel: string): PickResponseDto {
  const empty = { t: [], r: [], y: [], u: [], omega: [], sensitivity: [] };
  const base = { contender: p.contender, variant: f, variantLabel };
  if (!p.found || p.vector.length === 0) return { ...base, status: "failed", reason: p.reason ?? "this contender has no pick", ...empty };
  const plant = plan.setup.family[f];
  if (!plant) return { ...base, status: "failed", reason: "the variant is missing", ...empty };
  const controller = controllerFromVector(plan.setup.structure, Float64Array.from(p.vector));
  let trace;
  try {
    trace = simulateLoop(plant, controller, plan.setup.scenario);
  } catch (error) {
    if (error instanceof IllPosedLoopError) return { ...base, status: "failed", reason: "the loop is ill-posed on this variant (1 + C·G vanishes at high frequency)", ...empty };
    if (error instanceof RangeError || error instanceof TypeError) return { ...base, status: "failed", reason: error.message, ...empty };
    throw error;
  }
  const indices = downsampleIndices(trace.t.length);
  let omega: number[] = [];
  let sensitivity: number[] = [];
  if (plant.kind !== "nonlinear") {
    try {
      // Core's plotting grid: the band where the loop matters, log-spaced, the peaks of |S| and |T| kept (so the plotted maximum is Ms).
      const thinned = thinFrequencyResponse(frequencyResponse(loopTransferFunction(plant as LinearPlant, controller)), SENSITIVITY_POINTS);
      omega = thinned.omega;
      sensitivity = thinned.S;
    } catch (error) {
      if (!(error instanceof RangeError || error instanceof TypeError)) throw error;
    }
  }
  return { ...base, status: "ok", t: pick(trace.t, indices), r: pick(trace.r, indices), y: pick(trace.y, indices), u: pick(trace.u, indices), omega, sensitivity };
}

