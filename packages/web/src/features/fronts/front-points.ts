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

/** The criteria for which at least one stable candidate has a finite score (the others cannot be plotted). */
export function plottableCriteria(candidates: readonly CandidateDto[], criteria: readonly CriterionId[]): CriterionId[] {
  return criteria.filter((_, i) => candidates.some((c) => c.status === "stable" && c.scores !== null && finiteScore(c.scores[i]) !== null));
}

/**
 * The two criteria plotted first: ISE against effort when the sweep scored both, else its first two
 * that can be plotted (a criterion that does not apply to the scenario, e.g. settling time under a
 * load step alone, has no finite score and is passed over when `candidates` are given).
 */
export function defaultAxes(criteria: readonly CriterionId[], candidates?: readonly CandidateDto[]): { x: CriterionId; y: CriterionId } {
  const usable = candidates ? plottableCriteria(candidates, criteria) : [...criteria];
  const pool = usable.length > 0 ? usable : [...criteria];
  if (pool.includes("ise") && pool.includes("effort")) return { x: "ise", y: "effort" };
  return { x: pool[0], y: pool[1] ?? pool[0] };
}
