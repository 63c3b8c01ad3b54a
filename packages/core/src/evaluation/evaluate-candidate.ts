import type { Controller } from "../controllers/controller.js";
import { controllerRealization } from "../controllers/controller-realization.js";
import type { CriterionOptions } from "../criteria/criterion-definition.js";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import { CRITERIA } from "../criteria/registry.js";
import type { Complex } from "../linear-algebra/complex.js";
import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { exactQuadraticCosts, type ExactQuadraticCosts } from "../optimal/exact-quadratic-costs.js";
import { hasActuatorLimits } from "../plants/actuator-limits.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant, Plant } from "../plants/plant.js";
import { isHurwitz } from "../stability/is-hurwitz.js";
import { nyquistStability } from "../stability/nyquist-stability.js";
import { closedLoopPoles } from "../simulation/closed-loop-poles.js";
import { closedLoopSteadyState, continuousClosedLoop } from "../simulation/continuous-closed-loop.js";
import { FAST_CRITERIA, type FastCriterionId, scoreExactSetpointLoop } from "../simulation/exact-loop.js";
import { isWellPosedLoop } from "../simulation/ill-posed-loop-error.js";
import { divergenceBound } from "../simulation/loop-bound.js";
import { loopTransferFunction } from "../simulation/loop-transfer-function.js";
import type { Scenario } from "../simulation/scenario.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import { simulateLoop } from "../simulation/simulate-loop.js";

/** The verdict and scores of one candidate controller on one plant and scenario. */
export interface CandidateEvaluation<C extends CriterionId = CriterionId> {
  /** "unstable": the stability verdict failed; "diverged": the simulation left its bound. */
  status: "stable" | "unstable" | "diverged";
  /**
   * Closed-loop poles of linear loops (with a Padé-approximated dead time, see closedLoopPoles);
   * empty for nonlinear plants and when options.poles is false.
   */
  poles: Complex[];
  /** One value per requested criterion (NaN where a criterion does not apply); null unless "stable". */
  scores: Record<C, number> | null;
}

/** Options of evaluateCandidate. */
export interface EvaluateCandidateOptions {
  /** Compute the closed-loop poles for the result (default true; batch runs pass false for speed). */
  poles?: boolean;
  /** Options passed to every criterion (weights, settling band). */
  criterion?: CriterionOptions;
}

const scoreBuffer = new Float64Array(FAST_CRITERIA.length);

/**
 * Evaluates a candidate controller on a plant under a scenario:
 *
 * 1. linear plants: the stability verdict of the continuous loop (a sampled controller is judged by
 *    its continuous counterpart; actuator limits are ignored for the verdict, which is then the
 *    local one). Delay-free: Routh–Hurwitz on χ = den_L + num_L (isHurwitz); with dead time: the
 *    Nyquist verdict (nyquistStability). An ill-posed loop (1 + D_c·D_p = 0) is unstable.
 *    "unstable" candidates are not simulated; scores null;
 * 2. the simulation (simulateLoop); a trace that left the divergence bound gives "diverged" with
 *    null scores (nonlinear and saturated loops, or a sampled loop the continuous verdict missed);
 * 3. each requested criterion from CRITERIA with options.criterion. A criterion that does not apply
 *    returns NaN and stays NaN in the scores. Frequency criteria (ms, mt, margins, crossover,
 *    bandwidth, wsNorm) are computed from loopTransferFunction(plant, controller) — the continuous
 *    loop, dead time exact, actuator limits ignored, a sampled controller by its continuous
 *    counterpart — and are NaN for nonlinear plants (they do not apply).
 * 4. with options.criterion.horizon "infinite": ise, effort and quadratic come from
 *    exactQuadraticCosts (Lyapunov equation, t → ∞, no time grid) when the loop qualifies — linear,
 *    delay-free, no actuator limits, a continuous controller, a noise-free "setpoint-step" scenario
 *    without load (the step at t = 0) — and are NaN ("does not apply") otherwise. When every
 *    requested time criterion is among these three and the loop qualifies, nothing is simulated.
 * Fast path: a delay-free linear loop with a continuous controller, no limits, a setpoint step only
 * and time criteria among iae, ise, itae, effort (plus any frequency criteria) is scored inside the
 * recurrence without a trace (scoreExactSetpointLoop; same values to rounding).
 * Throws a RangeError for a bad plant, controller, scenario or an unknown criterion id.
 */
