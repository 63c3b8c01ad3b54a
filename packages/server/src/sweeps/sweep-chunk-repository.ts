import { and, asc, count, eq, gt, inArray, sql } from "drizzle-orm";
import type { SweepProgressDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { sweep, sweepChunk, worker } from "../db/schema.js";
import type { CandidateRow } from "./candidate-repository.js";

/** Window over which the rate of a sweep is measured [s]. */
export const RATE_WINDOW_SECONDS = 30;
/** A worker counts as active when its heartbeat is at most this old [s]. */
export const WORKER_ALIVE_SECONDS = 15;

/** One chunk of a sweep: candidates [start, end). */
export interface ChunkRange {
  chunk: number;
  start: number;
  end: number;
}

/** Stores the chunks of a sweep (idempotent: existing chunks are kept). */
export async function insertChunks(db: Database, sweepId: string, chunks: readonly ChunkRange[]): Promise<void> {
  for (let i = 0; i < chunks.length; i += 5000) {
    await db
      .insert(sweepChunk)
      .values(chunks.slice(i, i + 5000).map((c) => ({ sweepId, chunk: c.chunk, start: c.start, end: c.end })))
      .onConflictDoNothing();
  }
}

/** The chunks of a sweep still to run, by number. */
export async function listPendingChunks(db: Database, sweepId: string): Promise<ChunkRange[]> {
  return db
    .select({ chunk: sweepChunk.chunk, start: sweepChunk.start, end: sweepChunk.end })
    .from(sweepChunk)
    .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.status, "pending")))
    .orderBy(asc(sweepChunk.chunk));
}

export async function chunkCount(db: Database, sweepId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(sweepChunk).where(eq(sweepChunk.sweepId, sweepId));
  return row?.n ?? 0;
}

export async function chunkStatus(db: Database, sweepId: string, chunk: number): Promise<"pending" | "done" | "failed" | null> {
  const [row] = await db
    .select({ status: sweepChunk.status })
    .from(sweepChunk)
    .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.chunk, chunk)))
    .limit(1);
  return row?.status ?? null;
}

/** Counts one more attempt of a chunk (for the failure report). */
export async function countChunkAttempt(db: Database, sweepId: string, chunk: number): Promise<void> {
  await db
    .update(sweepChunk)
    .set({ attempts: sql`${sweepChunk.attempts} + 1` })
    .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.chunk, chunk)));
}

/**
 * Stores a chunk's candidates and marks the chunk done in ONE transaction: rows already stored are
 * skipped (ON CONFLICT DO NOTHING), sweep.done grows by the rows actually inserted, and the
 * transaction that settles the last pending chunk finishes the sweep (unless it was cancelled or
 * failed). Returns the number of rows inserted. A chunk that is no longer pending changes nothing,
 * so a retried or duplicated job is harmless.
 */
export async function completeChunk(
  db: Database,
  sweepId: string,
  chunk: number,
  rows: readonly CandidateRow[],
  workerId: string,
): Promise<number> {
  return db.transaction(async (tx) => {
    // Lock the chunk row: a second worker finishing the same chunk waits here, then sees it done.
    const locked = await tx
      .select({ status: sweepChunk.status })
      .from(sweepChunk)
      .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.chunk, chunk)))
      .for("update");
    if (locked[0]?.status !== "pending") return 0;
    const inserted = await insertCandidateRows(tx, sweepId, rows);
    const now = new Date();
    await tx
      .update(sweepChunk)
      .set({ status: "done", workerId, finishedAt: now, error: null })
      .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.chunk, chunk)));
    await settleSweep(tx, sweepId, inserted, now);
    return inserted;
  });
}

/** Marks a chunk failed after its last retry, with the error; the sweep finishes when nothing is pending. */
export async function failChunk(db: Database, sweepId: string, chunk: number, error: string, workerId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const now = new Date();
    const updated = await tx
      .update(sweepChunk)
      .set({ status: "failed", error, workerId, finishedAt: now })
      .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.chunk, chunk), eq(sweepChunk.status, "pending")))
      .returning({ chunk: sweepChunk.chunk });
    if (updated.length > 0) await settleSweep(tx, sweepId, 0, now);
  });
}

