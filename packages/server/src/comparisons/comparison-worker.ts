import { randomUUID } from "node:crypto";
import { availableParallelism, hostname } from "node:os";
import type PgBoss from "pg-boss";
import { evaluateBatch } from "@loopyard/core";
import type { BatchResult, ComparisonInput, ComparisonPick, ComparisonPlan, CriterionId, PrescanChunk } from "@loopyard/core";
import { createEvaluationPool, type EvaluationPool } from "@loopyard/core/pool";
import { EVALUATION_NICENESS } from "../workers/evaluation-niceness.js";
import type { Database } from "../db/database.js";
import {
  advanceComparison,
  COMPARISON_ANALYSE_QUEUE,
  COMPARISON_PRESCAN_QUEUE,
  COMPARISON_REFINE_QUEUE,
  reconcileComparisonJobs,
  type AnalyseJob,
  type PrescanChunkJob,
  type RefineJob,
} from "./comparison-jobs.js";
import { ComparisonDefinitionError, loadPlan, prescanOf, runAnalysis, runPrescanChunk, runRefinement, storedInput, type VectorEvaluator } from "./comparison-engine.js";
import {
  chunkState,
  completePick,
  completePrescanChunk,
  countAttempt,
  failTask,
  findComparison,
  finishComparison,
  loadPicks,
  loadPrescanChunks,
  markComparisonFailed,
  pickState,
} from "./comparison-repository.js";
import { noticeRunEnded, publicUrlFromEnv } from "../mail/run-notices.js";


/** Comparisons whose plan a worker keeps. */
const PLAN_CACHE_SIZE = 8;
/** Seconds between checks for comparison jobs that failed without their worker marking them. */
const RECONCILE_SECONDS = 60;

export interface ComparisonWorkerOptions {
  /** Threads of the evaluation pool (default os.availableParallelism()); 0 evaluates in process. */
  threads?: number;
  /** Address of the app for the links in end-of-comparison mails (default LOOPYARD_PUBLIC_URL, or http://HOST:PORT). */
  publicUrl?: string;
}

export interface ComparisonWorker {
  readonly id: string;
  /** Stops taking jobs (running ones finish) and closes the pool. */
  close(): Promise<void>;
}

/**
 * A worker of comparisons: takes pre-scan chunks, refinements and analyses from their pg-boss
 * queues and stores each result in one transaction with the completion of its piece (a piece no
 * longer pending changes nothing, so a retried or doubled job is harmless), then enqueues what
 * the comparison needs next. Evaluations run on a piscina pool (@loopyard/core/pool), so the
 * process's event loop stays free. A job that throws is retried with backoff; on its last attempt
 * its piece is marked failed, which fails the comparison with a sentence.
 */
