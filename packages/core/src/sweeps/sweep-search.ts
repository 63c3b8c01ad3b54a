import type { CriterionId } from "../criteria/criterion-id.js";
import { createNelderMeadSearch } from "../search/nelder-mead-search.js";
import { createNsga2Search } from "../search/nsga2-search.js";
import { searchObjectiveMatrix } from "../search/search-objectives.js";
import { evaluateSweepChunkWith, type SweepBatchEvaluator, type SweepRow } from "./evaluate-sweep-chunk.js";
import type { SweepPlan } from "./plan-sweep.js";

/** An ask/tell search over a plan's parameter space (Nelder–Mead multi-start or NSGA-II). */
export interface SweepSearch {
  /** The next generation's tunable vectors (n × d, row-major); empty when done. */
  ask(): Float64Array;
  /** The objective matrix of the last generation (n × k, smaller is better, NaN for infeasible). */
  tell(values: Float64Array): void;
  readonly done: boolean;
}

/**
 * The search of a plan's search design, fresh and deterministic (seeded): Nelder–Mead on the
 * design's criterion, or NSGA-II on every criterion of the sweep; `objectives` are the criteria it
 * minimises (larger-is-better ones negated by searchObjectiveMatrix). Throws a RangeError for a
 * plan whose design is not a search.
 */
export function createSweepSearch(plan: SweepPlan): { search: SweepSearch; objectives: CriterionId[] } {
  const design = plan.definition.design;
  if (design.kind !== "search") throw new RangeError("design: not a search design");
  if (design.method === "nelder-mead") {
    return {
      search: createNelderMeadSearch(plan.space, { starts: design.starts, iterations: design.iterations, seed: design.seed }),
      objectives: [design.criterion],
    };
  }
  return {
    search: createNsga2Search(plan.space, { population: design.population, generations: design.generations, seed: design.seed }),
    objectives: [...plan.criteria],
  };
}

/**
 * Runs a plan's search design to its end in one go (the CLI; the server runs it as one job per
 * generation and replays it): each generation is asked, evaluated through evaluateSweepChunkWith
 * with indices continuing from the last, and told its objectives, until the search is done or its
 * budget (plan.budget) is used — the last generation cut to what fits. Returns every row in order.
 */
export async function runSweepSearch(plan: SweepPlan, evaluate: SweepBatchEvaluator, onGeneration?: (done: number) => void): Promise<SweepRow[]> {
  const { search, objectives } = createSweepSearch(plan);
  const rows: SweepRow[] = [];
  const nc = plan.criteria.length;
  while (!search.done && rows.length < plan.budget) {
    let vectors = search.ask();
    let m = plan.d === 0 ? 0 : vectors.length / plan.d;
    if (m === 0) break;
    const truncated = rows.length + m > plan.budget;
    if (truncated) {
      m = plan.budget - rows.length;
      vectors = vectors.subarray(0, m * plan.d);
    }
    const chunk = await evaluateSweepChunkWith(plan, { vectors, first: rows.length }, evaluate);
    rows.push(...chunk.rows);
    onGeneration?.(rows.length);
    if (truncated) break;
    search.tell(
      searchObjectiveMatrix((i) => (chunk.rows[i]?.status === "stable" ? Array.from(chunk.aggregate.subarray(i * nc, (i + 1) * nc)) : null), m, plan.criteria, objectives),
    );
  }
  return rows;
}
