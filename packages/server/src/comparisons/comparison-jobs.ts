import { createHash } from "node:crypto";
import { sql } from "drizzle-orm";
import type PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { CHUNK_RETRY_DELAY_SECONDS, CHUNK_RETRY_LIMIT, chunkExpireSecondsFromEnv } from "../jobs/job-queue.js";
import {
  failTask,
  findComparison,
  listPendingPicks,
  listPendingPrescanChunks,
  listUnfinishedComparisonIds,
  markComparisonFailed,
  taskCounts,
  type PrescanChunkRange,
} from "./comparison-repository.js";

/** Queue of pre-scan chunks: one job per chunk of Sobol points, evaluated on every variant. */
export const COMPARISON_PRESCAN_QUEUE = "comparison-prescan";
/** Queue of refinements: one job per contender, a local search from the pre-scan's best points. */
export const COMPARISON_REFINE_QUEUE = "comparison-refine";
/** Queue of analyses: one job per comparison once every pick is stored. */
export const COMPARISON_ANALYSE_QUEUE = "comparison-analyse";
export const COMPARISON_QUEUES = [COMPARISON_PRESCAN_QUEUE, COMPARISON_REFINE_QUEUE, COMPARISON_ANALYSE_QUEUE] as const;

/** Most point·variant evaluations in one pre-scan chunk (half a sweep's chunk: a chunk must finish well within the job expiry on a busy host). */
export const PRESCAN_CHUNK_EVALUATIONS = 1000;
/** Fewest points in one pre-scan chunk. */
export const MIN_PRESCAN_CHUNK = 16;
/** A pre-scan is cut into about this many chunks, so that progress moves and several workers share it. */
export const TARGET_PRESCAN_CHUNKS = 16;

export interface PrescanChunkJob {
  comparisonId: string;
  chunk: number;
  start: number;
  end: number;
}
export interface RefineJob {
  comparisonId: string;
  contender: number;
}
export interface AnalyseJob {
  comparisonId: string;
}

/**
 * Points per pre-scan chunk for `total` points on `variants` plants:
 * min(max(16, ⌊1000 / variants⌋), max(16, ⌈total / 16⌉)).
 */
export function prescanChunkSize(total: number, variants: number): number {
  const largest = Math.max(MIN_PRESCAN_CHUNK, Math.floor(PRESCAN_CHUNK_EVALUATIONS / Math.max(1, variants)));
  return Math.min(largest, Math.max(MIN_PRESCAN_CHUNK, Math.ceil(total / TARGET_PRESCAN_CHUNKS)));
}

/** The chunks [start, end) of a pre-scan of `total` points, numbered from 0. */
export function prescanChunks(total: number, variants: number): PrescanChunkRange[] {
  const size = prescanChunkSize(total, variants);
  const chunks: PrescanChunkRange[] = [];
  for (let start = 0, chunk = 0; start < total; start += size, chunk++) chunks.push({ chunk, start, end: Math.min(total, start + size) });
  return chunks;
}

/** Creates (or aligns) the comparison queues: retries with backoff, expiry as the sweep chunks'. */
export async function createComparisonQueues(boss: PgBoss, expireSeconds = chunkExpireSecondsFromEnv()): Promise<void> {
  for (const name of COMPARISON_QUEUES) {
    const queue = { name, retryLimit: CHUNK_RETRY_LIMIT, retryDelay: CHUNK_RETRY_DELAY_SECONDS, retryBackoff: true, expireInSeconds: expireSeconds };
    await retryOnDeadlock(() => boss.createQueue(name, queue));
    await retryOnDeadlock(() => boss.updateQueue(name, queue));
  }
}

/** Attempts at a queue's DDL when PostgreSQL picks it as a deadlock victim (another process creating queues at the same moment). */
const DDL_ATTEMPTS = 5;

async function retryOnDeadlock(step: () => Promise<unknown>): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await step();
      return;
    } catch (error) {
      const code = (error as { code?: unknown }).code;
      if (code !== "40P01" || attempt >= DDL_ATTEMPTS) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 * attempt));
    }
  }
}

