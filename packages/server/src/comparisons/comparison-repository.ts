import { and, asc, count, desc, eq, gt, inArray, sql } from "drizzle-orm";
import type { ComparisonProgressDto, ComparisonStatus, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { comparison, comparisonChunk, comparisonPick, user, worker } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";
import { fromStoredJson, toStoredJson } from "./stored-json.js";

/** A worker counts as active when its heartbeat is at most this old [s] (as for sweeps). */
const WORKER_ALIVE_SECONDS = 15;

/** One row of the comparison table as the services read it. */
export interface ComparisonRecord {
  id: string;
  workspaceId: string;
  name: string;
  definition: unknown;
  status: ComparisonStatus;
  prescanTotal: number;
  contenders: number;
  error: string | null;
  createdAt: Date;
  finishedAt: Date | null;
  createdBy: UserDto;
}

/** One chunk of the pre-scan: design points [start, end). */
export interface PrescanChunkRange {
  chunk: number;
  start: number;
  end: number;
}

const recordColumns = {
  id: comparison.id,
  workspaceId: comparison.workspaceId,
  name: comparison.name,
  definition: comparison.definition,
  status: comparison.status,
  prescanTotal: comparison.prescanTotal,
  contenders: comparison.contenders,
  error: comparison.error,
  createdAt: comparison.createdAt,
  finishedAt: comparison.finishedAt,
  createdBy: userDtoColumns,
};

function recordQuery(db: Database) {
  return db.select(recordColumns).from(comparison).innerJoin(user, eq(user.id, comparison.createdBy));
}

/** Inserts a queued comparison with its pre-scan chunks and one pending pick per contender, in one transaction. */
export async function insertComparison(
  db: Database,
  values: { workspaceId: string; createdBy: string; name: string; definition: unknown; prescanTotal: number; contenders: number; chunks: readonly PrescanChunkRange[] },
): Promise<string> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(comparison)
      .values({
        workspaceId: values.workspaceId,
        name: values.name,
        definition: values.definition,
        status: "queued",
        prescanTotal: values.prescanTotal,
        contenders: values.contenders,
        createdBy: values.createdBy,
      })
      .returning({ id: comparison.id });
    if (!row) throw new Error("insert into comparison returned no row");
    if (values.chunks.length > 0) {
      await tx.insert(comparisonChunk).values(values.chunks.map((c) => ({ comparisonId: row.id, chunk: c.chunk, start: c.start, end: c.end })));
    }
    await tx.insert(comparisonPick).values(Array.from({ length: values.contenders }, (_, contender) => ({ comparisonId: row.id, contender })));
    return row.id;
  });
}

export async function findComparison(db: Database, comparisonId: string): Promise<ComparisonRecord | null> {
  const rows = await recordQuery(db).where(eq(comparison.id, comparisonId)).limit(1);
  return rows[0] ?? null;
}

export async function findComparisonInWorkspace(db: Database, workspaceId: string, comparisonId: string): Promise<ComparisonRecord | null> {
  const rows = await recordQuery(db)
    .where(and(eq(comparison.workspaceId, workspaceId), eq(comparison.id, comparisonId)))
    .limit(1);
  return rows[0] ?? null;
}

/** Comparisons of a workspace, newest first. */
export async function listComparisonRecords(db: Database, workspaceId: string): Promise<ComparisonRecord[]> {
  return recordQuery(db).where(eq(comparison.workspaceId, workspaceId)).orderBy(desc(comparison.createdAt), desc(comparison.id));
}

/** The id of the comparison with this name in the workspace, or null. */
export async function findComparisonIdByName(db: Database, workspaceId: string, name: string): Promise<string | null> {
  const rows = await db
    .select({ id: comparison.id })
    .from(comparison)
    .where(and(eq(comparison.workspaceId, workspaceId), eq(comparison.name, name)))
    .limit(1);
  return rows[0]?.id ?? null;
}

/** Comparisons a stopped process left queued or running, oldest first. */
export async function listUnfinishedComparisonIds(db: Database): Promise<string[]> {
  const rows = await db
    .select({ id: comparison.id })
    .from(comparison)
    .where(inArray(comparison.status, ["queued", "running"]))
    .orderBy(asc(comparison.createdAt));
  return rows.map((r) => r.id);
}

