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
import { linearizedLoopStability } from "../stability/linearized-loop-stability.js";
import { nyquistStability } from "../stability/nyquist-stability.js";
import { sampledLoopStability } from "../stability/sampled-loop-stability.js";
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
   * Closed-loop poles in the s-plane: of linear loops with the controller taken as continuous (with a
   * Padé-approximated dead time, see closedLoopPoles); of a nonlinear plant's loop linearised at the
   * operating point (continuous controller, operating point at rest); empty otherwise and when
   * options.poles is false.
   */
  poles: Complex[];
  /**
   * z-plane poles of a sampled controller's discrete closed loop (sampledLoopStability; the plant
   * linearised for a nonlinear one), whose verdict is the one applied; absent for continuous
   * controllers, when options.poles is false, or when the loop was judged by its polynomial.
   */
  samplePoles?: Complex[];
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
 * 1. the stability verdict (loopVerdict), actuator limits ignored (the verdict is then the local one):
 *    - a linear plant and a continuous controller: delay-free, Routh–Hurwitz on χ = den_L + num_L
 *      (isHurwitz); with dead time, the Nyquist verdict (nyquistStability); an ill-posed loop
 *      (1 + D_c·D_p = 0) is unstable;
 *    - a sampled controller: the discrete-time closed loop at its sample time, the plant discretised
 *      by ZOH with its dead time (whole samples plus the fractional part), the controller as the
 *      simulation updates it (sampledLoopStability): poles inside the unit circle;
 *    - a nonlinear plant: the loop linearised at the operating point (linearizedLoopStability); a
 *      pole clearly outside the stable region makes it "unstable"; an inconclusive verdict (a pole on
 *      the boundary, an operating point that is not at rest) leaves it to the simulation.
 *    "unstable" candidates are not simulated; scores null;
 * 2. the simulation (simulateLoop); a trace that left the divergence bound gives "diverged" with
 *    null scores (nonlinear and saturated loops, or loops the verdict could not judge);
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
 * Per-candidate work is done once: the controller's realisation (controllerRealization, one per
 * controller object) and the loop transfer function (loopTransferFunction, one per controller and
 * plant) are built on first use and shared by the poles, the verdict, the simulation, the exact costs
 * and every frequency criterion, on every variant of a family.
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
  let samplePoles: Complex[] | undefined;
  const verdict = loopVerdict(plant, controller);
  if (wantPoles) {
    if (plant.kind !== "nonlinear") poles = closedLoopPoles(plant, controller);
    else if (verdict.plane === "s") poles = verdict.poles;
    if (verdict.plane === "z" && verdict.poles.length > 0) samplePoles = verdict.poles;
  }
  const result = (status: CandidateEvaluation["status"], scores: Record<C, number> | null): CandidateEvaluation<C> =>
    samplePoles ? { status, poles, samplePoles, scores } : { status, poles, scores };
  if (verdict.verdict === "unstable") return result("unstable", null);
  if (plant.kind !== "nonlinear") {
    const fast = fastScores(plant, controller, scenario, criteria, options);
    if (fast === "diverged") return result("diverged", null);
    if (fast) return result("stable", addFrequencyScores(fast, plant, controller, criteria, options));
  }
  const exact = options.criterion?.horizon === "infinite" ? infiniteHorizonCosts(plant, controller, scenario, options) : null;
  const scores = {} as Record<C, number>;
  if (exact?.ok && criteria.every((id) => INFINITE_HORIZON_CRITERIA.includes(id) || CRITERIA[id].kind === "frequency")) {
    // A qualifying loop is linear, stable and without limits: it cannot diverge, so no trace is needed.
    return result("stable", addFrequencyScores(addInfiniteHorizonScores(scores, exact, criteria), plant, controller, criteria, options));
  }
  const trace = simulateLoop(plant, controller, scenario);
  if (trace.status === "diverged") return result("diverged", null);
  for (const id of criteria) scores[id] = CRITERIA[id].compute(trace, options.criterion);
  if (exact) addInfiniteHorizonScores(scores, exact, criteria);
  return result("stable", addFrequencyScores(scores, plant, controller, criteria, options));
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

/** A loop's stability verdict (see evaluateCandidate, step 1) with the poles it was judged on. */
export interface LoopVerdict {
  /** "undecided": the verdict cannot judge this loop (see evaluateCandidate); the simulation decides. */
  verdict: "stable" | "unstable" | "undecided";
  /** The poles behind the verdict in `plane` (empty when it was judged otherwise, e.g. by Nyquist). */
  poles: Complex[];
  plane: "s" | "z";
}

/**
 * The stability verdict of a candidate's loop (evaluateCandidate, step 1): continuous linear loops by
 * Routh–Hurwitz or Nyquist, sampled controllers by their discrete closed loop, nonlinear plants by
 * the linearisation at the operating point.
 * References: Routh 1877 / Ogata 2010 §5-6 (isHurwitz); Nyquist 1932 (nyquistStability); Jury 1964 /
 * Åström & Wittenmark 1997 §3.2 (sampledLoopStability); Khalil 2002 Thm 4.7 (linearizedLoopStability).
 */
export function loopVerdict(plant: Plant, controller: Controller): LoopVerdict {
  if (plant.kind === "nonlinear") {
    const realization = controllerRealization(controller, plant.states.length);
    const local = linearizedLoopStability(plant, realization, controller.sampleTime);
    return { verdict: local.verdict === "inconclusive" ? "undecided" : local.verdict, poles: local.poles, plane: local.plane };
  }
  const model = linearPlantModel(plant);
  const realization = controllerRealization(controller, model.ss.n);
  if (controller.sampleTime !== undefined) {
    const sampled = sampledLoopStability({ plant: model.ss, delay: model.delay, controller: realization, sampleTime: controller.sampleTime });
    const verdict = sampled.stable === null ? "undecided" : sampled.stable ? "stable" : "unstable";
    return { verdict, poles: sampled.poles, plane: "z" };
  }
  return { verdict: isContinuousLoopStable(plant, controller) ? "stable" : "unstable", poles: [], plane: "s" };
}

/**
 * True when loopVerdict calls the loop of a linear plant stable (a continuous controller: the
 * continuous loop; a sampled one: its discrete loop, false when too large to judge).
 */
export function isLoopStable(plant: LinearPlant, controller: Controller): boolean {
  return loopVerdict(plant, controller).verdict === "stable";
}

/**
 * Stability verdict of the continuous linear loop (a sampled controller taken as continuous).
 * References: Routh 1877 / Ogata 2010 §5-6 (isHurwitz); Nyquist 1932 (nyquistStability).
 */
export function isContinuousLoopStable(plant: LinearPlant, controller: Controller): boolean {
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
