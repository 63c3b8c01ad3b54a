import type { Controller } from "../controllers/controller.js";
import { type ControllerRealization, controllerRealization } from "../controllers/controller-realization.js";
import { hasActuatorLimits } from "../plants/actuator-limits.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import { linearizeNonlinearPlant, nonlinearPlantModel } from "../plants/nonlinear-plant-model.js";
import type { NonlinearPlant } from "../plants/nonlinear.js";
import type { Plant } from "../plants/plant.js";
import { closedLoopSteadyState, continuousClosedLoop } from "./continuous-closed-loop.js";
import { runExactLoop } from "./exact-loop.js";
import { runGridLoop } from "./grid-loop.js";
import { isWellPosedLoop } from "./ill-posed-loop-error.js";
import { runJointLoop } from "./joint-loop.js";
import { jointSubsteps, MAX_SUBSTEPS } from "./joint-substeps.js";
import { divergenceBound } from "./loop-bound.js";
import type { LoopTrace } from "./loop-trace.js";
import { resolveScenario } from "./resolve-scenario.js";
import type { Scenario } from "./scenario.js";

/** Default anti-windup (Åström & Hägglund 2006, §3.5): back-calculation with the default tracking time. */
const DEFAULT_ANTI_WINDUP = { kind: "back-calculation" } as const;

/**
 * Simulates the unity-feedback loop of a plant and a controller under a scenario, on the grid
 * t_k = k·dt, k = 0…round(horizon/dt). The loop: e = r − y, u from the controller (which sees the
 * setpoint r and the measured output y + n), the actuator limits, then the plant input u + d
 * (d the load step), delayed by the plant's dead time. Every sample at k = 0 is the right limit
 * t → 0⁺: a setpoint step at t = 0 has happened, so u[0] carries the controller's feedthrough
 * (the proportional and filtered-derivative kick).
 *
 * Three methods (see their doc comments):
 * - the exact closed loop (runExactLoop) for a delay-free linear plant, a continuous controller and
 *   no actuator limits: exact at the grid points;
 * - the joint loop (runJointLoop) for a continuous controller with dead time, actuator limits, a
 *   nonlinear plant or noisy state feedback: plant and controller as one system, classical RK4 with
 *   the controller at every stage, dead time read from a cubic Hermite history, switching instants
 *   located — error O(dt⁴);
 * - the grid loop (runGridLoop) for a sampled controller (zero-order hold, exact there), and for a
 *   continuous one whose loop is too stiff at this dt for the joint loop (jointSubsteps > MAX_SUBSTEPS:
 *   a filter or loop pole faster than about 8/dt, or θ < dt/8) — first order in dt there.
 *
 * Linear plants start from rest (x = 0, y0 = 0). Nonlinear plants start at their operating point
 * (initial, operatingInput), y0 = output there; the setpoint steps from y0 to y0 + Δr and the
 * controller acts on deviations (u = u_op + controller output), so the start is bumpless.
 * u∞, y∞: linear loops from the closed loop's steady state (final-value theorem; if u∞ lies outside
 * the actuator's [min, max] the final samples are used); nonlinear loops: the final samples.
 * A loop that leaves the divergence bound (divergenceBound) gets status "diverged" and NaN samples
 * from there on; never an exception. Bad arguments throw a RangeError naming the field;
 * IllPosedLoopError when 1 + D_c·D_p = 0.
 */
