import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import { evaluateCandidate, type CandidateEvaluation, type EvaluateCandidateOptions } from "../evaluation/evaluate-candidate.js";
import type { Scenario } from "../simulation/scenario.js";
import { baselines, type Baseline, type BaselineOptions } from "./baselines.js";

/** A baseline with its evaluation (null when the rule does not apply to the plant). */
export type ScoredBaseline<C extends CriterionId = CriterionId> = Baseline & { evaluation: CandidateEvaluation<C> | null };

/** Options of scoreBaselines: the rules' design choices and evaluateCandidate's options. */
export interface ScoreBaselinesOptions extends BaselineOptions {
  evaluation?: EvaluateCandidateOptions;
}

/**
 * Every baseline of the plant (baselines) scored like any candidate: evaluateCandidate(plant,
 * controller, scenario, criteria) on the plant itself — not on the fitted model — giving the status
 * ("stable", "unstable", "diverged"), the closed-loop poles and the scores.
 * Throws a RangeError naming a bad plant field, option, scenario field or criterion.
 */
export function scoreBaselines<C extends CriterionId>(
  plant: Plant,
  scenario: Scenario,
  criteria: readonly C[],
  options: ScoreBaselinesOptions = {},
): ScoredBaseline<C>[] {
  const { evaluation, ...rules } = options;
  return baselines(plant, rules).map((b) => ({
    ...b,
    evaluation: b.ok ? evaluateCandidate(plant, b.controller, scenario, criteria, evaluation) : null,
  }));
}
