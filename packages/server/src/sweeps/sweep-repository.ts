import { and, asc, count, desc, eq, inArray, sql } from "drizzle-orm";
import { sweepInputSchema, sweepParameterNames } from "@loopyard/core";
import type { CriterionId, PlantKind, SweepDetailDto, SweepInputParsed, SweepStatus, SweepSummaryDto, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { candidate, plantRevision, sweep, user } from "../db/schema.js";
import { sweepProgress } from "./sweep-chunk-repository.js";
import { userDtoColumns } from "../users/user-repository.js";

/**
 * A stored definition as the current sweepInputSchema reads it: definitions stored by earlier
 * versions parse to the same sweep (defaults filled in); one that no longer parses is used as stored.
 */
export function storedDefinition(raw: unknown): SweepInputParsed {
  const parsed = sweepInputSchema.safeParse(raw);
  return parsed.success ? parsed.data : (raw as SweepInputParsed);
}

const summaryColumns = {
  id: sweep.id,
  name: sweep.name,
  status: sweep.status,
  total: sweep.total,
  done: sweep.done,
  error: sweep.error,
  createdAt: sweep.createdAt,
  finishedAt: sweep.finishedAt,
  definition: sweep.definition,
  plantId: plantRevision.plantId,
  plantName: plantRevision.name,
  plantKind: sql<PlantKind>`${plantRevision.model}->>'kind'`,
  revisionId: plantRevision.id,
  revisionNumber: plantRevision.number,
  createdBy: userDtoColumns,
};

interface SummaryRow {
  id: string;
  name: string;
  status: SweepStatus;
  total: number;
  done: number;
  error: string | null;
  createdAt: Date;
  finishedAt: Date | null;
  definition: unknown;
  plantId: string;
  plantName: string;
  plantKind: PlantKind;
  revisionId: string;
  revisionNumber: number;
  createdBy: UserDto;
}

function toSummary(row: SummaryRow): SweepSummaryDto {
  return {
    id: row.id,
    name: row.name,
    status: row.status,
    plant: { id: row.plantId, name: row.plantName, kind: row.plantKind, revisionId: row.revisionId, revisionNumber: row.revisionNumber },
    total: row.total,
    done: row.done,
    progress: {
      done: row.done,
      total: row.total,
      ratePerSecond: null,
      etaSeconds: null,
      workersActive: 0,
      chunksTotal: 0,
      chunksDone: 0,
      chunksFailed: 0,
      failures: [],
    },
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt ? row.finishedAt.toISOString() : null,
    createdBy: row.createdBy,
    error: row.error,
  };
}

/** The columns of a summary without the definition (a list shows no definition). */
const { definition: _definition, ...listColumns } = summaryColumns;

function summaryQuery(db: Database) {
  return db
    .select(summaryColumns)
    .from(sweep)
    .innerJoin(plantRevision, eq(plantRevision.id, sweep.plantRevisionId))
    .innerJoin(user, eq(user.id, sweep.createdBy));
}

function listQuery(db: Database) {
  return db
    .select({ ...listColumns, sweepCount: sql<number>`(count(*) over ())::int` })
    .from(sweep)
    .innerJoin(plantRevision, eq(plantRevision.id, sweep.plantRevisionId))
    .innerJoin(user, eq(user.id, sweep.createdBy));
}

/** Sweeps of a workspace, newest first (at most `limit` when given). */
export async function listSweepSummaries(db: Database, workspaceId: string, limit?: number): Promise<SweepSummaryDto[]> {
  const query = listQuery(db).where(eq(sweep.workspaceId, workspaceId)).orderBy(desc(sweep.createdAt), desc(sweep.id));
  const rows = limit === undefined ? await query : await query.limit(limit);
  return withProgress(db, rows.map((row) => toSummary({ ...row, definition: null })));
}

/** The `limit` newest sweeps of a workspace and how many it has, in one query (the count is a window over every row of the workspace, taken before the limit). */
export async function listRecentSweeps(db: Database, workspaceId: string, limit: number): Promise<{ total: number; sweeps: SweepSummaryDto[] }> {
  const rows = await listQuery(db)
    .where(eq(sweep.workspaceId, workspaceId))
    .orderBy(desc(sweep.createdAt), desc(sweep.id))
    .limit(limit);
  // With no sweep there is no row to carry the count, and the count is 0.
  const total = rows[0]?.sweepCount ?? 0;
  return { total, sweeps: await withProgress(db, rows.map((row) => toSummary({ ...row, definition: null }))) };
}

/** Summaries with their live progress figures (sweep_chunk, worker). */
async function withProgress<T extends SweepSummaryDto>(db: Database, summaries: T[]): Promise<T[]> {
  const progress = await sweepProgress(db, summaries);
  for (const summary of summaries) {
    const figures = progress.get(summary.id);
    if (figures) summary.progress = figures;
  }
  return summaries;
}

/**
 * Candidate counts by status of finished sweeps, kept per process: once every chunk is stored they
 * never change, and counting them reads every candidate (10⁶ rows for a large sweep) on each request.
 */
const finishedCounts = new Map<string, Map<string, number>>();
const FINISHED_COUNTS_KEPT = 256;

async function statusCounts(db: Database, sweepId: string, finished: boolean): Promise<Map<string, number>> {
  const kept = finished ? finishedCounts.get(sweepId) : undefined;
  if (kept) return kept;
  const rows = await db.select({ status: candidate.status, n: count() }).from(candidate).where(eq(candidate.sweepId, sweepId)).groupBy(candidate.status);
  const counts = new Map(rows.map((r) => [r.status as string, r.n]));
  if (finished) {
    if (finishedCounts.size >= FINISHED_COUNTS_KEPT) finishedCounts.delete(finishedCounts.keys().next().value as string);
    finishedCounts.set(sweepId, counts);
  }
  return counts;
}

/** One sweep of a workspace with its definition and unstable count, or null. */
export async function findSweepDetail(db: Database, workspaceId: string, sweepId: string): Promise<SweepDetailDto | null> {
  const rows = await summaryQuery(db)
    .where(and(eq(sweep.workspaceId, workspaceId), eq(sweep.id, sweepId)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  const counts = await statusCounts(db, sweepId, row.status === "finished");
  const countOf = (status: string) => counts.get(status) ?? 0;
  const definition = storedDefinition(row.definition);
  const parameters = sweepParameterNames(definition);
  const variants = definition.family?.variants ?? [{ plantRevisionId: row.revisionId }];
  const revisions = await db
    .select({ id: plantRevision.id, plantId: plantRevision.plantId, number: plantRevision.number, name: plantRevision.name })
    .from(plantRevision)
    .where(inArray(plantRevision.id, [...new Set(variants.map((v) => v.plantRevisionId))]));
  const family = variants.map((variant, i) => {
    const revision = revisions.find((r) => r.id === variant.plantRevisionId);
    const plantName = revision?.name ?? "(missing revision)";
    return {
      label: variant.label ?? (variants.length > 1 ? `${plantName} #${i + 1}` : plantName),
      plantId: revision?.plantId ?? "",
      revisionId: variant.plantRevisionId,
      revisionNumber: revision?.number ?? 0,
      plantName,
    };
  });
  const [summary] = await withProgress(db, [toSummary(row)]);
  return {
    ...(summary as SweepSummaryDto),
    definition,
    parameters,
    swept: parameters.filter((name) => name in definition.ranges),
    criteria: [...definition.criteria],
    unstableCount: countOf("unstable"),
    divergedCount: countOf("diverged"),
    family,
  };
}

/** The id of the sweep with this name in the workspace, or null. */
export async function findSweepIdByName(db: Database, workspaceId: string, name: string): Promise<string | null> {
  const rows = await db.select({ id: sweep.id }).from(sweep).where(and(eq(sweep.workspaceId, workspaceId), eq(sweep.name, name))).limit(1);
  return rows[0]?.id ?? null;
}

export async function insertSweep(
  db: Database,
  values: { workspaceId: string; createdBy: string; definition: SweepInputParsed; total: number },
): Promise<string> {
  const [row] = await db
    .insert(sweep)
    .values({
      workspaceId: values.workspaceId,
      name: values.definition.name,
      plantRevisionId: values.definition.plantRevisionId,
      structure: values.definition.structure,
      definition: values.definition,
      status: "queued",
      total: values.total,
      done: 0,
      createdBy: values.createdBy,
    })
    .returning({ id: sweep.id });
  if (!row) throw new Error("insert into sweep returned no row");
  return row.id;
}

/** The stored references of a sweep (sweep.stored_references, as written by storeReferences), or null. */
export async function findStoredReferences(db: Database, sweepId: string): Promise<unknown> {
  const [row] = await db.select({ stored: sweep.storedReferences }).from(sweep).where(eq(sweep.id, sweepId));
  return row?.stored ?? null;
}

/** Stores the references of a sweep (any earlier value is replaced: they follow from the definition alone). */
export async function storeReferences(db: Database, sweepId: string, stored: unknown): Promise<void> {
  await db.update(sweep).set({ storedReferences: stored }).where(eq(sweep.id, sweepId));
}

/** What the runner needs to evaluate a sweep. */
export interface SweepRunRecord {
  id: string;
  status: SweepStatus;
  total: number;
  plantRevisionId: string;
  definition: SweepInputParsed;
  criteria: CriterionId[];
}

export async function findSweepForRun(db: Database, sweepId: string): Promise<SweepRunRecord | null> {
  const rows = await db
    .select({ id: sweep.id, status: sweep.status, total: sweep.total, plantRevisionId: sweep.plantRevisionId, definition: sweep.definition })
    .from(sweep)
    .where(eq(sweep.id, sweepId))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  const definition = storedDefinition(row.definition);
  return { ...row, definition, criteria: [...definition.criteria] };
}

/** Sweeps a stopped process left queued or running, oldest first. */
export async function listUnfinishedSweepIds(db: Database): Promise<string[]> {
  const rows = await db
    .select({ id: sweep.id })
    .from(sweep)
    .where(inArray(sweep.status, ["queued", "running"]))
    .orderBy(asc(sweep.createdAt));
  return rows.map((row) => row.id);
}

export async function markSweepRunning(db: Database, sweepId: string): Promise<void> {
  await db
    .update(sweep)
    .set({ status: "running", updatedAt: new Date() })
    .where(and(eq(sweep.id, sweepId), inArray(sweep.status, ["queued", "running"])));
}

export async function markSweepFinished(db: Database, sweepId: string): Promise<void> {
  const now = new Date();
  await db
    .update(sweep)
    .set({ status: "finished", updatedAt: now, finishedAt: now, done: sql`${sweep.total}` })
    .where(and(eq(sweep.id, sweepId), inArray(sweep.status, ["queued", "running"])));
}

/** Cancels a queued or running sweep; returns false when it had already stopped. */
export async function markSweepCancelled(db: Database, sweepId: string): Promise<boolean> {
  const now = new Date();
  const rows = await db
    .update(sweep)
    .set({ status: "cancelled", updatedAt: now, finishedAt: now })
    .where(and(eq(sweep.id, sweepId), inArray(sweep.status, ["queued", "running"])))
    .returning({ id: sweep.id });
  return rows.length > 0;
}

/** Sweeps of a workspace that are queued or running. */
export async function countActiveSweeps(db: Database, workspaceId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(sweep)
    .where(and(eq(sweep.workspaceId, workspaceId), inArray(sweep.status, ["queued", "running"])));
  return row?.n ?? 0;
}

export async function markSweepFailed(db: Database, sweepId: string, error: string): Promise<void> {
  const now = new Date();
  await db
    .update(sweep)
    .set({ status: "failed", error, updatedAt: now, finishedAt: now })
    .where(and(eq(sweep.id, sweepId), inArray(sweep.status, ["queued", "running"])));
}
