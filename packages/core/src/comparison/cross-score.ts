import type { ComparisonPick } from "./comparison-pick.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { oriented } from "./comparison-rows.js";

/**
 * The cross-score of a comparison: one row per pick, one column per contender and judge (plan
 * order). values[p][k] is pick p's aggregate on column k; regrets[p][k] how much worse it is than
 * the best pick in that column, in per cent (regretPercent); best[k] the row of that best pick
 * (the first on a tie), −1 when no pick has a value there.
 */
export interface CrossScore {
  rows: string[];
  columns: string[];
  values: number[][];
  regrets: number[][];
  best: number[];
}

/** The cross-score of picks (one per contender, in plan order) against every column of the plan. */
export function crossScore(plan: ComparisonPlan, picks: readonly ComparisonPick[]): CrossScore {
  const best = plan.columns.map((column, k) => {
    let at = -1;
    let value = Infinity;
    picks.forEach((pick, p) => {
      const v = pick.found ? oriented(column, pick.aggregates[k]) : NaN;
      if (!Number.isNaN(v) && (at < 0 || v < value)) {
        at = p;
        value = v;
      }
    });
    return at;
  });
  return {
    rows: picks.map((p) => p.contender),
    columns: plan.columns.map((c) => c.key),
    values: picks.map((pick) => plan.columns.map((_, k) => (pick.found ? pick.aggregates[k] : NaN))),
    regrets: picks.map((pick) =>
      plan.columns.map((column, k) => {
        if (!pick.found || best[k] < 0) return NaN;
        return regretPercent(pick.aggregates[k], picks[best[k]].aggregates[k], column.better);
      }),
    ),
    best,
  };
}

/**
 * Regret of a value against the best value of its column, in per cent of the best:
 *
 *   smaller is better:  100·(v − b)/|b|        larger is better:  100·(b − v)/|b|
 *
 * 0 when v equals b (also for two infinities of one sign, e.g. settling never reached by both);
 * +∞ when b = 0 and v ≠ b, or when v is infinite and b is not; NaN when either is NaN.
 * Common practice (relative sub-optimality).
 */
export function regretPercent(value: number, best: number, better: "smaller" | "larger"): number {
  if (Number.isNaN(value) || Number.isNaN(best)) return NaN;
  if (value === best) return 0;
  const worse = better === "larger" ? best - value : value - best;
  if (!Number.isFinite(worse)) return worse > 0 ? Infinity : NaN;
  if (best === 0 || !Number.isFinite(best)) return worse > 0 ? Infinity : -Infinity;
  return (100 * worse) / Math.abs(best);
}