/** A UUID derived from a key, so that enqueuing the same piece of work twice inserts one job (ON CONFLICT DO NOTHING). */
export function comparisonJobId(key: string): string {
  const hex = createHash("sha1").update(`comparison:${key}`).digest("hex");
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${((parseInt(hex.slice(16, 17), 16) & 3) | 8).toString(16)}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

const prescanJobId = (comparisonId: string, chunk: number) => comparisonJobId(`${comparisonId}:prescan:${chunk}`);
const refineJobId = (comparisonId: string, contender: number) => comparisonJobId(`${comparisonId}:refine:${contender}`);
const analyseJobId = (comparisonId: string) => comparisonJobId(`${comparisonId}:analyse`);

/**
 * Enqueues what a queued or running comparison needs next, and nothing twice (job ids derive from
 * the piece of work): its pending pre-scan chunks; once none is pending, one refinement per pending
 * contender; once every pick is stored, the analysis. A failed chunk or pick fails the comparison
 * (every pick needs the whole pre-scan, the analysis every pick). Called when a comparison starts,
 * after each piece of work is stored, and when a server or worker starts (resume).
 */
export async function advanceComparison(db: Database, boss: PgBoss, comparisonId: string): Promise<void> {
  const record = await findComparison(db, comparisonId);
  if (!record || (record.status !== "queued" && record.status !== "running")) return;
  const counts = await taskCounts(db, comparisonId);
  if (counts.chunks.failed > 0) {
    await markComparisonFailed(db, comparisonId, "A chunk of the pre-scan failed after its last retry (see the failures); start the comparison again.");
    return;
  }
  if (counts.chunks.pending > 0) {
    const pending = await listPendingPrescanChunks(db, comparisonId);
    await boss.insert(pending.map((c) => ({ id: prescanJobId(comparisonId, c.chunk), name: COMPARISON_PRESCAN_QUEUE, data: { comparisonId, ...c } satisfies PrescanChunkJob })));
    return;
  }
  if (counts.picks.failed > 0) {
    await markComparisonFailed(db, comparisonId, "A contender's refinement failed after its last retry (see the failures); start the comparison again.");
    return;
  }
  if (counts.picks.pending > 0) {
    const pending = await listPendingPicks(db, comparisonId);
    await boss.insert(pending.map((contender) => ({ id: refineJobId(comparisonId, contender), name: COMPARISON_REFINE_QUEUE, data: { comparisonId, contender } satisfies RefineJob })));
    return;
  }
  await boss.insert([{ id: analyseJobId(comparisonId), name: COMPARISON_ANALYSE_QUEUE, data: { comparisonId } satisfies AnalyseJob }]);
}

/**
 * Marks failed the pending chunks and picks of unfinished comparisons whose job failed for good
 * without its worker saying so (killed during the last attempt), then advances them (which fails
 * the comparison with a sentence). Returns how many pieces it marked.
 */
export async function reconcileComparisonJobs(db: Database, boss: PgBoss): Promise<number> {
  const chunks = await db.execute<{ comparison_id: string; chunk: number }>(sql`
    select c.comparison_id, c.chunk from comparison_chunk c
    join comparison m on m.id = c.comparison_id and m.status in ('queued', 'running')
    join pgboss.job j on j.name = ${COMPARISON_PRESCAN_QUEUE} and j.state = 'failed'
      and j.data->>'comparisonId' = c.comparison_id::text and (j.data->>'chunk')::int = c.chunk
    where c.status = 'pending'`);
  const picks = await db.execute<{ comparison_id: string; contender: number }>(sql`
    select p.comparison_id, p.contender from comparison_pick p
    join comparison m on m.id = p.comparison_id and m.status in ('queued', 'running')
    join pgboss.job j on j.name = ${COMPARISON_REFINE_QUEUE} and j.state = 'failed'
      and j.data->>'comparisonId' = p.comparison_id::text and (j.data->>'contender')::int = p.contender
    where p.status = 'pending'`);
  const why = "its job failed after its last retry (its worker stopped or timed out)";
  for (const row of chunks.rows) await failTask(db, row.comparison_id, { chunk: row.chunk }, why, "reconcile");
  for (const row of picks.rows) await failTask(db, row.comparison_id, { contender: row.contender }, why, "reconcile");
  for (const id of new Set([...chunks.rows, ...picks.rows].map((r) => r.comparison_id))) await advanceComparison(db, boss, id);
  return chunks.rows.length + picks.rows.length;
}

/** Enqueues what every queued or running comparison still needs (start-up of a server or worker); returns how many. */
export async function resumeComparisonJobs(db: Database, boss: PgBoss): Promise<number> {
  await reconcileComparisonJobs(db, boss).catch((error: unknown) => console.error("[loopyard] could not check failed comparison jobs:", error));
  const ids = await listUnfinishedComparisonIds(db);
  for (const id of ids) {
    try {
      await advanceComparison(db, boss, id);
    } catch (error) {
      console.error(`[loopyard] could not resume comparison ${id}:`, error);
    }
  }
  return ids.length;
}

/** Cancels the queued jobs of a cancelled comparison (a piece being worked finishes; workers skip the rest). */
export async function cancelComparisonJobs(db: Database, boss: PgBoss, comparisonId: string): Promise<void> {
  const chunks = await listPendingPrescanChunks(db, comparisonId);
  const picks = await listPendingPicks(db, comparisonId);
  if (chunks.length > 0) await boss.cancel(COMPARISON_PRESCAN_QUEUE, chunks.map((c) => prescanJobId(comparisonId, c.chunk)));
  if (picks.length > 0) await boss.cancel(COMPARISON_REFINE_QUEUE, picks.map((c) => refineJobId(comparisonId, c)));
  await boss.cancel(COMPARISON_ANALYSE_QUEUE, [analyseJobId(comparisonId)]);
}
