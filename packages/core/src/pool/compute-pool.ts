import { Piscina } from "piscina";
import type { WorkBudget } from "../simulation/work-budget.js";
import type { ComputeOutcome, ComputeRequest, ComputeTaskName, ComputeTasks } from "./compute-tasks.js";

/** Configuration of createComputePool. */
export interface ComputePoolConfig {
  /** Most worker threads, a whole number from 1 to 16; default 2. */
  workers?: number;
  /** Default wall-clock limit of one task [ms], counted from submission (queueing included); default 10,000. */
  timeLimitMs?: number;
}

/** Limits of one task: its work budget and, optionally, another time limit. */
export interface ComputeLimits {
  budget: WorkBudget;
  timeLimitMs?: number;
}

/** A pool of worker threads for computations whose cost users control (see compute-tasks.ts). */
export interface ComputePool {
  /** Runs a named task; a task past its time limit is stopped (its thread terminated) and answers kind "time". */
  run<K extends ComputeTaskName>(task: K, input: ComputeTasks[K]["input"], limits: ComputeLimits): Promise<ComputeOutcome<ComputeTasks[K]["output"]>>;
  close(): Promise<void>;
}

/**
 * A piscina pool running core's compute tasks (src/pool/compute-worker.ts) off the caller's thread,
 * each under its work budget and a wall-clock limit: when the limit passes, the task's AbortSignal
 * fires and piscina terminates the thread running it (a synchronous computation cannot be
 * interrupted otherwise) and starts a fresh one. Threads start on demand and stop when idle.
 * Node only: import it from "@loopyard/core/pool".
 */
export function createComputePool(config: ComputePoolConfig = {}): ComputePool {
  const workers = config.workers ?? 2;
  const defaultLimit = config.timeLimitMs ?? 10_000;
  if (!Number.isInteger(workers) || workers < 1 || workers > 16) throw new RangeError(`workers must be a whole number from 1 to 16, got ${String(workers)}`);
  if (!(defaultLimit > 0)) throw new RangeError(`timeLimitMs must be > 0, got ${String(defaultLimit)}`);
  const piscina = new Piscina({
    filename: new URL("./compute-worker.js", import.meta.url).href,
    minThreads: 0,
    maxThreads: workers,
    idleTimeout: 30_000,
    concurrentTasksPerWorker: 1,
  });
  let closed = false;
  return {
    async run(task, input, limits) {
      if (closed) throw new Error("the compute pool is closed");
      const timeLimitMs = limits.timeLimitMs ?? defaultLimit;
      const signal = AbortSignal.timeout(timeLimitMs);
      const request: ComputeRequest = { task, input, budget: limits.budget } as ComputeRequest;
      try {
        return (await piscina.run(request, { signal })) as ComputeOutcome<ComputeTasks[typeof task]["output"]>;
      } catch (error) {
        if (signal.aborted) return { ok: false, kind: "time", reason: `it takes longer than ${(timeLimitMs / 1000).toLocaleString("en-GB")} s` };
        throw error;
      }
    },
    async close() {
      if (closed) return;
      closed = true;
      await piscina.destroy();
    },
  };
}