/** Adds `inserted` to sweep.done; finishes a queued or running sweep once no chunk is pending. */
async function settleSweep(tx: Database, sweepId: string, inserted: number, now: Date): Promise<void> {
  // Lock the sweep row before counting: two chunks of one sweep finishing at the same moment would
  // otherwise each see the other still pending, and neither would finish the sweep. Under READ
  // COMMITTED the second transaction waits here and its count then sees the first one's chunk done.
  // FOR NO KEY UPDATE, not FOR UPDATE: the candidate rows just inserted hold FOR KEY SHARE on this
  // row through their foreign key, which FOR UPDATE would conflict with (two such transactions
  // deadlock); NO KEY UPDATE conflicts only with itself, as the UPDATE below does anyway.
  await tx.select({ id: sweep.id }).from(sweep).where(eq(sweep.id, sweepId)).for("no key update");
  const [pending] = await tx
    .select({ n: count() })
    .from(sweepChunk)
    .where(and(eq(sweepChunk.sweepId, sweepId), eq(sweepChunk.status, "pending")));
  const last = (pending?.n ?? 0) === 0;
  await tx
    .update(sweep)
    .set({
      done: sql`${sweep.done} + ${inserted}`,
      updatedAt: now,
      status: last
        ? sql`case when ${sweep.status} in ('queued', 'running') then 'finished'::sweep_status else ${sweep.status} end`
        : sql`case when ${sweep.status} = 'queued' then 'running'::sweep_status else ${sweep.status} end`,
      finishedAt: last ? sql`coalesce(${sweep.finishedAt}, now())` : sweep.finishedAt,
    })
    .where(eq(sweep.id, sweepId));
}

/** A sweep's chunk figures: how many chunks, done and failed, and the failures. */
type ChunkFigures = Pick<SweepProgressDto, "chunksTotal" | "chunksDone" | "chunksFailed" | "failures">;

/**
 * Chunk figures of finished sweeps, per process: a finished sweep has no pending chunk, and a done
 * or failed chunk never changes again, so they are counted once (the workspace home lists five
 * sweeps on every visit). Bounded; the oldest go first.
 */
const finishedChunkFigures = new Map<string, ChunkFigures>();
const FINISHED_CHUNK_FIGURES_KEPT = 1_024;

/**
 * Workers with a heartbeat in the last WORKER_ALIVE_SECONDS, counted at most once a second: the
 * figure moves by heartbeats 5 s apart over a 15 s window, so a second's memory changes nothing one could see.
 */
const workersCounted = new WeakMap<Database, { at: number; n: Promise<number> }>();
const WORKERS_COUNT_MS = 1_000;

function activeWorkers(db: Database): Promise<number> {
  const now = Date.now();
  const counted = workersCounted.get(db);
  if (counted && now - counted.at < WORKERS_COUNT_MS) return counted.n;
  const n = db
    .select({ n: count() })
    .from(worker)
    .where(gt(worker.heartbeatAt, new Date(now - WORKER_ALIVE_SECONDS * 1000)))
    .then((rows) => rows[0]?.n ?? 0);
  workersCounted.set(db, { at: now, n });
  n.catch(() => workersCounted.delete(db));
  return n;
}

/** Progress figures of sweeps (see SweepProgressDto); sweeps without chunks get zeros. */
export async function sweepProgress(
  db: Database,
  sweeps: readonly { id: string; done: number; total: number; status: string }[],
): Promise<Map<string, SweepProgressDto>> {
  const result = new Map<string, SweepProgressDto>();
  if (sweeps.length === 0) return result;
  // Finished sweeps whose chunk figures are known need no chunk query.
  const ids = sweeps.filter((s) => !(s.status === "finished" && finishedChunkFigures.has(s.id))).map((s) => s.id);
  const since = new Date(Date.now() - RATE_WINDOW_SECONDS * 1000);
  const none = Promise.resolve([]);
  const [chunkRows, recentRows, failureRows, workersActive] = await Promise.all([
    ids.length === 0
      ? none
      : db
          .select({ sweepId: sweepChunk.sweepId, status: sweepChunk.status, n: count() })
          .from(sweepChunk)
          .where(inArray(sweepChunk.sweepId, ids))
          .groupBy(sweepChunk.sweepId, sweepChunk.status),
    ids.length === 0
      ? none
      : db
          .select({
            sweepId: sweepChunk.sweepId,
            candidates: sql<number>`coalesce(sum(${sweepChunk.end} - ${sweepChunk.start}), 0)::int`,
            first: sql<string | null>`min(${sweepChunk.finishedAt})::text`,
          })
          .from(sweepChunk)
          .where(and(inArray(sweepChunk.sweepId, ids), eq(sweepChunk.status, "done"), gt(sweepChunk.finishedAt, since)))
          .groupBy(sweepChunk.sweepId),
    ids.length === 0
      ? none
      : db
          .select({ sweepId: sweepChunk.sweepId, chunk: sweepChunk.chunk, error: sweepChunk.error })
          .from(sweepChunk)
          .where(and(inArray(sweepChunk.sweepId, ids), eq(sweepChunk.status, "failed")))
          .orderBy(asc(sweepChunk.chunk)),
    activeWorkers(db),
  ]);
  for (const s of sweeps) {
    const running = s.status === "queued" || s.status === "running";
    let figures = s.status === "finished" ? finishedChunkFigures.get(s.id) : undefined;
    if (!figures) {
      const of = (status: string) => chunkRows.find((r) => r.sweepId === s.id && r.status === status)?.n ?? 0;
      const chunksDone = of("done");
      const chunksFailed = of("failed");
      figures = {
        chunksTotal: chunksDone + chunksFailed + of("pending"),
        chunksDone,
        chunksFailed,
        failures: failureRows.filter((r) => r.sweepId === s.id).map((r) => ({ chunk: r.chunk, error: r.error ?? "unknown error" })),
      };
      if (s.status === "finished") {
        if (finishedChunkFigures.size >= FINISHED_CHUNK_FIGURES_KEPT) finishedChunkFigures.delete(finishedChunkFigures.keys().next().value as string);
        finishedChunkFigures.set(s.id, figures);
      }
    }
    const recent = recentRows.find((r) => r.sweepId === s.id);
    let ratePerSecond: number | null = null;
    if (running && recent && recent.candidates > 0) {
      // Over the window, or since the first chunk of the window finished when the run is younger.
      const span = recent.first ? Math.max(1, (Date.now() - new Date(recent.first).getTime()) / 1000) : RATE_WINDOW_SECONDS;
      ratePerSecond = recent.candidates / Math.min(RATE_WINDOW_SECONDS, span);
    }
    result.set(s.id, {
      done: s.done,
      total: s.total,
      ratePerSecond,
      etaSeconds: running && ratePerSecond ? Math.max(0, (s.total - s.done) / ratePerSecond) : null,
      workersActive,
      ...figures,
      failures: [...figures.failures],
    });
  }
  return result;
}

