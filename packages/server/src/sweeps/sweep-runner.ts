import { performance } from "node:perf_hooks";
import { assertValidController, batchStatusName, evaluateBatch, sweepCandidateCount } from "@loopyard/core";
import type { Plant } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRevisionById } from "../plants/plant-repository.js";
import { countCandidates, insertCandidateChunk, type CandidateRow } from "./candidate-repository.js";
import { candidateParams, planController, structureProblem, sweepPlan, type SweepPlan } from "./sweep-plan.js";
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
  plan: SweepPlan;
  /** Index of the next candidate to evaluate (candidates before it are stored). */
  next: number;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs sweeps in this process. Each step evaluates one chunk of one sweep's candidates with core's
 * evaluateBatch (the same numerics as the CLI and the worker pool), then stores them together with the sweep's progress in one transaction, and
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
      const plan = sweepPlan(record.definition);
      const count = sweepCandidateCount(record.definition);
      if (count !== record.total) {
        throw new SweepFailure(`The sweep could not start: its grid has ${count} candidates, not the ${record.total} recorded.`);
      }
      const problem = structureProblem(plan.structure, plant);
      if (problem) throw new SweepFailure(`The sweep could not start: ${problem}.`);
      await markSweepRunning(this.#db, sweepId);
      return { record, plant, plan, next: await countCandidates(this.#db, sweepId) };
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

  /**
   * Evaluates candidates from `sweep.next` until the chunk size or the time budget is reached, in
   * slices sized from the time the previous slice took per candidate (nonlinear loops cost far
   * more than linear ones).
   */
  #evaluateChunk(sweep: ActiveSweep): CandidateRow[] {
    const started = performance.now();
    const end = Math.min(sweep.record.total, sweep.next + this.#chunkSize);
    const rows: CandidateRow[] = [];
    let from = sweep.next;
    let slice = 1;
    while (from < end) {
      const to = Math.min(end, from + slice);
      const sliceStarted = performance.now();
      rows.push(...this.#evaluateSlice(sweep, from, to));
      const now = performance.now();
      const remaining = this.#chunkBudgetMs - (now - started);
      if (remaining <= 0) break;
      const perCandidate = Math.max((now - sliceStarted) / (to - from), 1e-3);
      slice = Math.max(1, Math.floor(remaining / perCandidate));
      from = to;
    }
    return rows;
  }

  /**
   * Candidates [from, to) through core evaluateBatch on the sweep's plant. A candidate core rejects
   * (status "invalid") and every candidate of a slice whose evaluation throws are stored as
   * "diverged" with the reason, so one bad slice does not stop the sweep.
   */
  #evaluateSlice(sweep: ActiveSweep, from: number, to: number): CandidateRow[] {
    const { plan, plant, record } = sweep;
    const controllers = Array.from({ length: to - from }, (_, i) => planController(plan, from + i));
    const rows = controllers.map((controller, i): CandidateRow => ({
      index: from + i,
      params: candidateParams(plan, controller),
      status: "diverged",
      scores: null,
    }));
    let result;
    try {
      result = evaluateBatch([plant], plan.structure, plan.candidates.subarray(from * plan.d, to * plan.d), plan.scenario, record.criteria, {
        evaluation: plan.evaluation,
      });
    } catch (error) {
      const reason = `evaluation failed: ${error instanceof Error ? error.message : String(error)}`;
      console.error(`[loopyard] sweep ${record.id}: candidates ${from}–${to - 1} could not be evaluated:`, error);
      for (const row of rows) row.error = reason;
      return rows;
    }
    const nc = record.criteria.length;
    rows.forEach((row, i) => {
      const status = batchStatusName(result.status[i] as number);
      if (status === "invalid") {
        row.error = rejectionReason(controllers[i]);
        return;
      }
      row.status = status;
      if (status === "stable") row.scores = Array.from(result.scores.subarray(i * nc, (i + 1) * nc));
    });
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

/** Why core rejected a candidate's controller (its RangeError's sentence). */
function rejectionReason(controller: Parameters<typeof assertValidController>[0] | undefined): string {
  try {
    if (controller) assertValidController(controller);
  } catch (error) {
    return `the controller was rejected: ${error instanceof Error ? error.message : String(error)}`;
  }
  return "the controller was rejected before evaluation";
}
