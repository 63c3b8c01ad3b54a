import { createHash } from "node:crypto";
import PgBoss from "pg-boss";
import { ensureMailQueue } from "../mail/mail-queue.js";

/** Queue of sweep chunks: one job per chunk of contiguous candidates. */
export const SWEEP_CHUNK_QUEUE = "sweep-chunk";
/** Queue of search sweeps: one job per generation of a search design's ask/tell loop. */
export const SWEEP_SEARCH_QUEUE = "sweep-search";
/** Retries of a chunk job after its first attempt, with exponential backoff (pg-boss retryBackoff). */
export const CHUNK_RETRY_LIMIT = 3;
/** First retry delay [s]; pg-boss doubles it each retry (with jitter). */
export const CHUNK_RETRY_DELAY_SECONDS = 1;
/** Seconds a chunk may stay active before pg-boss hands it to another worker (LOOPYARD_CHUNK_EXPIRE_SECONDS). */
export const DEFAULT_CHUNK_EXPIRE_SECONDS = 120;

/** What a chunk job carries: which candidates to evaluate; the rest is regenerated from the stored definition. */
export interface ChunkJobData {
  sweepId: string;
  chunk: number;
  start: number;
  end: number;
}

export interface JobQueueOptions {
  expireSeconds?: number;
}

/** Chunk expiry from the environment (LOOPYARD_CHUNK_EXPIRE_SECONDS), default 120 s. */
export function chunkExpireSecondsFromEnv(env: NodeJS.ProcessEnv = process.env): number {
  const value = Number(env.LOOPYARD_CHUNK_EXPIRE_SECONDS ?? DEFAULT_CHUNK_EXPIRE_SECONDS);
  return Number.isFinite(value) && value >= 1 ? Math.round(value) : DEFAULT_CHUNK_EXPIRE_SECONDS;
}

/**
 * pg-boss over the app's database (its own schema "pgboss"), started, with the chunk queue created.
 * Maintenance (which returns the jobs of a killed worker to the queue once they expire) runs at
 * least every expireSeconds/2, between 1 and 30 s.
 */
export async function startJobQueue(databaseUrl: string, options: JobQueueOptions = {}): Promise<PgBoss> {
  const expireSeconds = options.expireSeconds ?? chunkExpireSecondsFromEnv();
  const boss = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    maintenanceIntervalSeconds: Math.max(1, Math.min(30, Math.floor(expireSeconds / 2))),
    schedule: false,
  });
  boss.on("error", (error) => console.error(`[loopyard] job queue: ${error instanceof Error ? error.message : String(error)}`));
  await boss.start();
  await boss.createQueue(SWEEP_CHUNK_QUEUE, {
    name: SWEEP_CHUNK_QUEUE,
    retryLimit: CHUNK_RETRY_LIMIT,
    retryDelay: CHUNK_RETRY_DELAY_SECONDS,
    retryBackoff: true,
    expireInSeconds: expireSeconds,
  });
  // An existing queue keeps its options; align the expiry with this process's setting.
  await boss.updateQueue(SWEEP_CHUNK_QUEUE, {
    name: SWEEP_CHUNK_QUEUE,
    retryLimit: CHUNK_RETRY_LIMIT,
    retryDelay: CHUNK_RETRY_DELAY_SECONDS,
    retryBackoff: true,
    expireInSeconds: expireSeconds,
  });
  for (const name of [SWEEP_SEARCH_QUEUE]) {
    const queue = { name, retryLimit: CHUNK_RETRY_LIMIT, retryDelay: CHUNK_RETRY_DELAY_SECONDS, retryBackoff: true, expireInSeconds: expireSeconds };
    await boss.createQueue(name, queue);
    await boss.updateQueue(name, queue);
  }
  // The mail queue too, here with the others: workers queue the end-of-run mail of sweeps.
  await ensureMailQueue(boss);
  return boss;
}

/**
 * The job id of a chunk: a UUID derived from (sweep, chunk), so that enqueuing a chunk twice
 * (a resumed start) inserts one job (pg-boss inserts with ON CONFLICT DO NOTHING).
 */
export function chunkJobId(sweepId: string, chunk: number): string {
  const hex = createHash("sha1").update(`${sweepId}:${chunk}`).digest("hex");
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${((parseInt(hex.slice(16, 17), 16) & 3) | 8).toString(16)}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

/** Enqueues chunk jobs (idempotent per chunk). */
export async function enqueueChunks(boss: PgBoss, jobs: readonly ChunkJobData[]): Promise<void> {
  for (let i = 0; i < jobs.length; i += 1000) {
    await boss.insert(jobs.slice(i, i + 1000).map((data) => ({ id: chunkJobId(data.sweepId, data.chunk), name: SWEEP_CHUNK_QUEUE, data })));
  }
}

/** What a search job carries: the sweep and the generation it is to evaluate. */
export interface SearchJobData {
  sweepId: string;
  generation: number;
}

/** Enqueues generation `generation` of a search sweep (one job per generation: a UUID derived from both). */
export async function enqueueSearchGeneration(boss: PgBoss, sweepId: string, generation: number): Promise<void> {
  await boss.insert([{ id: chunkJobId(sweepId, -1 - generation), name: SWEEP_SEARCH_QUEUE, data: { sweepId, generation } }]);
}
