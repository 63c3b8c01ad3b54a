import { createSweepSearch, searchObjectiveMatrix } from "@loopyard/core";
import type { SweepBatchEvaluator } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { finishSearchSweep, storedAggregates, storeSearchGeneration } from "./sweep-chunk-repository.js";
import { evaluateCandidates, type SweepEvaluationContext } from "./sweep-evaluation.js";

/**
 * One generation of a search sweep as a job. The search is deterministic (seeded), so the job
 * replays it from the start, telling it the stored aggregate scores of every generation already
 * stored (no evaluation), evaluates the first generation that is not, stores it in one transaction
 * (rows already stored are skipped) and returns the next generation's number — or finishes the
 * sweep (its total becomes the candidates stored) once the search is done or its budget used.
 * Returns null when the sweep is finished.
 */
export async function runSearchGeneration(db: Database, context: SweepEvaluationContext, evaluate: SweepBatchEvaluator): Promise<number | null> {
  const { search, objectives } = createSweepSearch(context.plan);
  const budget = context.plan.budget;
  const criteria = context.plan.criteria;
  const stored = await storedAggregates(db, context.sweepId);
  const d = context.plan.d;
  let next = 0;
  for (let generation = 0; ; generation++) {
    if (search.done || next >= budget) {
      await finishSearchSweep(db, context.sweepId);
      return null;
    }
    let x = search.ask();
    let m = d === 0 ? 0 : x.length / d;
    if (m === 0) {
      await finishSearchSweep(db, context.sweepId);
      return null;
    }
    const truncated = next + m > budget;
    if (truncated) {
      // The last generation within the budget: evaluate only what fits, then finish.
      m = budget - next;
      x = x.subarray(0, m * d);
    }
    if (Array.from({ length: m }, (_, i) => stored.has(next + i)).every(Boolean)) {
      if (truncated) break;
      search.tell(searchObjectiveMatrix((i) => stored.get(next + i) ?? null, m, criteria, objectives));
      next += m;
      continue;
    }
    const { rows, aggregate } = await evaluateCandidates(context, x, next, evaluate);
    await storeSearchGeneration(db, context.sweepId, rows);
    const nc = criteria.length;
    if (truncated || next + m >= budget) {
      await finishSearchSweep(db, context.sweepId);
      return null;
    }
    search.tell(searchObjectiveMatrix((i) => (rows[i]?.status === "stable" ? Array.from(aggregate.subarray(i * nc, (i + 1) * nc)) : null), m, criteria, objectives));
    return generation + 1;
  }
  await finishSearchSweep(db, context.sweepId);
  return null;
}