export async function startComparisonWorker(db: Database, boss: PgBoss, options: ComparisonWorkerOptions = {}): Promise<ComparisonWorker> {
  const threads = options.threads ?? availableParallelism();
  const publicUrl = options.publicUrl ?? publicUrlFromEnv();
  const pool: EvaluationPool | null = threads > 0 ? createEvaluationPool({ workers: threads, niceness: EVALUATION_NICENESS }) : null;
  const id = `${hostname()}:${process.pid}:comparisons:${randomUUID().slice(0, 8)}`;

  const evaluate: VectorEvaluator = async (plan, vectors, criteria): Promise<BatchResult> => {
    const { setup } = plan;
    const evaluation = setup.evaluation === undefined ? {} : { evaluation: setup.evaluation };
    if (!pool) return evaluateBatch(setup.family, setup.structure, vectors, setup.scenario, criteria as CriterionId[], evaluation);
    const m = vectors.length / Math.max(1, setup.structure.tunable.length);
    return pool.evaluate(
      { family: setup.family, structure: setup.structure, candidates: vectors, scenario: setup.scenario, criteria, ...evaluation },
      { chunkSize: Math.max(1, Math.ceil(m / threads)) },
    );
  };

  const plans = new Map<string, Promise<ComparisonPlan>>();
  const planOf = (comparisonId: string, input: ComparisonInput) => {
    let plan = plans.get(comparisonId);
    if (!plan) {
      plan = loadPlan(db, input);
      plan.catch(() => plans.delete(comparisonId));
      plans.set(comparisonId, plan);
      while (plans.size > PLAN_CACHE_SIZE) plans.delete(plans.keys().next().value as string);
    }
    return plan;
  };

  /** The running comparison and its plan, or null when there is nothing to do (stopped, or a definition that cannot run fails it). */
  async function running(comparisonId: string): Promise<ComparisonPlan | null> {
    const record = await findComparison(db, comparisonId);
    if (!record || (record.status !== "queued" && record.status !== "running")) return null;
    try {
      return await planOf(comparisonId, storedInput(record.definition));
    } catch (error) {
      if (error instanceof ComparisonDefinitionError) {
        await markComparisonFailed(db, comparisonId, `The comparison could not run: ${error.message}.`);
        return null;
      }
      throw error;
    }
  }

  /** Runs one piece; on its last attempt a failure is stored (and fails the comparison) instead of thrown. */
  async function attempt(job: PgBoss.JobWithMetadata<{ comparisonId: string }>, what: string, onLastFailure: (message: string) => Promise<void>, work: () => Promise<void>) {
    try {
      await work();
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      if (job.retryCount >= job.retryLimit) {
        console.error(`[loopyard] comparison ${job.data.comparisonId} ${what} failed after ${job.retryCount + 1} attempts: ${message}`);
        await onLastFailure(message);
        await advanceComparison(db, boss, job.data.comparisonId);
        return;
      }
      throw error;
    }
  }

  async function handlePrescan(job: PgBoss.JobWithMetadata<PrescanChunkJob>): Promise<void> {
    const { comparisonId, chunk, start, end } = job.data;
    if ((await chunkState(db, comparisonId, chunk)) !== "pending") return;
    await attempt(job, `pre-scan chunk ${chunk}`, (m) => failTask(db, comparisonId, { chunk }, m, id), async () => {
      const plan = await running(comparisonId);
      if (!plan) return;
      await countAttempt(db, comparisonId, { chunk });
      const data = await runPrescanChunk(plan, start, end, evaluate);
      if (await completePrescanChunk(db, comparisonId, chunk, data, id)) await advanceComparison(db, boss, comparisonId);
    });
  }

  async function handleRefine(job: PgBoss.JobWithMetadata<RefineJob>): Promise<void> {
    const { comparisonId, contender } = job.data;
    if ((await pickState(db, comparisonId, contender)) !== "pending") return;
    await attempt(job, `refinement of contender ${contender + 1}`, (m) => failTask(db, comparisonId, { contender }, m, id), async () => {
      const plan = await running(comparisonId);
      if (!plan) return;
      await countAttempt(db, comparisonId, { contender });
      const prescan = prescanOf(plan, await loadPrescanChunks<PrescanChunk>(db, comparisonId));
      const pick = await runRefinement(plan, contender, prescan, evaluate);
      if (await completePick(db, comparisonId, contender, pick, id)) await advanceComparison(db, boss, comparisonId);
    });
  }

  async function handleAnalyse(job: PgBoss.JobWithMetadata<AnalyseJob>): Promise<void> {
    const { comparisonId } = job.data;
    await attempt(job, "analysis", (m) => markComparisonFailed(db, comparisonId, `The analysis failed: ${m}`), async () => {
      const plan = await running(comparisonId);
      if (!plan) return;
      const prescan = prescanOf(plan, await loadPrescanChunks<PrescanChunk>(db, comparisonId));
      const picks = (await loadPicks<ComparisonPick>(db, comparisonId)).map((p) => p.pick);
      const result = await runAnalysis(plan, prescan, picks, evaluate);
      await finishComparison(db, comparisonId, result);
    });
  }

  const reconcile = setInterval(() => {
    reconcileComparisonJobs(db, boss).catch((error: unknown) => console.error(`[loopyard] checking failed comparison jobs failed: ${String(error)}`));
  }, RECONCILE_SECONDS * 1000);
  reconcile.unref();

  // Chunks keep the pool busy while one is stored; refinements are sequential ask/tell loops, so
  // one per thread runs at once; an analysis is one job per comparison.
  const queues: [string, number, (job: PgBoss.JobWithMetadata<never>) => Promise<void>][] = [
    [COMPARISON_PRESCAN_QUEUE, Math.max(1, threads + 1), handlePrescan as (job: PgBoss.JobWithMetadata<never>) => Promise<void>],
    [COMPARISON_REFINE_QUEUE, Math.max(1, threads), handleRefine as (job: PgBoss.JobWithMetadata<never>) => Promise<void>],
    [COMPARISON_ANALYSE_QUEUE, 1, handleAnalyse as (job: PgBoss.JobWithMetadata<never>) => Promise<void>],
  ];
  for (const [queue, concurrency, handle] of queues) {
    for (let i = 0; i < concurrency; i++) {
      let workId = "";
      workId = await boss.work<never>(queue, { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true }, async ([job]) => {
        if (!job) return;
        try {
          await handle(job);
        } finally {
          // The comparison's author is mailed once it has ended (a no-op while it runs).
          await noticeRunEnded(db, boss, "comparison", (job.data as { comparisonId: string }).comparisonId, publicUrl);
          boss.notifyWorker(workId);
        }
      });
    }
  }

  let closing: Promise<void> | null = null;
  return {
    id,
    close() {
      closing ??= (async () => {
        clearInterval(reconcile);
        for (const [queue] of queues) await boss.offWork(queue).catch(() => undefined);
        await pool?.close();
      })();
      return closing;
    },
  };
}
