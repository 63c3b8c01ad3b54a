import type PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { cancelSweepJobs, resumeSweepJobs, startSweepJobs } from "../sweeps/sweep-jobs.js";
import { startSweepWorker, type SweepWorker } from "../workers/sweep-worker.js";
import { startJobQueue } from "./job-queue.js";

export interface SweepJobSystemOptions {
  /** Run a worker inside this process (the web server's embedded worker); default true. */
  embeddedWorker?: boolean;
  /** Threads of the embedded worker's pool (default os.availableParallelism()). */
  workerThreads?: number;
  /** Enqueue what unfinished sweeps still need at start-up (default true). */
  resume?: boolean;
  /** Chunk job expiry [s] (default LOOPYARD_CHUNK_EXPIRE_SECONDS or 120). */
  expireSeconds?: number;
  /** Address of the app for the links in end-of-sweep mails (the embedded worker's). */
  publicUrl?: string;
}

/** Sweeps as pg-boss jobs, as the web server sees them: start a sweep, and optionally work on chunks too. */
export interface SweepJobSystem {
  /** Resolves once pg-boss is started (and the embedded worker, when there is one). */
  ready: Promise<void>;
  /** Stores the chunks of a queued sweep and enqueues their jobs. */
  start(sweepId: string): Promise<void>;
  /** Cancels the jobs of a cancelled sweep's pending chunks. */
  cancel(sweepId: string): Promise<void>;
  close(): Promise<void>;
}

export function createSweepJobSystem(db: Database, databaseUrl: string, options: SweepJobSystemOptions = {}): SweepJobSystem {
  let boss: PgBoss | null = null;
  let worker: SweepWorker | null = null;
  const ready = (async () => {
    boss = await startJobQueue(databaseUrl, options.expireSeconds === undefined ? {} : { expireSeconds: options.expireSeconds });
    if (options.embeddedWorker !== false) {
      worker = await startSweepWorker(db, boss, {
        ...(options.workerThreads === undefined ? {} : { threads: options.workerThreads }),
        ...(options.publicUrl === undefined ? {} : { publicUrl: options.publicUrl }),
      });
    }
    if (options.resume !== false) await resumeSweepJobs(db, boss);
  })();
  ready.catch((error: unknown) => console.error("[loopyard] the job queue could not start:", error));
  let closing: Promise<void> | null = null;
  return {
    ready,
    async start(sweepId) {
      await ready;
      await startSweepJobs(db, boss as unknown as PgBoss, sweepId);
    },
    async cancel(sweepId) {
      await ready;
      await cancelSweepJobs(db, boss as unknown as PgBoss, sweepId);
    },
    close() {
      closing ??= (async () => {
        await ready.catch(() => undefined);
        await worker?.close();
        await boss?.stop({ graceful: true, timeout: 10_000, wait: true });
      })();
      return closing;
    },
  };
}