/** Comparisons of a workspace that are queued or running. */
export async function countActiveComparisons(db: Database, workspaceId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(comparison)
    .where(and(eq(comparison.workspaceId, workspaceId), inArray(comparison.status, ["queued", "running"])));
  return row?.n ?? 0;
}

/** The pre-scan chunks of a comparison still to run, by number. */
export async function listPendingPrescanChunks(db: Database, comparisonId: string): Promise<PrescanChunkRange[]> {
  return db
    .select({ chunk: comparisonChunk.chunk, start: comparisonChunk.start, end: comparisonChunk.end })
    .from(comparisonChunk)
    .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.status, "pending")))
    .orderBy(asc(comparisonChunk.chunk));
}

/** Counts of the comparison's chunks and picks by status. */
export interface ComparisonTaskCounts {
  chunks: { pending: number; done: number; failed: number };
  picks: { pending: number; done: number; failed: number };
}

export async function taskCounts(db: Database, comparisonId: string): Promise<ComparisonTaskCounts> {
  const [chunkRows, pickRows] = await Promise.all([
    db.select({ status: comparisonChunk.status, n: count() }).from(comparisonChunk).where(eq(comparisonChunk.comparisonId, comparisonId)).groupBy(comparisonChunk.status),
    db.select({ status: comparisonPick.status, n: count() }).from(comparisonPick).where(eq(comparisonPick.comparisonId, comparisonId)).groupBy(comparisonPick.status),
  ]);
  const of = (rows: { status: string; n: number }[]) => ({
    pending: rows.find((r) => r.status === "pending")?.n ?? 0,
    done: rows.find((r) => r.status === "done")?.n ?? 0,
    failed: rows.find((r) => r.status === "failed")?.n ?? 0,
  });
  return { chunks: of(chunkRows), picks: of(pickRows) };
}

/** The contenders (indices) whose pick is still to find. */
export async function listPendingPicks(db: Database, comparisonId: string): Promise<number[]> {
  const rows = await db
    .select({ contender: comparisonPick.contender })
    .from(comparisonPick)
    .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.status, "pending")))
    .orderBy(asc(comparisonPick.contender));
  return rows.map((r) => r.contender);
}

export async function chunkState(db: Database, comparisonId: string, chunk: number): Promise<"pending" | "done" | "failed" | null> {
  const [row] = await db
    .select({ status: comparisonChunk.status })
    .from(comparisonChunk)
    .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.chunk, chunk)));
  return row?.status ?? null;
}

export async function pickState(db: Database, comparisonId: string, contender: number): Promise<"pending" | "done" | "failed" | null> {
  const [row] = await db
    .select({ status: comparisonPick.status })
    .from(comparisonPick)
    .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.contender, contender)));
  return row?.status ?? null;
}

/** Counts one more attempt of a chunk or a pick (for the failure report). */
export async function countAttempt(db: Database, comparisonId: string, task: { chunk: number } | { contender: number }): Promise<void> {
  if ("chunk" in task) {
    await db
      .update(comparisonChunk)
      .set({ attempts: sql`${comparisonChunk.attempts} + 1` })
      .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.chunk, task.chunk)));
  } else {
    await db
      .update(comparisonPick)
      .set({ attempts: sql`${comparisonPick.attempts} + 1` })
      .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.contender, task.contender)));
  }
}

/**
 * Stores a pre-scan chunk's points and marks it done in ONE transaction (the chunk row is locked;
 * a chunk no longer pending changes nothing, so a retried or doubled job is harmless); a queued
 * comparison becomes running. Returns whether this call stored it.
 */
export async function completePrescanChunk(db: Database, comparisonId: string, chunk: number, data: unknown, workerId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const locked = await tx
      .select({ status: comparisonChunk.status })
      .from(comparisonChunk)
      .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.chunk, chunk)))
      .for("update");
    if (locked[0]?.status !== "pending") return false;
    const now = new Date();
    await tx
      .update(comparisonChunk)
      .set({ status: "done", data: toStoredJson(data), workerId, finishedAt: now, error: null })
      .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.chunk, chunk)));
    await markRunning(tx, comparisonId, now);
    return true;
  });
}

