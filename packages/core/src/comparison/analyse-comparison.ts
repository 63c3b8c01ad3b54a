import { comparisonAgreement, type Agreement } from "./comparison-agreement.js";
import type { ComparisonPick } from "./comparison-pick.js";
import type { ComparisonColumn, ComparisonPlan } from "./comparison-plan.js";
import { isFeasible } from "./comparison-rows.js";
import type { StabilityEntry } from "./comparison-stability.js";
import { comparisonSummary, type PrescanCounts } from "./comparison-summary.js";
import { crossScore, type CrossScore } from "./cross-score.js";
import type { PrescanResult } from "./prescan.js";
import { STATUS_STABLE } from "../batch/batch-status.js";

/** One pick's scores on every variant, with the variant that sets each column's worst value. */
export interface PickVariants {
  contender: string;
  /** scores[f][k]: column k on variant f (plan order). */
  scores: number[][];
  /** worst[k]: the variant with the worst value of column k (largest, or smallest for a larger-is-better column); −1 when none. */
  worst: number[];
  /** spread[k]: the smallest and largest value of column k over the family (NaN values left out). */
  spread: { min: number; max: number }[];
}

/** Everything a comparison's page and the CLI show, computed from its plan, pre-scan, picks and stability entries. */
export interface ComparisonAnalysis {
  columns: ComparisonColumn[];
  variants: string[];
  picks: ComparisonPick[];
  crossScore: CrossScore;
  perVariant: PickVariants[];
  agreement: Agreement;
  prescan: PrescanCounts;
  stability: StabilityEntry[];
  summary: string[];
}

/**
 * The last step of a comparison: the cross-score (picks × contenders and judges, values and
 * regrets), each pick per variant with its worst variant and spread, the agreement of the criteria
 * over the pre-scan (Kendall τ_b), the pre-scan's counts and the plain-language summary. Pure and
 * cheap (no evaluation); picks are taken as given (run reconcilePicks before).
 */
export function analyseComparison(
  plan: ComparisonPlan,
  prescan: PrescanResult,
  picks: readonly ComparisonPick[],
  stability: readonly StabilityEntry[] = [],
): ComparisonAnalysis {
  if (picks.length !== plan.contenders) throw new RangeError(`picks: expected ${plan.contenders} (one per contender), got ${picks.length}`);
  const cross = crossScore(plan, picks);
  const agreement = comparisonAgreement(plan, prescan);
  let stable = 0;
  let feasible = 0;
  for (let i = 0; i < prescan.n; i++) {
    let held = true;
    for (let f = 0; f < prescan.variants && held; f++) held = prescan.status[i * prescan.variants + f] === STATUS_STABLE;
    if (held) stable++;
    if (isFeasible(prescan, i)) feasible++;
  }
  const counts: PrescanCounts = { candidates: prescan.n, stable, feasible };
  return {
    columns: [...plan.columns],
    variants: [...plan.variants],
    picks: [...picks],
    crossScore: cross,
    perVariant: picks.map((pick) => pickVariants(plan, pick)),
    agreement,
    prescan: counts,
    stability: [...stability],
    summary: comparisonSummary(plan, picks, cross, agreement, stability, counts),
  };
}

function pickVariants(plan: ComparisonPlan, pick: ComparisonPick): PickVariants {
  const worst = plan.columns.map((column, k) => {
    let at = -1;
    pick.perVariant.forEach((row, f) => {
      const v = row[k];
      if (Number.isNaN(v)) return;
      if (at < 0 || (column.better === "larger" ? v < pick.perVariant[at][k] : v > pick.perVariant[at][k])) at = f;
    });
    return at;
  });
  const spread = plan.columns.map((_, k) => {
    const values = pick.perVariant.map((row) => row[k]).filter((v) => !Number.isNaN(v));
    return values.length === 0 ? { min: NaN, max: NaN } : { min: Math.min(...values), max: Math.max(...values) };
  });
  return { contender: pick.contender, scores: pick.perVariant, worst, spread };
}
