import { Matrix } from "ml-matrix";
import type { Controller } from "../controllers/controller.js";
import { controllerRealization } from "../controllers/controller-realization.js";
import { QUADRATIC_DEFAULT_Q, QUADRATIC_DEFAULT_R, type QuadraticWeights } from "../criteria/quadratic.js";
import { solveLinear } from "../linear-algebra/solve-linear.js";
import { hasActuatorLimits } from "../plants/actuator-limits.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { Plant } from "../plants/plant.js";
import { continuousClosedLoop, LOOP_INPUTS } from "../simulation/continuous-closed-loop.js";
import { isWellPosedLoop } from "../simulation/ill-posed-loop-error.js";
import type { Scenario } from "../simulation/scenario.js";
import { symmetrize } from "./matrix-argument.js";
import { isHurwitzMatrix } from "./matrix-eigenvalues.js";
import { lyapunovMatrix } from "./solve-lyapunov.js";

/** |e∞| ≤ OFFSET_TOLERANCE·max(1, |Δr|, |d|) counts as no steady-state error (integral action up to rounding). */
export const OFFSET_TOLERANCE = 1e-9;

/** The parts of a scenario the exact costs read (horizon and dt are not used: the horizon is infinite). */
export type ExactCostScenario = Pick<Scenario, "kind" | "setpoint" | "load" | "noise">;

/** Exact infinite-horizon costs of a stable linear loop, or why they cannot be computed. */
export type ExactQuadraticCosts =
  | {
      ok: true;
      /** ∫₀^∞ e² dt [y²·s]; Infinity when the loop keeps a steady-state error. */
      ise: number;
      /** ∫₀^∞ (u − u∞)² dt [u²·s]. */
      effort: number;
      /** q·ISE + r·Effort (Infinity when q > 0 and ISE is). */
      quadratic: number;
      uInfinity: number;
      yInfinity: number;
    }
  | { ok: false; reason: string };

/**
 * ISE, effort and the weighted quadratic cost J = ∫(q·e² + r·(u − u∞)²)dt of a stable linear loop
 * over an infinite horizon, from one Lyapunov equation — no time grid.
 *
 * The loop is the ContinuousClosedLoop z' = A z + B w, u = U_z z + U_w w, y = Y_z z + Y_w w of
 * simulateLoop, z = [x; x_c] from rest (z(0) = 0), with constant inputs w = [Δr, d, 0] switched on
 * at t = 0. In deviation coordinates z̃ = z − z∞, z∞ = −A⁻¹B w:
 *
 *   z̃' = A z̃,   z̃(0) = −z∞,   u − u∞ = U_z z̃,   e − e∞ = −Y_z z̃,
 *
 * with u∞ = U_z z∞ + U_w w, y∞ = Y_z z∞ + Y_w w, e∞ = Δr − y∞. The state is continuous at t = 0
 * (B w is finite), so the jump of u at t = 0⁺ — the controller's feedthrough, the proportional and
 * filtered-derivative kick U_w w — is part of the trajectory: u(0⁺) − u∞ = U_z z̃(0) = −U_z z∞,
 * and likewise y(0⁺) on a plant with feedthrough. With the Gramian X of the initial deviation,
 *
 *   A X + X Aᵀ + z̃(0) z̃(0)ᵀ = 0   (X = ∫₀^∞ z̃ z̃ᵀ dt),
 *   ISE = Y_z X Y_zᵀ,   Effort = U_z X U_zᵀ,
 *
 * (solveLyapunov's method on Aᵀ; ISE is Infinity when |e∞| > OFFSET_TOLERANCE·scale, i.e. a loop
 * without integral action on a plant without an integrator).
 * Not for: nonlinear plants, dead time, actuator limits, sampled controllers, measurement noise,
 * a load step after t = 0, or an A that is not Hurwitz (all eigenvalues, so a hidden unstable
 * cancellation is caught) — these return `{ ok: false, reason }`.
 * weights: q, r ≥ 0 (default 1 each, as the quadratic criterion). Throws a RangeError naming the
 * bad field of the plant, controller or weights.
 *
 * References: the Lyapunov form of quadratic integrals, H. Kwakernaak and R. Sivan, Linear Optimal
 * Control Systems, Wiley, 1972, §1.11; integral-square-error evaluation, G. C. Newton, L. A. Gould
 * and J. F. Kaiser, Analytical Design of Linear Feedback Controls, Wiley, 1957, App. E.
 */
