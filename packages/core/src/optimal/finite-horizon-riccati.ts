import { Matrix, solve } from "ml-matrix";
import { expm } from "../linear-algebra/expm.js";
import { symmetrize } from "./matrix-argument.js";
import { lyapunovMatrix } from "./solve-lyapunov.js";

/**
 * P(T) of the Riccati differential equation in the time to go τ, started from P(0) = 0,
 *
 *   dP/dτ = AᵀP + PA − PGP + Q,   G = BR⁻¹Bᵀ,
 *
 * in closed form from the stabilising CARE solution P∞ (AᵀP∞ + P∞A − P∞GP∞ + Q = 0) and its closed
 * loop A_cl = A − GP∞ (Hurwitz). The gap Δ = P∞ − P(τ) obeys dΔ/dτ = A_clᵀΔ + ΔA_cl + ΔGΔ with
 * Δ(0) = P∞ (subtract the CARE from the RDE), whose solution is
 *
 *   Δ(τ) = e^(A_clᵀτ) P∞ (I − W(τ)P∞)⁻¹ e^(A_cl τ),   W(τ) = ∫₀^τ e^(A_cl s) G e^(A_clᵀ s) ds
 *        = W∞ − e^(A_cl τ) W∞ e^(A_clᵀ τ),   A_cl W∞ + W∞ A_clᵀ + G = 0
 *
 * (check: with M = P∞⁻¹ − W, dM⁻¹/dτ = M⁻¹ e^(A_cl τ) G e^(A_clᵀ τ) M⁻¹, so Δ = e^(A_clᵀτ) M⁻¹ e^(A_cl τ)
 * satisfies the equation; (P∞⁻¹ − W)⁻¹ = P∞(I − WP∞)⁻¹ also holds for a singular P∞). So
 *
 *   P(T) = P∞ − e^(A_clᵀT) P∞ (I − W(T)P∞)⁻¹ e^(A_cl T),
 *
 * one matrix exponential and one Lyapunov solve whatever T: no stepping, so long horizons and small
 * weights r (fast closed loops, a stiff flow) cost nothing more. The gap decays like e^(−2σT), σ the
 * slowest closed-loop decay rate: for T ≫ 1/σ the finite-horizon cost equals the infinite one to
 * rounding. Returns null when W∞ cannot be solved for or I − W(T)P∞ is singular to working precision.
 *
 * References: the Riccati gap equation and its Bernoulli-type solution — F. M. Callier and
 * J. L. Willems, "Criterion for the convergence of the solution of the Riccati differential
 * equation", IEEE Trans. Automatic Control 26(6), 1232–1242, 1981 (from memory; derived above);
 * B. D. O. Anderson and J. B. Moore, Optimal Control: Linear Quadratic Methods, 1990, §3.3.
 */
export function finiteHorizonRiccati(g: Matrix, pInfinity: Matrix, closedLoop: Matrix, horizon: number): Matrix | null {
  const n = closedLoop.rows;
  const wInfinity = lyapunovMatrix(closedLoop.transpose(), symmetrize(g));
  if (!wInfinity) return null;
  const flat = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) flat[i * n + j] = closedLoop.get(i, j) * horizon;
  const e = Matrix.from1DArray(n, n, expm(flat, n));
  const w = Matrix.sub(wInfinity, e.mmul(wInfinity).mmul(e.transpose()));
  const iMinusWp = Matrix.sub(Matrix.eye(n), w.mmul(pInfinity));
  let inner: Matrix;
  try {
    // P∞ (I − W P∞)⁻¹ e^(A_cl T) = P∞ X with (I − W P∞) X = e^(A_cl T).
    inner = solve(iMinusWp, e);
  } catch {
    return null;
  }
  const gap = e.transpose().mmul(pInfinity).mmul(inner);
  const p = symmetrize(Matrix.sub(pInfinity, gap));
  return p.to1DArray().every(Number.isFinite) ? p : null;
}
