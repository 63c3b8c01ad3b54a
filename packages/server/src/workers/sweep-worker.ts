import { randomUUID } from "node:crypto";
import { availableParallelism, hostname } from "node:os";
import type PgBoss from "pg-boss";
import { evaluateBatch, SweepPlanError } from "@loopyard/core";
import type { SweepBatchEvaluator } from "@loopyard/core";
import { createEvaluationPool, type EvaluationPool } from "@loopyard/core/pool";
import { EVALUATION_NICENESS } from "./evaluation-niceness.js";
import type { Database } from "../db/database.js";
import { enqueueSearchGeneration, SWEEP_CHUNK_QUEUE, SWEEP_SEARCH_QUEUE, type ChunkJobData, type SearchJobData } from "../jobs/job-queue.js";
import { runSearchGeneration } from "../sweeps/sweep-search-job.js";
import { reconcileFailedChunkJobs } from "../sweeps/sweep-jobs.js";
import { chunkStatus, completeChunk, countChunkAttempt, failChunk } from "../sweeps/sweep-chunk-repository.js";
import { evaluateRange, loadEvaluationContext, type SweepEvaluationContext } from "../sweeps/sweep-evaluation.js";
import { findSweepForRun, markSweepFailed } from "../sweeps/sweep-repository.js";
import { heartbeatWorker, pruneWorkers, registerWorker, removeWorker } from "./worker-repository.js";
import { noticeRunEnded, publicUrlFromEnv } from "../mail/run-notices.js";

/** Seconds between heartbeats of a worker row. */
export const HEARTBEAT_SECONDS = 5;
/** Seconds between checks for chunk jobs that failed without their worker marking the chunk. */
export const RECONCILE_SECONDS = 60;
/** Sweeps whose evaluation context a worker keeps (their candidate lists can be large). */
const CONTEXT_CACHE_SIZE = 4;

export interface SweepWorkerOptions {
  /** Threads of the piscina pool (default os.availableParallelism()); 0 evaluates in process (tests, tiny hosts). */
  threads?: number;
  /** Chunk jobs worked at once (default: threads + 1, so that the pool stays busy while a chunk is stored). */
  concurrency?: number;
  /** Address of the app for the links in end-of-sweep mails (default LOOPYARD_PUBLIC_URL, or http://HOST:PORT). */
  publicUrl?: string;
}

export interface SweepWorker {
  readonly id: string;
  readonly threads: number;
  /** Stops taking jobs, lets running chunks finish (up to a timeout), closes the pool and removes the worker row. */
  close(): Promise<void>;
}

/**
 * A worker: takes chunk jobs from pg-boss, evaluates each chunk's candidates on the sweep's family
 * through a piscina pool (@loopyard/core/pool; the same bytes as evaluateBatch in process), and
 * stores them with the chunk's completion in one transaction (completeChunk). Jobs of a sweep that
 * is no longer running complete without work. A job that throws is retried by pg-boss with backoff;
 * on its last attempt the chunk is marked failed with the error instead. Registers a `worker` row
 * with a heartbeat every HEARTBEAT_SECONDS.
 */