export function simulateLoop(plant: Plant, controller: Controller, scenario: Scenario): LoopTrace {
  const sc = resolveScenario(scenario);
  const samples = sc.t.length;
  const trace: LoopTrace = {
    t: sc.t,
    r: new Float64Array(samples),
    y: new Float64Array(samples),
    u: new Float64Array(samples),
    e: new Float64Array(samples),
    uInfinity: NaN,
    y0: 0,
    stepSize: sc.setpoint,
    yInfinity: NaN,
    status: "ok",
  };
  if (sc.load) trace.load = { size: sc.load.size, time: sc.load.time };
  const loadSize = sc.load ? sc.load.size : 0;
  const antiWindup = controller.antiWindup ?? DEFAULT_ANTI_WINDUP;
  const limits = plant.actuator;
  const limited = hasActuatorLimits(limits);
  const sampled = controller.sampleTime !== undefined;
  let ok: boolean;
  if (plant.kind === "nonlinear") {
    const model = nonlinearPlantModel(plant);
    const realization = controllerRealization(controller, model.system.stateCount);
    trace.y0 = model.y0;
    const bound = divergenceBound(model.initial, [model.y0, model.operatingInput, sc.setpoint, loadSize]);
    const gridPlant = { kind: "nonlinear", model } as const;
    const substeps = sampled ? Infinity : jointSubsteps(nonlinearLoopJacobian(plant, realization), model.system.stateCount + realization.n, sc.dt, 0);
    if (substeps <= MAX_SUBSTEPS) ok = runJointLoop({ plant: gridPlant, controller: realization, antiWindup, limits, delay: 0, substeps }, sc, trace, bound);
    else ok = runGridLoop({ plant: gridPlant, controller: realization, sampleTime: controller.sampleTime, antiWindup, limits, delay: 0 }, sc, trace, bound);
    trace.uInfinity = trace.u[samples - 1];
    trace.yInfinity = trace.y[samples - 1];
  } else {
    const model = linearPlantModel(plant);
    const realization = controllerRealization(controller, model.ss.n);
    const loop = continuousClosedLoop(model.ss, realization);
    const bound = divergenceBound([sc.setpoint, loadSize]);
    const noisyStateFeedback = realization.kx !== null && sc.noise !== null;
    const gridPlant = { kind: "linear", ss: model.ss } as const;
    if (model.delay === 0 && !limited && !sampled && !noisyStateFeedback) ok = runExactLoop(loop, sc, trace, bound);
    else {
      const jacobian = model.delay === 0 ? loop.a : blockDiagonal(model.ss.a, model.ss.n, realization.a, realization.n);
      const substeps = sampled ? Infinity : jointSubsteps(jacobian, loop.nz, sc.dt, model.delay);
      if (substeps <= MAX_SUBSTEPS) ok = runJointLoop({ plant: gridPlant, controller: realization, antiWindup, limits, delay: model.delay, substeps }, sc, trace, bound);
      else ok = runGridLoop({ plant: gridPlant, controller: realization, sampleTime: controller.sampleTime, antiWindup, limits, delay: model.delay }, sc, trace, bound);
    }
    const steady = closedLoopSteadyState(loop, [sc.setpoint, loadSize, 0]);
    const outside = limited && ((limits!.min !== undefined && steady.u < limits!.min) || (limits!.max !== undefined && steady.u > limits!.max));
    trace.uInfinity = outside ? trace.u[samples - 1] : steady.u;
    trace.yInfinity = outside ? trace.y[samples - 1] : steady.y;
  }
  if (!ok) {
    trace.status = "diverged";
    trace.uInfinity = NaN;
    trace.yInfinity = NaN;
  }
  return trace;
}

/**
 * Jacobian of the joint state for the stiffness estimate of a nonlinear loop: the closed loop of
 * the plant's linearisation at its operating point (linearizeNonlinearPlant) and the controller;
 * plant and controller side by side when that loop is ill-posed.
 */
function nonlinearLoopJacobian(plant: NonlinearPlant, realization: ControllerRealization): Float64Array {
  const linear = linearizeNonlinearPlant(plant);
  if (!isWellPosedLoop(-realization.dy, linear.d)) return blockDiagonal(linear.a, linear.n, realization.a, realization.n);
  return continuousClosedLoop(linear, realization).a;
}

/** The block-diagonal matrix diag(A, B) of an n×n and an m×m matrix, row-major. */
function blockDiagonal(a: Float64Array, n: number, b: Float64Array, m: number): Float64Array {
  const size = n + m;
  const out = new Float64Array(size * size);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * size + j] = a[i * n + j];
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) out[(n + i) * size + n + j] = b[i * m + j];
  return out;
}
