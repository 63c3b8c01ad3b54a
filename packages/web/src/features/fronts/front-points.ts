import type { CandidateDto, CriterionId } from "@loopyard/core";
import { finiteScore } from "../../components/format-score.js";

export interface FrontPoint {
  index: number;
  x: number;
  y: number;
}

/**
 * The stable candidates with finite scores on the two chosen criteria, as plot points;
 * unstable and diverged candidates and scores sent as "inf", "-inf" or null are left out (they have no place on the axes).
 */
export function frontPoints(candidates: readonly CandidateDto[], criteria: readonly CriterionId[], x: CriterionId, y: CriterionId): FrontPoint[] {
  const ix = criteria.indexOf(x);
  const iy = criteria.indexOf(y);
  if (ix < 0 || iy < 0) return [];
  const points: FrontPoint[] = [];
  for (const c of candidates) {
    if (c.status !== "stable" || !c.scores) continue;
    const px = finiteScore(c.scores[ix]);
    const py = finiteScore(c.scores[iy]);
    if (px !== null && py !== null) points.push({ index: c.index, x: px, y: py });
  }
  return points;
}

/** The two criteria plotted first: ISE against effort when the sweep scored both, else its first two. */
export function defaultAxes(criteria: readonly CriterionId[]): { x: CriterionId; y: CriterionId } {
  if (criteria.includes("ise") && criteria.includes("effort")) return { x: "ise", y: "effort" };
  return { x: criteria[0], y: criteria[1] ?? criteria[0] };
}