export async function startSweepWorker(db: Database, boss: PgBoss, options: SweepWorkerOptions = {}): Promise<SweepWorker> {
  const threads = options.threads ?? availableParallelism();
  const publicUrl = options.publicUrl ?? publicUrlFromEnv();
  const pool: EvaluationPool | null = threads > 0 ? createEvaluationPool({ workers: threads, niceness: EVALUATION_NICENESS }) : null;
  const id = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  await pruneWorkers(db).catch(() => undefined);
  await registerWorker(db, { id, host: hostname(), pid: process.pid, threads });
  const heartbeat = setInterval(() => {
    heartbeatWorker(db, id).catch((error: unknown) => console.error(`[loopyard] worker heartbeat failed: ${String(error)}`));
  }, HEARTBEAT_SECONDS * 1000);
  heartbeat.unref();
  // Chunks whose job failed for good while no worker could say so (see reconcileFailedChunkJobs).
  const reconcile = setInterval(() => {
    reconcileFailedChunkJobs(db).catch((error: unknown) => console.error(`[loopyard] checking failed chunk jobs failed: ${String(error)}`));
  }, RECONCILE_SECONDS * 1000);
  reconcile.unref();

  const contexts = new Map<string, Promise<SweepEvaluationContext>>();
  const contextOf = (sweepId: string, definition: Parameters<typeof loadEvaluationContext>[2]) => {
    let context = contexts.get(sweepId);
    if (!context) {
      context = loadEvaluationContext(db, sweepId, definition);
      context.catch(() => contexts.delete(sweepId));
      contexts.set(sweepId, context);
      while (contexts.size > CONTEXT_CACHE_SIZE) contexts.delete(contexts.keys().next().value as string);
    }
    return context;
  };

  /** The sweep's evaluation context, or null once a definition that cannot run has failed the sweep. */
  async function contextOrFail(sweepId: string, definition: Parameters<typeof loadEvaluationContext>[2]): Promise<SweepEvaluationContext | null> {
    try {
      return await contextOf(sweepId, definition);
    } catch (error) {
      if (error instanceof SweepPlanError) {
        await markSweepFailed(db, sweepId, `The sweep could not run: ${error.reason}.`);
        return null;
      }
      throw error;
    }
  }

  const evaluate: SweepBatchEvaluator = async (batch) => {
    const d = batch.structure.tunable.length;
    // One task per pool thread: a chunk is already small, and fewer messages leave more time to evaluate.
    if (pool) return pool.evaluate(batch, { chunkSize: Math.max(8, Math.ceil(batch.candidates.length / d / threads)) });
    return evaluateBatch(batch.family, batch.structure, batch.candidates, batch.scenario, batch.criteria, { evaluation: batch.evaluation ?? {} });
  };

  async function handle(job: PgBoss.JobWithMetadata<ChunkJobData>): Promise<void> {
    const { sweepId, chunk, start, end } = job.data;
    const record = await findSweepForRun(db, sweepId);
    // Cancelled, finished or deleted sweeps: nothing to do; the job completes.
    if (!record || (record.status !== "queued" && record.status !== "running")) return;
    if ((await chunkStatus(db, sweepId, chunk)) !== "pending") return;
    await countChunkAttempt(db, sweepId, chunk);
    try {
      const context = await contextOrFail(sweepId, record.definition);
      if (!context) return;
      const rows = await evaluateRange(context, start, end, evaluate);
      await completeChunk(db, sweepId, chunk, rows, id);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      if (job.retryCount >= job.retryLimit) {
        console.error(`[loopyard] sweep ${sweepId} chunk ${chunk} failed after ${job.retryCount + 1} attempts: ${message}`);
        await failChunk(db, sweepId, chunk, message, id);
        return;
      }
      throw error;
    }
  }

  /** One generation of a search sweep; then the next generation's job (or the sweep is finished). */
  async function handleSearch(job: PgBoss.JobWithMetadata<SearchJobData>): Promise<void> {
    const { sweepId } = job.data;
    const record = await findSweepForRun(db, sweepId);
    if (!record || (record.status !== "queued" && record.status !== "running")) return;
    try {
      const context = await contextOrFail(sweepId, record.definition);
      if (!context) return;
      const next = await runSearchGeneration(db, context, evaluate);
      if (next !== null) await enqueueSearchGeneration(boss, sweepId, next);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      if (job.retryCount >= job.retryLimit) {
        console.error(`[loopyard] search sweep ${sweepId} failed after ${job.retryCount + 1} attempts: ${message}`);
        await markSweepFailed(db, sweepId, `The search stopped: ${message}`);
        return;
      }
      throw error;
    }
  }
  let searchWorkId = "";
  searchWorkId = await boss.work<SearchJobData>(
    SWEEP_SEARCH_QUEUE,
    { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
    async ([job]) => {
      if (!job) return;
      try {
        await handleSearch(job);
      } finally {
        // The sweep's author is mailed once it has ended (a no-op while it runs).
        await noticeRunEnded(db, boss, "sweep", job.data.sweepId, publicUrl);
        boss.notifyWorker(searchWorkId);
      }
    },
  );

  const concurrency = Math.max(1, options.concurrency ?? threads + 1);
  const workIds: string[] = [];
  for (let i = 0; i < concurrency; i++) {
    let workId = "";
    workId = await boss.work<ChunkJobData>(
      SWEEP_CHUNK_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
      async ([job]) => {
        if (!job) return;
        try {
          await handle(job);
        } finally {
          await noticeRunEnded(db, boss, "sweep", job.data.sweepId, publicUrl);
          // After a job, fetch the next one at once instead of waiting out the polling interval.
          boss.notifyWorker(workId);
        }
      },
    );
    workIds.push(workId);
  }

  let closing: Promise<void> | null = null;
  return {
    id,
    threads,
    close() {
      closing ??= (async () => {
        clearInterval(heartbeat);
        clearInterval(reconcile);
        await boss.offWork(SWEEP_CHUNK_QUEUE).catch(() => undefined);
        await boss.offWork(SWEEP_SEARCH_QUEUE).catch(() => undefined);
        await pool?.close();
        await removeWorker(db, id).catch(() => undefined);
      })();
      return closing;
    },
  };
}
