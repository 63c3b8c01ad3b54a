import { performance } from "node:perf_hooks";
import { evaluateCandidate, gridCandidates } from "@loopyard/core";
import type { CandidateDto, PidController } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRevisionById } from "../plants/plant-repository.js";
import { countCandidates, insertCandidateChunk } from "./candidate-repository.js";
import {
  findSweepForRun,
  listUnfinishedSweepIds,
  markSweepFailed,
  markSweepFinished,
  markSweepRunning,
  type SweepRunRecord,
} from "./sweep-repository.js";

/** Most candidates evaluated and stored per transaction. */
export const CHUNK_SIZE = 200;
/** Longest the runner holds the event loop per chunk [ms]; a chunk ends early when it is used up. */
export const CHUNK_BUDGET_MS = 50;

export interface SweepRunnerOptions {
  chunkSize?: number;
  chunkBudgetMs?: number;
}

/** A sweep that cannot run to the end; `message` is the sentence stored as the sweep's error. */
class SweepFailure extends Error {
  override name = "SweepFailure";
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs sweeps in this process, one at a time in arrival order. Each chunk of candidates is
 * evaluated with core's evaluateCandidate, then stored together with the sweep's progress in one
 * transaction; between chunks the runner yields to the event loop so the API stays responsive.
 *
 * Candidates are stored as a prefix of the grid, so a sweep left queued or running by a stopped
 * process resumes from what is stored (resumeUnfinished at start-up).
 */
export class SweepRunner {
  readonly #db: Database;
  readonly #chunkSize: number;
  readonly #chunkBudgetMs: number;
  readonly #queue: string[] = [];
  #current: Promise<void> | null = null;
  #stopping = false;

  constructor(db: Database, options: SweepRunnerOptions = {}) {
    this.#db = db;
    this.#chunkSize = options.chunkSize ?? CHUNK_SIZE;
    this.#chunkBudgetMs = options.chunkBudgetMs ?? CHUNK_BUDGET_MS;
  }

  /** Queues a sweep to run in the background. */
  enqueue(sweepId: string): void {
    if (this.#stopping) return;
    if (!this.#queue.includes(sweepId)) this.#queue.push(sweepId);
    this.#pump();
  }

  /** Queues every sweep left queued or running; returns how many. */
  async resumeUnfinished(): Promise<number> {
    const ids = await listUnfinishedSweepIds(this.#db);
    for (const id of ids) this.enqueue(id);
    return ids.length;
  }

  /** Runs one sweep to its end in the caller's flow (the demo seed uses this). */
  async runNow(sweepId: string): Promise<void> {
    await this.#run(sweepId);
  }

  /** Resolves once the queue is empty and no sweep is running. */
  async idle(): Promise<void> {
    while (this.#current) await this.#current;
  }

  /** Stops after the chunk in progress; unfinished sweeps stay running and resume at the next start. */
  async close(): Promise<void> {
    this.#stopping = true;
    this.#queue.length = 0;
    await this.idle();
  }

  #pump(): void {
    if (this.#current) return;
    this.#current = (async () => {
      while (this.#queue.length > 0 && !this.#stopping) {
        const id = this.#queue.shift() as string;
        await this.#run(id);
      }
    })().finally(() => {
      this.#current = null;
      if (this.#queue.length > 0 && !this.#stopping) this.#pump();
    });
  }

  async #run(sweepId: string): Promise<void> {
    let next = 0;
    try {
      const record = await findSweepForRun(this.#db, sweepId);
      if (!record || record.status === "finished" || record.status === "failed") return;
      const plant = (await findRevisionById(this.#db, record.plantRevisionId))?.model;
      if (!plant) throw new SweepFailure("The sweep could not start: its plant revision no longer exists.");
      const controllers = gridCandidates(record.definition.ranges, record.definition.filter);
      if (controllers.length !== record.total) {
        throw new SweepFailure(`The sweep could not start: its grid has ${controllers.length} candidates, not the ${record.total} recorded.`);
      }
      await markSweepRunning(this.#db, sweepId);
      next = await countCandidates(this.#db, sweepId);
      while (next < record.total) {
        if (this.#stopping) return;
        const rows = this.#evaluateChunk(record, plant, controllers, next);
        await insertCandidateChunk(this.#db, sweepId, rows);
        next += rows.length;
        await yieldToEventLoop();
      }
      await markSweepFinished(this.#db, sweepId);
    } catch (error) {
      await this.#fail(sweepId, error, next);
    }
  }

  /** Evaluates candidates from `start` until the chunk size or the time budget is reached. */
  #evaluateChunk(
    record: SweepRunRecord,
    plant: Parameters<typeof evaluateCandidate>[0],
    controllers: readonly PidController[],
    start: number,
  ): CandidateDto[] {
    const { scenario } = record.definition;
    const started = performance.now();
    const rows: CandidateDto[] = [];
    for (let index = start; index < record.total && rows.length < this.#chunkSize; index += 1) {
      if (rows.length > 0 && performance.now() - started > this.#chunkBudgetMs) break;
      const controller = controllers[index] as PidController;
      const evaluation = evaluateCandidate(plant, controller, scenario, record.criteria);
      const scores = evaluation.scores;
      rows.push({
        index,
        params: [controller.kp, controller.ki, controller.kd, controller.tf],
        status: evaluation.status,
        scores: scores ? record.criteria.map((id) => scores[id]) : null,
      });
    }
    return rows;
  }

  async #fail(sweepId: string, error: unknown, at: number): Promise<void> {
    const message =
      error instanceof SweepFailure
        ? error.message
        : `The sweep stopped at candidate ${at + 1}: ${error instanceof Error ? error.message : String(error)}`;
    if (!(error instanceof SweepFailure)) console.error(`[loopyard] sweep ${sweepId} failed:`, error);
    try {
      await markSweepFailed(this.#db, sweepId, message);
    } catch (markError) {
      console.error(`[loopyard] could not mark sweep ${sweepId} as failed:`, markError);
    }
  }
}
