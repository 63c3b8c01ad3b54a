import type { CriterionOptions } from "../criteria/criterion-definition.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { CRITERIA } from "../criteria/registry.js";
import type { LinearPlant } from "../plants/plant.js";
import { evaluateCandidate, type CandidateEvaluation } from "../evaluation/evaluate-candidate.js";
import type { LoopTrace } from "../simulation/loop-trace.js";
import type { Scenario } from "../simulation/scenario.js";
import { continuousController } from "./deployable-pid.js";
import type { DeploymentSheet } from "./deployment-sheet.js";
import { simulateSampledLoop } from "./simulate-sampled-loop.js";

/** The criteria of one re-simulated sampled loop. */
export interface SampledScores<C extends CriterionId> {
  status: LoopTrace["status"];
  /** Time criteria from the sampled trace; frequency criteria NaN (not recomputed for the sampled loop). Null when diverged. */
  scores: Record<C, number> | null;
}

/** Every criterion of the continuous loop, of the sampled loop and of the sampled loop with rounded coefficients. */
export interface SampledCriteria<C extends CriterionId> {
  continuous: CandidateEvaluation<C>;
  sampled: SampledScores<C>;
  /** Null when the sheet has no fixed-point coefficients. */
  rounded: SampledScores<C> | null;
}

/**
 * Scores a deployment sheet's controller three ways on a linear plant and scenario, so the change
 * in every criterion can be shown: the continuous loop (evaluateCandidate with the sheet's PID as
 * a two-degree-of-freedom controller, the plant's own actuator limits), the sampled loop with the
 * exact difference equations, and — when the sheet has them — with the fixed-point coefficients
 * (simulateSampledLoop, then each time criterion of the registry on the trace). Frequency criteria
 * are reported for the continuous loop only (NaN for the sampled ones).
 */
export function sampledCriteria<C extends CriterionId>(
  plant: LinearPlant,
  sheet: DeploymentSheet,
  scenario: Scenario,
  criteria: readonly C[],
  options: { criterion?: CriterionOptions } = {},
): SampledCriteria<C> {
  const continuous = evaluateCandidate(plant, continuousController(sheet.discrete.pid), scenario, criteria, { poles: false, criterion: options.criterion });
  const score = (trace: LoopTrace): SampledScores<C> => {
    if (trace.status === "diverged") return { status: trace.status, scores: null };
    const scores = {} as Record<C, number>;
    for (const id of criteria) scores[id] = CRITERIA[id].kind === "time" ? CRITERIA[id].compute(trace, options.criterion) : NaN;
    return { status: trace.status, scores };
  };
  return {
    continuous,
    sampled: score(simulateSampledLoop(plant, sheet.discrete, scenario)),
    rounded: sheet.fixedPoint ? score(simulateSampledLoop(plant, sheet.fixedPoint.discrete, scenario)) : null,
  };
}
