import { performance } from "node:perf_hooks";
import { evaluateCandidate, gridCandidates } from "@loopyard/core";
import type { CandidateDto, PidController, Plant } from "@loopyard/core";
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

/** A sweep being run: what it needs and how far it got. */
interface ActiveSweep {
  record: SweepRunRecord;
  plant: Plant;
  controllers: PidController[];
  /** Index of the next candidate to evaluate (candidates before it are stored). */
  next: number;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs sweeps in this process. Each step evaluates one chunk of one sweep's candidates with core's
 * evaluateCandidate, then stores them together with the sweep's progress in one transaction, and
 * yields to the event loop so the API stays responsive. Several sweeps take turns chunk by chunk,
 * so a small sweep is not stuck behind a large one.
 *
 * Candidates are stored as a prefix of the grid, so a sweep left queued or running by a stopped
 * process resumes from what is stored (resumeUnfinished at start-up).
 */
export class SweepRunner {
  readonly #db: Database;
  readonly #chunkSize: number;
  readonly #chunkBudgetMs: number;
  /** Sweeps waiting to be loaded, in arrival order. */
  readonly #pending: string[] = [];
  /** Sweeps being run, taking turns in insertion order. */
  readonly #active = new Map<string, ActiveSweep>();
  #loop: Promise<void> | null = null;
  #stopping = false;

  constructor(db: Database, options: SweepRunnerOptions = {}) {
    this.#db = db;
    this.#chunkSize = options.chunkSize ?? CHUNK_SIZE;
    this.#chunkBudgetMs = options.chunkBudgetMs ?? CHUNK_BUDGET_MS;
  }

  /** Queues a sweep to run in the background. */
  enqueue(sweepId: string): void {
    if (this.#stopping || this.#pending.includes(sweepId) || this.#active.has(sweepId)) return;
    this.#pending.push(sweepId);
    this.#ensureLoop();
  }

  #ensureLoop(): void {
    if (this.#loop) return;
    this.#loop = this.#runLoop().finally(() => {
      this.#loop = null;
      // A sweep enqueued while the loop was ending starts a new loop.
      if (!this.#stopping && this.#pending.length > 0) this.#ensureLoop();
    });
  }

  /** Queues every sweep left queued or running; returns how many. */
  async resumeUnfinished(): Promise<number> {
    const ids = await listUnfinishedSweepIds(this.#db);
    for (const id of ids) this.enqueue(id);
    return ids.length;
  }

  /** Runs one sweep to its end in the caller's flow (the demo seed uses this); a finished sweep is left as is. */
  async runNow(sweepId: string): Promise<void> {
    const sweep = await this.#load(sweepId);
    if (!sweep) return;
    while (await this.#step(sweep)) await yieldToEventLoop();
  }

  /** Resolves once no sweep is waiting or running. */
  async idle(): Promise<void> {
    while (this.#loop) await this.#loop;
  }

  /** Stops after the chunk in progress; unfinished sweeps stay running and resume at the next start. */
  async close(): Promise<void> {
    this.#stopping = true;
    await this.idle();
    this.#pending.length = 0;
    this.#active.clear();
  }

  async #runLoop(): Promise<void> {
    while (!this.#stopping && (this.#pending.length > 0 || this.#active.size > 0)) {
      while (this.#pending.length > 0 && !this.#stopping) {
        const id = this.#pending.shift() as string;
        const sweep = await this.#load(id);
        if (sweep) this.#active.set(id, sweep);
      }
      for (const [id, sweep] of this.#active) {
        if (this.#stopping) return;
        if (!(await this.#step(sweep))) this.#active.delete(id);
        await yieldToEventLoop();
      }
    }
  }

  /** Loads a sweep and marks it running; null when it is done already or failed to load (then marked failed). */
  async #load(sweepId: string): Promise<ActiveSweep | null> {
    try {
      const record = await findSweepForRun(this.#db, sweepId);
      if (!record || record.status === "finished" || record.status === "failed") return null;
      const plant = (await findRevisionById(this.#db, record.plantRevisionId))?.model;
      if (!plant) throw new SweepFailure("The sweep could not start: its plant revision no longer exists.");
      const controllers = gridCandidates(record.definition.ranges, record.definition.filter);
      if (controllers.length !== record.total) {
        throw new SweepFailure(`The sweep could not start: its grid has ${controllers.length} candidates, not the ${record.total} recorded.`);
      }
      await markSweepRunning(this.#db, sweepId);
      return { record, plant, controllers, next: await countCandidates(this.#db, sweepId) };
    } catch (error) {
      await this.#fail(sweepId, error, 0);
      return null;
    }
  }

  /** Evaluates and stores one chunk; returns false once the sweep is finished or failed. */
  async #step(sweep: ActiveSweep): Promise<boolean> {
    const id = sweep.record.id;
    try {
      if (sweep.next >= sweep.record.total) {
        await markSweepFinished(this.#db, id);
        return false;
      }
      const rows = this.#evaluateChunk(sweep);
      await insertCandidateChunk(this.#db, id, rows);
      sweep.next += rows.length;
      return true;
    } catch (error) {
      await this.#fail(id, error, sweep.next);
      return false;
    }
  }

  /** Evaluates candidates from `sweep.next` until the chunk size or the time budget is reached. */
  #evaluateChunk(sweep: ActiveSweep): CandidateDto[] {
    const { record, plant, controllers } = sweep;
    const { scenario } = record.definition;
    const started = performance.now();
    const rows: CandidateDto[] = [];
    for (let index = sweep.next; index < record.total && rows.length < this.#chunkSize; index += 1) {
      if (rows.length > 0 && performance.now() - started > this.#chunkBudgetMs) break;
      const controller = controllers[index] as PidController;
      const evaluation = evaluateCandidate(plant, controller, scenario, record.criteria);
      const scores = evaluation.scores;
      rows.push({
        index,
        params: [controller.kp, controller.ki, controller.kd, controller.tf],
        status: evaluation.status,
        scores: scores ? record.criteria.map((criterion) => scores[criterion]) : null,
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
