import type { Aggregate } from "../aggregates/aggregate-scores.js";
import { aggregateScores } from "../aggregates/aggregate-scores.js";
import { STATUS_DIVERGED, STATUS_STABLE, STATUS_UNSTABLE } from "../batch/batch-status.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import { baselines, type BaselineOptions } from "../tuning/baselines.js";
import type { ScoredBaseline } from "../tuning/score-baselines.js";
import { evaluateCandidate, type CandidateEvaluation, type EvaluateCandidateOptions } from "./evaluate-candidate.js";

/**
 * The published baselines of a family, placed like its candidates: each rule is designed on the
 * first variant (the nominal plant; baselines), its controller is scored on EVERY variant
 * (evaluateCandidate) and the scores are combined with the sweep's aggregate (aggregateScores), so a
 * baseline sits on the same axes as the candidates' aggregated scores. Status as for a candidate of
 * the family: "unstable" when unstable on some variant, else "diverged" when diverged on some
 * variant, else "stable"; scores null unless stable on every variant. `poles` are those on the
 * first variant. One variant: scoreBaselines' result.
 * Throws a RangeError naming a bad plant field, option, scenario field or criterion.
 */
export function scoreFamilyBaselines<C extends CriterionId>(
  family: readonly Plant[],
  scenario: Scenario,
  criteria: readonly C[],
  aggregate: Aggregate,
  options: BaselineOptions & { evaluation?: EvaluateCandidateOptions } = {},
): ScoredBaseline<C>[] {
  if (!Array.isArray(family) || family.length === 0) throw new RangeError("family: give at least one plant");
  const { evaluation, ...rules } = options;
  return baselines(family[0], rules).map((b) => {
    if (!b.ok) return { ...b, evaluation: null };
    const runs = family.map((plant) => evaluateCandidate(plant, b.controller, scenario, criteria, evaluation));
    return { ...b, evaluation: combine(runs, criteria, aggregate) };
  });
}

function combine<C extends CriterionId>(runs: CandidateEvaluation<C>[], criteria: readonly C[], aggregate: Aggregate): CandidateEvaluation<C> {
  if (runs.length === 1) return runs[0];
  const status = runs.some((r) => r.status === "unstable") ? "unstable" : runs.some((r) => r.status === "diverged") ? "diverged" : "stable";
  if (status !== "stable") return { status, poles: runs[0].poles, scores: null };
  const nc = criteria.length;
  const scores = new Float64Array(runs.length * nc);
  const codes = new Uint8Array(runs.length);
  runs.forEach((r, f) => {
    codes[f] = r.status === "stable" ? STATUS_STABLE : r.status === "unstable" ? STATUS_UNSTABLE : STATUS_DIVERGED;
    criteria.forEach((id, c) => (scores[f * nc + c] = r.scores![id]));
  });
  const combined = aggregateScores(scores, codes, 1, runs.length, criteria, aggregate);
  const out = {} as Record<C, number>;
  criteria.forEach((id, c) => (out[id] = combined[c]));
  return { status, poles: runs[0].poles, scores: out };
}