export function evaluateCandidate<C extends CriterionId>(
  plant: Plant,
  controller: Controller,
  scenario: Scenario,
  criteria: readonly C[],
  options: EvaluateCandidateOptions = {},
): CandidateEvaluation<C> {
  for (const id of criteria) {
    if (!(CRITERION_IDS as readonly string[]).includes(id)) {
      throw new RangeError(`criteria: unknown criterion "${String(id)}"; known: ${CRITERION_IDS.join(", ")}`);
    }
  }
  const wantPoles = options.poles !== false;
  let poles: Complex[] = [];
  if (plant.kind !== "nonlinear") {
    if (wantPoles) poles = closedLoopPoles(plant, controller);
    if (!isLoopStable(plant, controller)) return { status: "unstable", poles, scores: null };
    const fast = fastScores(plant, controller, scenario, criteria, options);
    if (fast === "diverged") return { status: "diverged", poles, scores: null };
    if (fast) return { status: "stable", poles, scores: addFrequencyScores(fast, plant, controller, criteria, options) };
  }
  const exact = options.criterion?.horizon === "infinite" ? infiniteHorizonCosts(plant, controller, scenario, options) : null;
  const scores = {} as Record<C, number>;
  if (exact?.ok && criteria.every((id) => INFINITE_HORIZON_CRITERIA.includes(id) || CRITERIA[id].kind === "frequency")) {
    // A qualifying loop is linear, stable and without limits: it cannot diverge, so no trace is needed.
    return { status: "stable", poles, scores: addFrequencyScores(addInfiniteHorizonScores(scores, exact, criteria), plant, controller, criteria, options) };
  }
  const trace = simulateLoop(plant, controller, scenario);
  if (trace.status === "diverged") return { status: "diverged", poles, scores: null };
  for (const id of criteria) scores[id] = CRITERIA[id].compute(trace, options.criterion);
  if (exact) addInfiniteHorizonScores(scores, exact, criteria);
  return { status: "stable", poles, scores: addFrequencyScores(scores, plant, controller, criteria, options) };
}

/** The criteria that options.criterion.horizon "infinite" takes from exactQuadraticCosts. */
const INFINITE_HORIZON_CRITERIA: readonly CriterionId[] = ["ise", "effort", "quadratic"];

/**
 * exactQuadraticCosts of the loop under the scenario's setpoint step with the options' q and r, or
 * `{ ok: false }` when the scenario is not a noise-free setpoint step without load at t = 0 (the
 * plant, controller and delay conditions are exactQuadraticCosts' own).
 */
function infiniteHorizonCosts(plant: Plant, controller: Controller, scenario: Scenario, options: EvaluateCandidateOptions): ExactQuadraticCosts {
  if (scenario.kind !== "setpoint-step" || (scenario.load !== undefined && scenario.load.size !== 0)) {
    return { ok: false, reason: "the infinite horizon applies to a setpoint step without load" };
  }
  const { q, r } = options.criterion ?? {};
  return exactQuadraticCosts(plant, controller, { kind: "setpoint-step", setpoint: scenario.setpoint, noise: scenario.noise }, { q, r });
}

/** Overwrites ise, effort and quadratic with the infinite-horizon values (NaN when they do not apply). */
function addInfiniteHorizonScores<C extends CriterionId>(scores: Record<C, number>, exact: ExactQuadraticCosts, criteria: readonly C[]): Record<C, number> {
  for (const id of criteria) {
    if (id === "ise") scores[id] = exact.ok ? exact.ise : NaN;
    else if (id === "effort") scores[id] = exact.ok ? exact.effort : NaN;
    else if (id === "quadratic") scores[id] = exact.ok ? exact.quadratic : NaN;
  }
  return scores;
}

