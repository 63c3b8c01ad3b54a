import { sql } from "drizzle-orm";
import type PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { chunkJobId, enqueueChunks, SWEEP_CHUNK_QUEUE, SWEEP_SEARCH_QUEUE } from "../jobs/job-queue.js";
import { chunkCount, failChunk, insertChunks, listPendingChunks, type ChunkRange } from "./sweep-chunk-repository.js";
import { definitionVariants } from "./sweep-evaluation.js";
import { findSweepForRun, listUnfinishedSweepIds } from "./sweep-repository.js";

/** Most candidate·variant evaluations per chunk (a chunk of 5 variants holds 400 candidates). */
export const CHUNK_EVALUATIONS = 2000;
/** Fewest candidates per chunk. */
export const MIN_CHUNK_CANDIDATES = 100;
/** A small sweep is cut into about this many chunks, so that progress moves and several workers share it. */
export const TARGET_CHUNKS = 64;

/**
 * Candidates per chunk for a sweep of `total` candidates on `variants` plants:
 * min(max(100, ⌊2000 / variants⌋), max(100, ⌈total / 64⌉)).
 */
export function chunkSizeFor(total: number, variants: number): number {
  const largest = Math.max(MIN_CHUNK_CANDIDATES, Math.floor(CHUNK_EVALUATIONS / Math.max(1, variants)));
  return Math.min(largest, Math.max(MIN_CHUNK_CANDIDATES, Math.ceil(total / TARGET_CHUNKS)));
}

/** The chunks [start, end) of a sweep, numbered from 0. */
export function chunkRanges(total: number, size: number): ChunkRange[] {
  const chunks: ChunkRange[] = [];
  for (let start = 0, chunk = 0; start < total; start += size, chunk++) chunks.push({ chunk, start, end: Math.min(total, start + size) });
  return chunks;
}

/**
 * Starts a sweep as jobs: stores its chunks (the definition is frozen from here on) and enqueues
 * one pg-boss job per pending chunk. Idempotent: running it again (a resumed start) adds nothing
 * but the jobs of chunks whose job was never stored.
 */
export async function startSweepJobs(db: Database, boss: PgBoss, sweepId: string): Promise<void> {
  const record = await findSweepForRun(db, sweepId);
  if (!record || (record.status !== "queued" && record.status !== "running")) return;
  if (record.definition.design?.kind === "search") {
    // One job per generation; a resumed start adds one (the chains meet at the next generation's job id).
    await boss.send(SWEEP_SEARCH_QUEUE, { sweepId, generation: 0 });
    return;
  }
  if ((await chunkCount(db, sweepId)) === 0) {
    const size = chunkSizeFor(record.total, definitionVariants(record.definition).length);
    await insertChunks(db, sweepId, chunkRanges(record.total, size));
  }
  const pending = await listPendingChunks(db, sweepId);
  await enqueueChunks(
    boss,
    pending.map((c) => ({ sweepId, chunk: c.chunk, start: c.start, end: c.end })),
  );
}

/**
 * Marks failed the pending chunks of running sweeps whose pg-boss job failed for good without the
 * worker saying so (the worker was killed during the last attempt, so the job expired one time too
 * many): their sweep can then finish, with the chunk listed among its failures. Returns how many.
 */
export async function reconcileFailedChunkJobs(db: Database): Promise<number> {
  const result = await db.execute<{ sweep_id: string; chunk: number; output: string | null }>(sql`
    select c.sweep_id, c.chunk, j.output::text as output
    from sweep_chunk c
    join sweep s on s.id = c.sweep_id and s.status in ('queued', 'running')
    join pgboss.job j on j.name = ${SWEEP_CHUNK_QUEUE} and j.state = 'failed'
      and j.data->>'sweepId' = c.sweep_id::text and (j.data->>'chunk')::int = c.chunk
    where c.status = 'pending'`);
  for (const row of result.rows) {
    const detail = row.output && row.output !== "null" ? `: ${row.output.slice(0, 300)}` : "";
    await failChunk(db, row.sweep_id, row.chunk, `the chunk's job failed after its last retry (its worker stopped or timed out)${detail}`, "reconcile");
  }
  return result.rows.length;
}

/** Enqueues what every queued or running sweep still needs (start-up of a server or worker); returns how many sweeps. */
export async function resumeSweepJobs(db: Database, boss: PgBoss): Promise<number> {
  await reconcileFailedChunkJobs(db).catch((error: unknown) => console.error("[loopyard] could not check failed chunk jobs:", error));
  const ids = await listUnfinishedSweepIds(db);
  for (const id of ids) {
    try {
      await startSweepJobs(db, boss, id);
    } catch (error) {
      console.error(`[loopyard] could not resume sweep ${id}:`, error);
    }
  }
  return ids.length;
}

/**
 * Stops handing out a cancelled sweep's chunks: cancels the pg-boss jobs of its pending chunks
 * (a chunk being evaluated finishes and is kept; workers also skip any job of a cancelled sweep).
 */
export async function cancelSweepJobs(db: Database, boss: PgBoss, sweepId: string): Promise<void> {
  const ids = (await listPendingChunks(db, sweepId)).map((c) => chunkJobId(sweepId, c.chunk));
  for (let i = 0; i < ids.length; i += 1000) await boss.cancel(SWEEP_CHUNK_QUEUE, ids.slice(i, i + 1000));
}
