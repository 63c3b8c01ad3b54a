import { createComputePool, type ComputeFailure, type ComputePool, type ComputeTaskName, type ComputeTasks } from "@loopyard/core/pool";
import { HttpError } from "../http/http-error.js";
import { COMPUTE_LIMITS, COMPUTE_THREADS } from "./compute-limits.js";

/**
 * The web server's compute: every computation whose cost users control (a plant's preview, a
 * candidate's response or frequency curves) runs on a worker thread of a pool the server owns,
 * under its work budget and time limit (COMPUTE_LIMITS), so the server's main thread keeps
 * answering while it runs.
 */
export interface Compute {
  /** The task's value, or its failure (a budget or time limit passed, core refused the input). */
  run<K extends ComputeTaskName>(task: K, input: ComputeTasks[K]["input"]): Promise<{ ok: true; value: ComputeTasks[K]["output"] } | ComputeFailure>;
  close(): Promise<void>;
}

export function createCompute(threads = COMPUTE_THREADS): Compute {
  const pool: ComputePool = createComputePool({ workers: threads });
  return {
    run: (task, input) => pool.run(task, input, COMPUTE_LIMITS[task]),
    close: () => pool.close(),
  };
}

/**
 * The 422 for a task stopped by its work budget or time limit, as one sentence: `what` names the
 * computation ("The open-loop step of this plant"), `advice` says what the user can do.
 */
export function limitExceeded(failure: ComputeFailure, what: string, advice: string): HttpError | null {
  if (failure.kind !== "budget" && failure.kind !== "time") return null;
  return new HttpError(422, `${what} is more work than the lab allows for one request (${failure.reason}); ${advice}`);
}
