import type { ComparisonPick } from "./comparison-pick.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { oriented } from "./comparison-rows.js";

/**
 * Makes every contender's pick the best of all picks on its own column: when another contender's
 * pick (found, so within the box and the constraints) has a strictly better aggregate there — a
 * local refinement can stop in a poorer basin the other contender's search happened to leave —
 * that candidate is the better answer for this contender too, and is taken over with
 * `adoptedFrom` set. So the cross-score's diagonal regret is 0 by construction of the pick, not
 * by rounding. Picks are matched to contenders by position (picks[k] ↔ plan.columns[k]).
 */
export function reconcilePicks(plan: ComparisonPlan, picks: readonly ComparisonPick[]): ComparisonPick[] {
  if (picks.length !== plan.contenders) throw new RangeError(`picks: expected ${plan.contenders} (one per contender), got ${picks.length}`);
  return picks.map((pick, k) => {
    const column = plan.columns[k];
    let best = pick;
    let bestValue = pick.found ? oriented(column, pick.aggregates[k]) : Infinity;
    if (Number.isNaN(bestValue)) bestValue = Infinity;
    for (const other of picks) {
      if (other === pick || !other.found) continue;
      const value = oriented(column, other.aggregates[k]);
      if (value < bestValue) {
        best = other;
        bestValue = value;
      }
    }
    if (best === pick) return pick;
    return { ...best, contender: pick.contender, evaluations: pick.evaluations, converged: pick.converged, adoptedFrom: best.adoptedFrom ?? best.contender };
  });
}
