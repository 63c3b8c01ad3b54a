import type { Complex } from "../linear-algebra/complex.js";
import { pidStateSpace } from "../controllers/pid-state-space.js";
import type { PidController } from "../controllers/pid.js";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import { CRITERIA } from "../criteria/registry.js";
import { normalizeTransferFunction } from "../plants/normalize-transfer-function.js";
import type { Plant } from "../plants/plant.js";
import { closedLoopPoles } from "./closed-loop-poles.js";
import { isWellPosedLoop } from "./ill-posed-loop-error.js";
import { isStable } from "./is-stable.js";
import type { LoopTrace, SetpointStepScenario } from "./loop-trace.js";
import { simulateLoop } from "./simulate-loop.js";

/** The verdict and scores of one candidate controller on one plant and scenario. */
export interface CandidateEvaluation<C extends CriterionId = CriterionId> {
  status: "stable" | "unstable";
  /** Closed-loop poles (with a Padé-approximated dead time, see closedLoopPoles). */
  poles: Complex[];
  /** One value per requested criterion; null when the candidate is unstable. */
  scores: Record<C, number> | null;
}

/**
 * Evaluates a PID candidate on a plant under a setpoint-step scenario:
 *
 * 1. closed-loop poles from the characteristic polynomial (closedLoopPoles); if any pole is not
 *    strictly in the left half-plane (isStable, STABILITY_TOLERANCE), or the loop is ill-posed
 *    (1 + D_c·D_p = 0), the candidate is "unstable" and is not simulated; scores are null;
 * 2. otherwise simulateLoop, then each requested criterion from CRITERIA;
 * 3. a trace or score that is not finite (a verdict the Padé approximation of a dead time missed,
 *    or overflow) also makes the candidate "unstable" with null scores.
 *
 * So an unstable candidate is never scored, hence never ranked as good.
 * Throws a RangeError for a bad plant, controller, scenario or an unknown criterion id.
 */
export function evaluateCandidate<C extends CriterionId>(
  plant: Plant,
  controller: PidController,
  scenario: SetpointStepScenario,
  criteria: readonly C[],
): CandidateEvaluation<C> {
  for (const id of criteria) {
    if (!(CRITERION_IDS as readonly string[]).includes(id)) {
      throw new RangeError(`criteria: unknown criterion "${String(id)}"; known: ${CRITERION_IDS.join(", ")}`);
    }
  }
  const poles = closedLoopPoles(plant, controller);
  const tf = normalizeTransferFunction(plant);
  const plantFeedthrough = tf.num.length === tf.den.length ? tf.num[0] : 0;
  if (!isWellPosedLoop(pidStateSpace(controller).d, plantFeedthrough) || !isStable(poles)) {
    return { status: "unstable", poles, scores: null };
  }
  const trace = simulateLoop(plant, controller, scenario);
  if (!isFiniteTrace(trace)) return { status: "unstable", poles, scores: null };
  const scores = {} as Record<C, number>;
  for (const id of criteria) {
    const value = CRITERIA[id].compute(trace);
    if (!Number.isFinite(value)) return { status: "unstable", poles, scores: null };
    scores[id] = value;
  }
  return { status: "stable", poles, scores };
}

function isFiniteTrace(trace: LoopTrace): boolean {
  const { y, u } = trace;
  for (let k = 0; k < y.length; k++) {
    if (!Number.isFinite(y[k]) || !Number.isFinite(u[k])) return false;
  }
  return true;
}
