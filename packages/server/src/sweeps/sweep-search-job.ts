import { createNelderMeadSearch, createNsga2Search, criterionSense, sweepSpace } from "@loopyard/core";
import type { CriterionId, NelderMeadSearch, Nsga2Search, SweepInputParsed } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { finishSearchSweep, storedAggregates, storeSearchGeneration } from "./sweep-chunk-repository.js";
import { evaluateCandidates, type BatchEvaluator, type SweepEvaluationContext } from "./sweep-evaluation.js";

type Search = (NelderMeadSearch | Nsga2Search) & { ask(): Float64Array; tell(values: Float64Array): void; readonly done: boolean };

/** The ask/tell search of a search design (core createNelderMeadSearch / createNsga2Search), fresh and deterministic. */
function createSearch(definition: SweepInputParsed): { search: Search; objectives: CriterionId[]; budget: number } {
  const design = definition.design;
  if (design.kind !== "search") throw new Error("not a search design");
  const space = sweepSpace(definition);
  if (design.method === "nelder-mead") {
    return {
      search: createNelderMeadSearch(space, { starts: design.starts, iterations: design.iterations, seed: design.seed }) as Search,
      objectives: [design.criterion],
      budget: design.starts * design.iterations,
    };
  }
  return {
    search: createNsga2Search(space, { population: design.population, generations: design.generations, seed: design.seed }) as Search,
    objectives: [...definition.criteria],
    budget: design.population * (design.generations + 1),
  };
}

/** Objective values of m candidates (m × k), every criterion turned so that smaller is better; NaN when not stable. */
function objectiveValues(aggregate: (i: number) => number[] | null, m: number, criteria: readonly CriterionId[], objectives: readonly CriterionId[]): Float64Array {
  const k = objectives.length;
  const out = new Float64Array(m * k);
  const columns = objectives.map((id) => criteria.indexOf(id));
  const signs = objectives.map((id) => (criterionSense(id) === "larger" ? -1 : 1));
  for (let i = 0; i < m; i++) {
    const scores = aggregate(i);
    for (let j = 0; j < k; j++) out[i * k + j] = scores ? signs[j]! * (scores[columns[j]!] ?? Number.NaN) : Number.NaN;
  }
  return out;
}

/**
 * One generation of a search sweep as a job. The search is deterministic (seeded), so the job
 * replays it from the start, telling it the stored aggregate scores of every generation already
 * stored (no evaluation), evaluates the first generation that is not, stores it in one transaction
 * (rows already stored are skipped) and returns the next generation's number — or finishes the
 * sweep (its total becomes the candidates stored) once the search is done or its budget used.
 * Returns null when the sweep is finished.
 */
export async function runSearchGeneration(db: Database, context: SweepEvaluationContext, evaluate: BatchEvaluator): Promise<number | null> {
  const { search, objectives, budget } = createSearch(context.definition);
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
      search.tell(objectiveValues((i) => stored.get(next + i) ?? null, m, context.criteria, objectives));
      next += m;
      continue;
    }
    const { rows, aggregate } = await evaluateCandidates(context, x, next, evaluate);
    await storeSearchGeneration(db, context.sweepId, rows);
    const nc = context.criteria.length;
    if (truncated || next + m >= budget) {
      await finishSearchSweep(db, context.sweepId);
      return null;
    }
    search.tell(objectiveValues((i) => (rows[i]?.status === "stable" ? Array.from(aggregate.subarray(i * nc, (i + 1) * nc)) : null), m, context.criteria, objectives));
    return generation + 1;
  }
  await finishSearchSweep(db, context.sweepId);
  return null;
}