/**
 * Fills the frequency criteria (kind "frequency") from the loop transfer function of a linear
 * loop — one L(s) object for all of them, so they share one frequency grid — and NaN ("does not
 * apply") for a nonlinear plant. Called only for loops judged stable.
 */
function addFrequencyScores<C extends CriterionId>(
  scores: Record<C, number>,
  plant: Plant,
  controller: Controller,
  criteria: readonly C[],
  options: EvaluateCandidateOptions,
): Record<C, number> {
  let loop: LoopTransferFunction | null = null;
  for (const id of criteria) {
    const definition = CRITERIA[id];
    if (definition.kind !== "frequency" || definition.computeLoop === undefined) continue;
    if (plant.kind === "nonlinear") {
      scores[id] = NaN;
      continue;
    }
    loop ??= loopTransferFunction(plant, controller);
    scores[id] = definition.computeLoop(loop, options.criterion);
  }
  return scores;
}

/**
 * Stability verdict of the continuous linear loop (see evaluateCandidate, step 1).
 * References: Routh 1877 / Ogata 2010 §5-6 (isHurwitz); Nyquist 1932 (nyquistStability).
 */
export function isLoopStable(plant: LinearPlant, controller: Controller): boolean {
  const loop = loopTransferFunction(plant, controller);
  if (controller.kind !== "state-feedback") {
    const model = linearPlantModel(plant);
    const plantFeedthrough = model.num.length === model.den.length ? model.num[0] : 0;
    if (!isWellPosedLoop(-controllerRealization(controller).dy, plantFeedthrough)) return false;
  }
  if (loop.delay > 0) return nyquistStability(loop).stable;
  return isHurwitz(polynomialAdd(loop.den, loop.num));
}

function fastScores<C extends CriterionId>(
  plant: LinearPlant,
  controller: Controller,
  scenario: Scenario,
  criteria: readonly C[],
  options: EvaluateCandidateOptions,
): Record<C, number> | "diverged" | null {
  if (scenario.kind !== "setpoint-step" || scenario.load !== undefined || (scenario.noise !== undefined && scenario.noise.sd !== 0)) return null;
  if (controller.sampleTime !== undefined || hasActuatorLimits(plant.actuator) || options.criterion !== undefined) return null;
  for (const id of criteria) if (!(FAST_CRITERIA as readonly string[]).includes(id) && CRITERIA[id].kind !== "frequency") return null;
  const model = linearPlantModel(plant);
  if (model.delay !== 0) return null;
  const { horizon, dt } = scenario;
  if (!(horizon > 0) || !(dt > 0) || !Number.isFinite(horizon) || !Number.isFinite(dt) || dt > horizon) return null; // let simulateLoop name the error
  const setpoint = scenario.setpoint ?? 1;
  if (!Number.isFinite(setpoint)) return null;
  const loop = continuousClosedLoop(model.ss, controllerRealization(controller, model.ss.n));
  const steady = closedLoopSteadyState(loop, [setpoint, 0, 0]);
  const samples = Math.round(horizon / dt) + 1;
  if (samples - 1 > 200_000) return null;
  if (!scoreExactSetpointLoop(loop, dt, samples, setpoint, steady.u, divergenceBound([setpoint]), scoreBuffer)) return "diverged";
  const scores = {} as Record<C, number>;
  for (const id of criteria) {
    const index = FAST_CRITERIA.indexOf(id as FastCriterionId);
    if (index < 0) continue; // a frequency criterion, filled by addFrequencyScores
    scores[id] = id === "effort" && !Number.isFinite(steady.u) ? NaN : scoreBuffer[index];
  }
  return scores;
}
