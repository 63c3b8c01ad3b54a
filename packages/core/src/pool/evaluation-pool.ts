import { availableParallelism } from "node:os";
import { Piscina } from "piscina";
import type { BatchResult } from "../batch/evaluate-batch.js";
import { assertValidStructure } from "../batch/structure.js";
import { chunkResultViews, type ChunkReply, type ChunkTask } from "./chunk-task.js";

/** Most candidates per chunk: small enough for smooth progress, large enough to amortise a message. */
export const DEFAULT_CHUNK_SIZE = 500;
/** Fewest candidates per chunk when a batch is small. */
const MIN_CHUNK_SIZE = 8;
/** A small batch is cut into about this many chunks, so that every worker gets some. */
const TARGET_CHUNKS = 64;

/**
 * Chunk size for n candidates: min(DEFAULT_CHUNK_SIZE, max(MIN_CHUNK_SIZE, ⌈n/TARGET_CHUNKS⌉)).
 * A function of n alone, never of the number of workers.
 */
export function chunkSizeFor(n: number): number {
  return Math.min(DEFAULT_CHUNK_SIZE, Math.max(MIN_CHUNK_SIZE, Math.ceil(n / TARGET_CHUNKS)));
}

/** Configuration of createEvaluationPool. */
export interface EvaluationPoolConfig {
  /** Worker threads, a whole number ≥ 1; default: availableParallelism(). */
  workers?: number;
  /**
   * Nice value of the worker threads (0 to 19; Linux keeps one per thread): above 0 the scheduler
   * gives the process's other threads — a web server's request thread — the cores first. Default 0.
   */
  niceness?: number;
}

/** One batch for the pool: the arguments of evaluateBatch, the same shape as the slices it sends its workers. */
export type PoolBatch = ChunkTask;

/** Options of one pool run. */
export interface PoolRunOptions {
  /** Candidates per chunk, a whole number ≥ 1; default chunkSizeFor(n). */
  chunkSize?: number;
  /** Called after each finished chunk with the candidates done so far and the total. */
  onProgress?: (done: number, total: number) => void;
}

/** A pool of worker threads running evaluateBatch on chunks of a batch. */
export interface EvaluationPool {
  readonly workers: number;
  /** Resolves with the same BatchResult evaluateBatch gives in process, byte for byte. */
  evaluate(batch: PoolBatch, options?: PoolRunOptions): Promise<BatchResult>;
  /** Stops the workers; the pool cannot be used afterwards. */
  close(): Promise<void>;
}

/**
 * A piscina pool of `workers` threads, each running evaluateBatch on a chunk of candidates
 * (src/pool/evaluate-chunk-worker.ts). A batch is cut into consecutive row slices of `chunkSize`
 * candidates (default chunkSizeFor(n)) — the cut depends only on n and chunkSize, never on the
 * number of workers — each
 * slice is copied into its own buffer and transferred to a worker (Piscina.move semantics through
 * transferList), and each result buffer is transferred back and copied into place. Since a
 * candidate's result depends only on its own inputs (see evaluateBatch), the assembled result is
 * identical bit for bit whatever the number of workers and whatever order chunks finish in.
 *
 * Node only (worker threads): import it from "@loopyard/core/pool", not from the main entry.
 * Throws a RangeError naming `workers` for a bad count.
 */
export function createEvaluationPool(config: EvaluationPoolConfig = {}): EvaluationPool {
  const workers = config.workers ?? availableParallelism();
  if (!Number.isInteger(workers) || workers < 1 || workers > MAX_WORKERS) {
    throw new RangeError(`workers must be a whole number from 1 to ${MAX_WORKERS}, got ${String(workers)}`);
  }
  if (config.niceness !== undefined && !(Number.isInteger(config.niceness) && config.niceness >= 0 && config.niceness <= 19)) {
    throw new RangeError(`niceness must be a whole number from 0 to 19, got ${String(config.niceness)}`);
  }
  const piscina = new Piscina({
    filename: new URL("./evaluate-chunk-worker.js", import.meta.url).href,
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: Number.MAX_SAFE_INTEGER,
    concurrentTasksPerWorker: 1,
    workerData: { niceness: config.niceness ?? 0 },
  });
  let closed = false;

  async function evaluate(batch: PoolBatch, options: PoolRunOptions = {}): Promise<BatchResult> {
    if (closed) throw new Error("the evaluation pool is closed");
    const chunkSize = options.chunkSize ?? chunkSizeFor(batch.candidates.length / Math.max(1, batch.structure.tunable.length));
    if (!Number.isInteger(chunkSize) || chunkSize < 1) throw new RangeError(`chunkSize must be a whole number ≥ 1, got ${String(chunkSize)}`);
    if (!Array.isArray(batch.family) || batch.family.length === 0) throw new RangeError("family: give at least one plant");
    assertValidStructure(batch.structure);
    const d = batch.structure.tunable.length;
    if (!(batch.candidates instanceof Float64Array)) throw new TypeError("candidates must be a Float64Array");
    if (d === 0 || batch.candidates.length % d !== 0) {
      throw new RangeError(`candidates: length ${batch.candidates.length} is not a multiple of the ${d} tunable parameters`);
    }
    const n = batch.candidates.length / d;
    const nf = batch.family.length;
    const nc = batch.criteria.length;
    const result: BatchResult = { status: new Uint8Array(n * nf), scores: new Float64Array(n * nf * nc) };
    let done = 0;
    const runs: Promise<void>[] = [];
    for (let start = 0; start < n; start += chunkSize) {
      const end = Math.min(n, start + chunkSize);
      const slice = batch.candidates.slice(start * d, end * d);
      const task: ChunkTask = {
        family: batch.family,
        structure: batch.structure,
        candidates: slice,
        scenario: batch.scenario,
        criteria: batch.criteria,
        ...(batch.evaluation === undefined ? {} : { evaluation: batch.evaluation }),
      };
      runs.push(
        (piscina.run(task, { transferList: [slice.buffer] }) as Promise<Uint8Array | ChunkReply>).then((reply) => {
          const bytes = reply instanceof Uint8Array ? reply : reply.bytes;
          if (!(reply instanceof Uint8Array)) {
            result.reasons ??= new Map();
            for (const [row, reason] of reply.reasons) result.reasons.set(start * nf + row, reason);
          }
          const rows = (end - start) * nf;
          const views = chunkResultViews(bytes, rows, nc);
          result.status.set(views.status, start * nf);
          result.scores.set(views.scores, start * nf * nc);
          done += end - start;
          options.onProgress?.(done, n);
        }),
      );
    }
    await Promise.all(runs);
    return result;
  }

  return {
    workers,
    evaluate,
    async close() {
      if (closed) return;
      closed = true;
      await piscina.destroy();
    },
  };
}

/** Upper bound on worker threads of one pool. */
export const MAX_WORKERS = 256;