/** Stores a contender's pick and marks it done in one transaction (as completePrescanChunk). */
export async function completePick(db: Database, comparisonId: string, contender: number, data: unknown, workerId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const locked = await tx
      .select({ status: comparisonPick.status })
      .from(comparisonPick)
      .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.contender, contender)))
      .for("update");
    if (locked[0]?.status !== "pending") return false;
    const now = new Date();
    await tx
      .update(comparisonPick)
      .set({ status: "done", data: toStoredJson(data), workerId, finishedAt: now, error: null })
      .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.contender, contender)));
    await markRunning(tx, comparisonId, now);
    return true;
  });
}

/** Marks a chunk or a pick failed after its last retry, with the error (only while pending). */
export async function failTask(db: Database, comparisonId: string, task: { chunk: number } | { contender: number }, error: string, workerId: string): Promise<void> {
  const now = new Date();
  if ("chunk" in task) {
    await db
      .update(comparisonChunk)
      .set({ status: "failed", error, workerId, finishedAt: now })
      .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.chunk, task.chunk), eq(comparisonChunk.status, "pending")));
  } else {
    await db
      .update(comparisonPick)
      .set({ status: "failed", error, workerId, finishedAt: now })
      .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.contender, task.contender), eq(comparisonPick.status, "pending")));
  }
}

async function markRunning(tx: Database, comparisonId: string, now: Date): Promise<void> {
  await tx
    .update(comparison)
    .set({ updatedAt: now, status: sql`case when ${comparison.status} = 'queued' then 'running'::comparison_status else ${comparison.status} end` })
    .where(eq(comparison.id, comparisonId));
}

/** The stored pre-scan chunks of a comparison (done ones), by number, as core returned them. */
export async function loadPrescanChunks<T>(db: Database, comparisonId: string): Promise<T[]> {
  const rows = await db
    .select({ data: comparisonChunk.data })
    .from(comparisonChunk)
    .where(and(eq(comparisonChunk.comparisonId, comparisonId), eq(comparisonChunk.status, "done")))
    .orderBy(asc(comparisonChunk.chunk));
  return rows.map((r) => fromStoredJson<T>(r.data));
}

/** The stored picks of a comparison (done ones), by contender, as core returned them. */
export async function loadPicks<T>(db: Database, comparisonId: string): Promise<{ contender: number; pick: T }[]> {
  const rows = await db
    .select({ contender: comparisonPick.contender, data: comparisonPick.data })
    .from(comparisonPick)
    .where(and(eq(comparisonPick.comparisonId, comparisonId), eq(comparisonPick.status, "done")))
    .orderBy(asc(comparisonPick.contender));
  return rows.map((r) => ({ contender: r.contender, pick: fromStoredJson<T>(r.data) }));
}

/** Stores the analysis and finishes a queued or running comparison in one statement; returns whether it did. */
export async function finishComparison(db: Database, comparisonId: string, result: unknown): Promise<boolean> {
  const now = new Date();
  const rows = await db
    .update(comparison)
    .set({ status: "finished", result: toStoredJson(result), updatedAt: now, finishedAt: now })
    .where(and(eq(comparison.id, comparisonId), inArray(comparison.status, ["queued", "running"])))
    .returning({ id: comparison.id });
  return rows.length > 0;
}

/** The stored analysis of a comparison, or null until it has finished. */
export async function loadResult<T>(db: Database, comparisonId: string): Promise<T | null> {
  const [row] = await db.select({ result: comparison.result }).from(comparison).where(eq(comparison.id, comparisonId));
  return row?.result === null || row?.result === undefined ? null : fromStoredJson<T>(row.result);
}

/** The stored analyses of finished comparisons of a workspace, oldest first. */
export async function listFinishedResults<T>(db: Database, workspaceId: string): Promise<{ id: string; name: string; definition: unknown; finishedAt: Date | null; result: T }[]> {
  const rows = await db
    .select({ id: comparison.id, name: comparison.name, definition: comparison.definition, finishedAt: comparison.finishedAt, result: comparison.result })
    .from(comparison)
    .where(and(eq(comparison.workspaceId, workspaceId), eq(comparison.status, "finished")))
    .orderBy(asc(comparison.createdAt));
  return rows.map((r) => ({ ...r, result: fromStoredJson<T>(r.result) }));
}