export function exactQuadraticCosts(
  plant: Plant,
  controller: Controller,
  scenario: ExactCostScenario,
  weights: QuadraticWeights = {},
): ExactQuadraticCosts {
  const q = weight("q", weights.q, QUADRATIC_DEFAULT_Q);
  const r = weight("r", weights.r, QUADRATIC_DEFAULT_R);
  if (plant.kind === "nonlinear") return { ok: false, reason: "exact costs need a linear plant; a nonlinear plant is simulated" };
  if (hasActuatorLimits(plant.actuator)) return { ok: false, reason: "exact costs need a loop without actuator limits" };
  if (controller.sampleTime !== undefined) return { ok: false, reason: "exact costs need a continuous controller; this one is sampled" };
  if (scenario.noise !== undefined && scenario.noise.sd !== 0) return { ok: false, reason: "exact costs need a noise-free scenario" };
  const setpoint = scenario.setpoint ?? (scenario.kind === "load-step" ? 0 : 1);
  const load = scenario.load ?? (scenario.kind === "setpoint-step" ? undefined : { size: 1, time: 0 });
  if (!Number.isFinite(setpoint)) throw new RangeError(`scenario.setpoint must be a finite number, got ${String(setpoint)}`);
  if (load !== undefined && load.size !== 0 && (load.time ?? 0) !== 0) return { ok: false, reason: "exact costs need the load step at t = 0" };
  const d = load?.size ?? 0;
  if (!Number.isFinite(d)) throw new RangeError(`scenario.load.size must be a finite number, got ${String(d)}`);
  const model = linearPlantModel(plant);
  if (model.delay !== 0) return { ok: false, reason: "exact costs need a delay-free plant; with dead time the loop is simulated" };
  const realization = controllerRealization(controller, model.ss.n);
  if (!isWellPosedLoop(-realization.dy, model.ss.d)) return { ok: false, reason: "the loop is ill-posed (1 + D_c·D_p = 0)" };
  const loop = continuousClosedLoop(model.ss, realization);
  const { nz, uz, uw, yz, yw } = loop;
  const w = [setpoint, d, 0];
  const a = Matrix.from1DArray(nz, nz, loop.a);
  if (nz > 0 && !isHurwitzMatrix(a)) return { ok: false, reason: "the closed loop is not stable (an eigenvalue of the closed-loop matrix has Re λ ≥ 0)" };
  // z∞ = −A⁻¹ B w.
  const rhs = new Float64Array(nz);
  for (let i = 0; i < nz; i++) for (let j = 0; j < LOOP_INPUTS; j++) rhs[i] -= loop.b[i * LOOP_INPUTS + j] * w[j];
  const zInf = nz > 0 ? solveLinear(loop.a, rhs, nz) : new Float64Array(0);
  if (!zInf) return { ok: false, reason: "the closed loop has no steady state (a pole at s = 0)" };
  let uInfinity = 0;
  let yInfinity = 0;
  for (let j = 0; j < LOOP_INPUTS; j++) {
    uInfinity += uw[j] * w[j];
    yInfinity += yw[j] * w[j];
  }
  for (let j = 0; j < nz; j++) {
    uInfinity += uz[j] * zInf[j];
    yInfinity += yz[j] * zInf[j];
  }
  let ise = 0;
  let effort = 0;
  if (nz > 0) {
    // Gramian of the initial deviation: A X + X Aᵀ + z̃₀z̃₀ᵀ = 0 is the Lyapunov equation of Aᵀ.
    const z0 = Matrix.columnVector(Array.from(zInf, (v) => -v));
    const gram = lyapunovMatrix(a.transpose(), symmetrize(z0.mmul(z0.transpose())));
    if (!gram) return { ok: false, reason: "the Lyapunov equation of the closed loop is singular" };
    const yRow = Matrix.rowVector(Array.from(yz));
    const uRow = Matrix.rowVector(Array.from(uz));
    ise = Math.max(0, yRow.mmul(gram).mmul(yRow.transpose()).get(0, 0));
    effort = Math.max(0, uRow.mmul(gram).mmul(uRow.transpose()).get(0, 0));
  }
  const offset = setpoint - yInfinity;
  if (Math.abs(offset) > OFFSET_TOLERANCE * Math.max(1, Math.abs(setpoint), Math.abs(d))) ise = Infinity;
  const quadratic = (q > 0 ? q * ise : 0) + r * effort;
  return { ok: true, ise, effort, quadratic, uInfinity, yInfinity };
}

function weight(name: string, value: number | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a finite number ≥ 0, got ${String(value)}`);
  return value;
}