/**
 * Inserts candidate rows, skipping those already stored (ON CONFLICT DO NOTHING); returns how many
 * were inserted. One statement: the rows travel as one JSON parameter (NaN and ±Infinity as
 * strings, which float8 reads back exactly) instead of thousands of bound parameters.
 */
export async function insertCandidateRows(tx: Database, sweepId: string, rows: readonly CandidateRow[]): Promise<number> {
  if (rows.length === 0) return 0;
    const payload = JSON.stringify(
      rows.map((row) => ({
        i: row.index,
        p: row.params,
        s: row.status,
        a: row.scores,
        v: row.variantScores ?? null,
        e: row.error ?? null,
      })),
      (_key, value: unknown) => (typeof value === "number" && !Number.isFinite(value) ? String(value) : value),
    );
    const result = await tx.execute<{ n: number }>(sql`
      with inserted as (
        insert into candidate (sweep_id, index, params, status, scores, variant_scores, error)
        select ${sweepId}::uuid, x.i, x.p, x.s::candidate_status, x.a, x.v, x.e
        from json_to_recordset(${payload}::json) as x(i int, p float8[], s text, a float8[], v float8[], e text)
        on conflict (sweep_id, index) do nothing
        returning 1
      )
      select count(*)::int as n from inserted`);
    const inserted = result.rows[0]?.n ?? 0;
  return inserted;
}

/** Stores one generation of a search sweep: its rows and the sweep's count in one transaction. */
export async function storeSearchGeneration(db: Database, sweepId: string, rows: readonly CandidateRow[]): Promise<number> {
  return db.transaction(async (tx) => {
    const inserted = await insertCandidateRows(tx, sweepId, rows);
    await tx
      .update(sweep)
      .set({
        done: sql`${sweep.done} + ${inserted}`,
        updatedAt: new Date(),
        status: sql`case when ${sweep.status} = 'queued' then 'running'::sweep_status else ${sweep.status} end`,
      })
      .where(eq(sweep.id, sweepId));
    return inserted;
  });
}

/** Finishes a search sweep: its total becomes the candidates it stored. */
export async function finishSearchSweep(db: Database, sweepId: string): Promise<void> {
  await db
    .update(sweep)
    .set({ status: "finished", total: sql`${sweep.done}`, finishedAt: new Date(), updatedAt: new Date() })
    .where(and(eq(sweep.id, sweepId), inArray(sweep.status, ["queued", "running"])));
}

/** The aggregate scores of a search sweep's stored candidates by index (null unless stable). */
export async function storedAggregates(db: Database, sweepId: string): Promise<Map<number, number[] | null>> {
  const result = await db.execute<{ index: number; scores: string | null }>(
    sql`select index, scores::text as scores from candidate where sweep_id = ${sweepId}`,
  );
  const map = new Map<number, number[] | null>();
  for (const row of result.rows) {
    map.set(
      row.index,
      row.scores === null
        ? null
        : row.scores
            .slice(1, -1)
            .split(",")
            .map((t) => (t === "NaN" ? Number.NaN : t === "Infinity" ? Number.POSITIVE_INFINITY : t === "-Infinity" ? Number.NEGATIVE_INFINITY : Number(t))),
    );
  }
  return map;
}
