import { Matrix } from "ml-matrix";
import type { ControllerRealization } from "../controllers/controller-realization.js";
import type { Complex } from "../linear-algebra/complex.js";
import { matrixEigenvalues } from "../optimal/matrix-eigenvalues.js";
import { linearizeNonlinearPlant, nonlinearPlantModel } from "../plants/nonlinear-plant-model.js";
import type { NonlinearPlant } from "../plants/nonlinear.js";
import { continuousClosedLoop } from "../simulation/continuous-closed-loop.js";
import { isWellPosedLoop } from "../simulation/ill-posed-loop-error.js";
import { sampledLoopStability } from "./sampled-loop-stability.js";

/** Relative margin beyond which a pole of the linearised loop counts as clearly unstable (Re s > tol·max(1, |s|), or |z| > 1 + tol). */
export const LOCAL_INSTABILITY_TOLERANCE = 1e-9;
/** |f(x₀, u₀)| below EQUILIBRIUM_TOLERANCE·scale makes the operating point an equilibrium (scale from the Jacobian and the state). */
export const EQUILIBRIUM_TOLERANCE = 1e-9;

/**
 * The local verdict of a nonlinear plant's loop, from its linearisation at the operating point:
 * - "unstable": the linearised closed loop has a pole clearly in the right half-plane (a continuous
 *   controller: eigenvalues of A_cl of continuousClosedLoop; a sampled one: outside the unit circle,
 *   sampledLoopStability at its sample time). By Lyapunov's indirect method the closed loop's
 *   equilibrium is then unstable (Khalil, Nonlinear Systems, 3rd ed., 2002, Theorem 4.7).
 * - "stable": every pole clearly inside — the equilibrium is locally asymptotically stable (same
 *   theorem); a large setpoint step can still leave its basin, which the simulation's divergence
 *   detection catches.
 * - "inconclusive": a pole on the boundary (the theorem says nothing), or the operating point
 *   (initial, operatingInput) is not an equilibrium of the plant (|f(x₀, u₀)| not ≈ 0: the loop
 *   starts away from any rest point, so a linearisation there describes no equilibrium), or the loop
 *   is too large to judge; the simulation decides.
 *
 * The linearisation is linearizeNonlinearPlant's (central differences at (initial, operatingInput));
 * at the start the controller sees r = y0, so with the plant at rest there the closed loop rests too
 * and its Jacobian is the linearised plant closed by the controller realisation. Actuator limits are
 * ignored (a local verdict). `poles`: s-plane poles (continuous controller) or z-plane poles (sampled).
 */
export function linearizedLoopStability(
  plant: NonlinearPlant,
  controller: ControllerRealization,
  sampleTime: number | undefined,
): { verdict: "stable" | "unstable" | "inconclusive"; poles: Complex[]; plane: "s" | "z" } {
  if (!isEquilibrium(plant)) return { verdict: "inconclusive", poles: [], plane: sampleTime === undefined ? "s" : "z" };
  const linear = linearizeNonlinearPlant(plant);
  if (sampleTime !== undefined) {
    const result = sampledLoopStability({ plant: linear, delay: 0, controller, sampleTime });
    if (result.stable === null) return { verdict: "inconclusive", poles: [], plane: "z" };
    const radius = (z: Complex) => Math.hypot(z.re, z.im);
    const verdict = result.poles.some((z) => radius(z) > 1 + LOCAL_INSTABILITY_TOLERANCE)
      ? "unstable"
      : result.poles.every((z) => radius(z) < 1 - LOCAL_INSTABILITY_TOLERANCE)
        ? "stable"
        : "inconclusive";
    return { verdict, poles: result.poles, plane: "z" };
  }
  if (controller.kx === null && !isWellPosedLoop(-controller.dy, linear.d)) return { verdict: "inconclusive", poles: [], plane: "s" };
  const loop = continuousClosedLoop(linear, controller);
  const poles = loop.nz === 0 ? [] : matrixEigenvalues(Matrix.from1DArray(loop.nz, loop.nz, loop.a));
  const margin = (s: Complex) => LOCAL_INSTABILITY_TOLERANCE * Math.max(1, Math.hypot(s.re, s.im));
  const verdict = poles.some((s) => s.re > margin(s)) ? "unstable" : poles.every((s) => s.re < -margin(s)) ? "stable" : "inconclusive";
  return { verdict, poles, plane: "s" };
}

/**
 * True when the operating point is a rest point of the plant: every |f_i(x₀, u₀)| ≤
 * EQUILIBRIUM_TOLERANCE·max(1, max_j |x₀_j|, |u₀|) (the compiled derivatives at t = 0).
 */
export function isEquilibrium(plant: NonlinearPlant): boolean {
  const { system, parameters, initial, operatingInput } = nonlinearPlantModel(plant);
  const f = new Float64Array(system.stateCount);
  system.derivatives(0, initial, parameters, operatingInput, f);
  let scale = Math.max(1, Math.abs(operatingInput));
  for (const v of initial) scale = Math.max(scale, Math.abs(v));
  return f.every((v) => Math.abs(v) <= EQUILIBRIUM_TOLERANCE * scale);
}
