import { Matrix, solve } from "ml-matrix";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant } from "../plants/plant.js";
import type { ExactCostScenario } from "./exact-quadratic-costs.js";

/**
 * The LQ problem a setpoint step poses for a linear plant (see lqrBound): in the deviations
 * x̃ = x − x∞, ũ = u − u∞ from the new steady state,
 *
 *   x̃' = A x̃ + B ũ,   x̃(0) = −x∞,   e = −(C x̃ + D ũ),
 *
 * so q·e² + r·ũ² = x̃ᵀ(q CᵀC)x̃ + 2 x̃ᵀ(q CᵀD)ũ + (r + q D²)ũ². The cross term is removed by
 * ũ = v − R̄⁻¹N̄ᵀx̃ (Anderson & Moore 1990, §3.4, "cross-product terms"):
 *
 *   Ā = A − B R̄⁻¹ N̄ᵀ,   Q̄ = q CᵀC − N̄ R̄⁻¹ N̄ᵀ = (q·r/(r + q D²)) CᵀC,   R̄ = r + q D²,
 *
 * and the LQR gain in ũ = −K x̃ is K = R̄⁻¹(BᵀP + N̄ᵀ). The steady state solves
 * [A B; C D][x∞; u∞ + d] = [0; Δr] (d: a load step at t = 0 at the plant input), which is regular
 * exactly when the plant has no zero at s = 0 — it covers integrating plants (A singular) without
 * a special case. x, A, B, C, D: the plant's realisation (linearPlantModel: the controllable
 * canonical form of a transfer function, a state-space plant as given), without its dead time.
 */
export interface SetpointDeviationProblem {
  a: Matrix;
  b: Matrix;
  c: Matrix;
  d: number;
  /** Ā, Q̄, R̄ of the cross-term-free problem. */
  aBar: Matrix;
  qBar: Matrix;
  rBar: number;
  /** N̄ = q CᵀD (n×1). */
  nBar: Matrix;
  /** x̃(0) = −x∞ (n×1). */
  x0: Matrix;
  xInfinity: number[];
  uInfinity: number;
  setpoint: number;
  delay: number;
}

export function setpointDeviationProblem(plant: LinearPlant, scenario: ExactCostScenario, q: number, r: number): SetpointDeviationProblem | { ok: false; reason: string } {
  const setpoint = scenario.setpoint ?? (scenario.kind === "load-step" ? 0 : 1);
  if (typeof setpoint !== "number" || !Number.isFinite(setpoint)) throw new RangeError(`scenario.setpoint must be a finite number, got ${String(setpoint)}`);
  const load = scenario.load ?? (scenario.kind === "setpoint-step" ? undefined : { size: 1, time: 0 });
  const loadSize = load?.size ?? 0;
  if (!Number.isFinite(loadSize)) throw new RangeError(`scenario.load.size must be a finite number, got ${String(loadSize)}`);
  if (loadSize !== 0 && (load?.time ?? 0) !== 0) return { ok: false, reason: "the bound is posed for a load step at t = 0 only" };
  const model = linearPlantModel(plant);
  const { ss } = model;
  const n = ss.n;
  if (n === 0) return { ok: false, reason: "the plant is a static gain; it has no state to optimise" };
  const a = Matrix.from1DArray(n, n, ss.a);
  const b = Matrix.columnVector(Array.from(ss.b));
  const c = Matrix.rowVector(Array.from(ss.c));
  const d = ss.d;
  const square = new Matrix(n + 1, n + 1);
  square.setSubMatrix(a, 0, 0);
  square.setSubMatrix(b, 0, n);
  square.setSubMatrix(c, n, 0);
  square.set(n, n, d);
  const rhs = Matrix.zeros(n + 1, 1);
  rhs.set(n, 0, setpoint);
  let steady: Matrix;
  try {
    steady = solve(square, rhs);
  } catch {
    return { ok: false, reason: "the plant has a zero at s = 0, so no constant input holds the output at the new setpoint" };
  }
  const values = steady.to1DArray();
  const scale = square.norm() * Math.max(1, Math.abs(setpoint));
  const back = square.mmul(steady).sub(rhs).norm();
  if (!values.every(Number.isFinite) || back > 1e-9 * Math.max(scale, 1e-300)) {
    return { ok: false, reason: "the plant has a zero at s = 0, so no constant input holds the output at the new setpoint" };
  }
  const xInfinity = values.slice(0, n);
  const uInfinity = values[n] - loadSize;
  const rBar = r + q * d * d;
  const nBar = Matrix.mul(c.transpose(), q * d);
  const aBar = Matrix.sub(a, Matrix.mul(b.mmul(nBar.transpose()), 1 / rBar));
  const qBar = Matrix.mul(c.transpose().mmul(c), (q * r) / rBar);
  const x0 = Matrix.columnVector(xInfinity.map((v) => -v));
  return { a, b, c, d, aBar, qBar, rBar, nBar, x0, xInfinity, uInfinity, setpoint, delay: model.delay };
}
