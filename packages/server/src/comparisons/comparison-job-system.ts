import PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { chunkExpireSecondsFromEnv } from "../jobs/job-queue.js";
import { createComparisonQueues, resumeComparisonJobs } from "./comparison-jobs.js";
import { startComparisonWorker, type ComparisonWorker } from "./comparison-worker.js";

export interface ComparisonJobSystemOptions {
  /** Run a comparison worker inside this process (default true). */
  embeddedWorker?: boolean;
  /** Threads of the embedded worker's pool (default os.availableParallelism()). */
  workerThreads?: number;
  /** Enqueue what unfinished comparisons still need at start-up (default true). */
  resume?: boolean;
  /** Job expiry [s] (default LOOPYARD_CHUNK_EXPIRE_SECONDS or 120): how soon a killed worker's piece comes back. */
  expireSeconds?: number;
  /** Start once this settles (the sweeps' queue set-up: two processes' DDL on pgboss at once can deadlock). */
  after?: Promise<unknown>;
  /** Address of the app for the links in end-of-comparison mails (the embedded worker's). */
  publicUrl?: string;
}

/** Comparisons as pg-boss jobs, as a process sees them: its queue connection, and optionally a worker. */
export interface ComparisonJobSystem {
  /** Resolves once pg-boss is started (and the embedded worker, when there is one). */
  ready: Promise<void>;
  boss(): Promise<PgBoss>;
  close(): Promise<void>;
}

/**
 * Starts pg-boss on the app's database (schema "pgboss", shared with the sweeps' queues) with the
 * comparison queues created, an embedded comparison worker unless turned off, and resumes what
 * unfinished comparisons still need. Maintenance (which hands the jobs of a killed worker back
 * once they expire) runs at least every expireSeconds/2, between 1 and 30 s.
 */
export function createComparisonJobSystem(db: Database, databaseUrl: string, options: ComparisonJobSystemOptions = {}): ComparisonJobSystem {
  const expireSeconds = options.expireSeconds ?? chunkExpireSecondsFromEnv();
  let worker: ComparisonWorker | null = null;
  const boss = new PgBoss({
    connectionString: databaseUrl,
    max: 3,
    maintenanceIntervalSeconds: Math.max(1, Math.min(30, Math.floor(expireSeconds / 2))),
    schedule: false,
  });
  boss.on("error", (error) => console.error(`[loopyard] comparison queue: ${error instanceof Error ? error.message : String(error)}`));
  const ready = (async () => {
    await options.after?.catch(() => undefined);
    await boss.start();
    await createComparisonQueues(boss, expireSeconds);
    if (options.embeddedWorker !== false) {
      worker = await startComparisonWorker(db, boss, {
        ...(options.workerThreads === undefined ? {} : { threads: options.workerThreads }),
        ...(options.publicUrl === undefined ? {} : { publicUrl: options.publicUrl }),
      });
    }
    if (options.resume !== false) await resumeComparisonJobs(db, boss);
  })();
  ready.catch((error: unknown) => console.error("[loopyard] the comparison queue could not start:", error));
  let closing: Promise<void> | null = null;
  return {
    ready,
    async boss() {
      await ready;
      return boss;
    },
    close() {
      closing ??= (async () => {
        await ready.catch(() => undefined);
        await worker?.close();
        await boss.stop({ graceful: true, timeout: 10_000, wait: true }).catch(() => undefined);
      })();
      return closing;
    },
  };
}