/** Fails a queued or running comparison with a sentence saying why. */
export async function markComparisonFailed(db: Database, comparisonId: string, error: string): Promise<void> {
  const now = new Date();
  await db
    .update(comparison)
    .set({ status: "failed", error, updatedAt: now, finishedAt: now })
    .where(and(eq(comparison.id, comparisonId), inArray(comparison.status, ["queued", "running"])));
}

/** Cancels a queued or running comparison; false when it had already stopped. */
export async function markComparisonCancelled(db: Database, comparisonId: string): Promise<boolean> {
  const now = new Date();
  const rows = await db
    .update(comparison)
    .set({ status: "cancelled", updatedAt: now, finishedAt: now })
    .where(and(eq(comparison.id, comparisonId), inArray(comparison.status, ["queued", "running"])))
    .returning({ id: comparison.id });
  return rows.length > 0;
}

/** Progress figures of comparisons (see ComparisonProgressDto). */
export async function comparisonProgress(db: Database, records: readonly ComparisonRecord[]): Promise<Map<string, ComparisonProgressDto>> {
  const ids = records.map((r) => r.id);
  const result = new Map<string, ComparisonProgressDto>();
  if (ids.length === 0) return result;
  const [chunkRows, pickRows, failedChunks, failedPicks, workerRows] = await Promise.all([
    db
      .select({
        id: comparisonChunk.comparisonId,
        status: comparisonChunk.status,
        n: count(),
        points: sql<number>`coalesce(sum(${comparisonChunk.end} - ${comparisonChunk.start}), 0)::int`,
      })
      .from(comparisonChunk)
      .where(inArray(comparisonChunk.comparisonId, ids))
      .groupBy(comparisonChunk.comparisonId, comparisonChunk.status),
    db
      .select({ id: comparisonPick.comparisonId, status: comparisonPick.status, n: count() })
      .from(comparisonPick)
      .where(inArray(comparisonPick.comparisonId, ids))
      .groupBy(comparisonPick.comparisonId, comparisonPick.status),
    db
      .select({ id: comparisonChunk.comparisonId, chunk: comparisonChunk.chunk, error: comparisonChunk.error })
      .from(comparisonChunk)
      .where(and(inArray(comparisonChunk.comparisonId, ids), eq(comparisonChunk.status, "failed"))),
    db
      .select({ id: comparisonPick.comparisonId, contender: comparisonPick.contender, error: comparisonPick.error })
      .from(comparisonPick)
      .where(and(inArray(comparisonPick.comparisonId, ids), eq(comparisonPick.status, "failed"))),
    db
      .select({ n: count() })
      .from(worker)
      .where(gt(worker.heartbeatAt, new Date(Date.now() - WORKER_ALIVE_SECONDS * 1000))),
  ]);
  for (const record of records) {
    const chunks = chunkRows.filter((r) => r.id === record.id);
    const picks = pickRows.filter((r) => r.id === record.id);
    const chunkOf = (status: string) => chunks.find((r) => r.status === status);
    const pickOf = (status: string) => picks.find((r) => r.status === status)?.n ?? 0;
    const chunksPending = chunkOf("pending")?.n ?? 0;
    const picksPending = pickOf("pending");
    const finished = record.status === "finished";
    result.set(record.id, {
      phase: finished ? "done" : chunksPending > 0 ? "prescan" : picksPending > 0 ? "refine" : "analyse",
      prescanDone: chunkOf("done")?.points ?? 0,
      prescanTotal: record.prescanTotal,
      chunksTotal: chunks.reduce((sum, r) => sum + r.n, 0),
      chunksDone: chunkOf("done")?.n ?? 0,
      picksDone: pickOf("done"),
      picksTotal: record.contenders,
      workersActive: workerRows[0]?.n ?? 0,
      failures: [
        ...failedChunks.filter((r) => r.id === record.id).map((r) => ({ what: `pre-scan chunk ${r.chunk}`, error: r.error ?? "unknown error" })),
        ...failedPicks.filter((r) => r.id === record.id).map((r) => ({ what: `refinement of contender ${r.contender + 1}`, error: r.error ?? "unknown error" })),
      ],
    });
  }
  return result;
}
