import { Matrix } from "ml-matrix";
import { solveLinear } from "../linear-algebra/solve-linear.js";
import { assertSymmetric, matrixArgument, matrixRows } from "./matrix-argument.js";

/** Largest order the vectorised solve accepts (n(n+1)/2 = 465 unknowns, ≈ 3·10⁷ flops). */
export const MAX_LYAPUNOV_ORDER = 30;

/** Result of solveLyapunov: P with its relative residual, or why there is no unique solution. */
export type LyapunovSolution = { ok: true; P: number[][]; residual: number } | { ok: false; reason: string };

/**
 * Solves the continuous Lyapunov equation
 *
 *   Aᵀ P + P A + Q = 0
 *
 * for the symmetric n×n matrix P, given A (n×n) and a symmetric Q (n×n). When A is Hurwitz,
 * P = ∫₀^∞ e^(Aᵀt) Q e^(At) dt, so x₀ᵀ P x₀ = ∫₀^∞ x(t)ᵀ Q x(t) dt along x' = A x, x(0) = x₀ — the
 * exact quadratic cost of a stable linear system without a time grid.
 *
 * Method: the vectorised (Kronecker) form (I ⊗ Aᵀ + Aᵀ ⊗ I) vec(P) = −vec(Q), written for the
 * n(n+1)/2 entries p_ij, i ≤ j, of the symmetric P and solved by Gaussian elimination with
 * partial pivoting: O(n⁶/24) flops, fine for the small orders of single-loop models (n ≤ 30;
 * ≈ 10⁵ flops at n = 12). Bartels–Stewart (a real Schur form, O(n³)) would be the choice for
 * larger n. The solution is unique exactly when λᵢ + λⱼ ≠ 0 for all eigenvalues of A; otherwise
 * (e.g. a pole at 0 or a pair ±jω) the result is `{ ok: false }`.
 * `residual` = ‖AᵀP + PA + Q‖_F / (2‖A‖_F‖P‖_F + ‖Q‖_F).
 *
 * Throws a RangeError naming A or Q for a bad shape, a non-finite entry or an asymmetric Q.
 * References: R. H. Bartels and G. W. Stewart, "Solution of the matrix equation AX + XB = C",
 * Comm. ACM 15(9), 820–826, 1972; G. H. Golub and C. F. Van Loan, Matrix Computations, 4th ed.,
 * 2013, §7.6.3 (Sylvester equation, Kronecker form).
 */
export function solveLyapunov(A: readonly (readonly number[])[], Q: readonly (readonly number[])[]): LyapunovSolution {
  const a = matrixArgument(A, "A");
  if (a.columns !== a.rows) throw new RangeError(`A must be square, got ${a.rows}×${a.columns}`);
  const q = matrixArgument(Q, "Q", a.rows, a.rows);
  assertSymmetric(q, "Q");
  const p = lyapunovMatrix(a, q);
  if (!p) return { ok: false, reason: "A has eigenvalues with λᵢ + λⱼ = 0 (a pole at 0 or a pair ±jω), so AᵀP + PA + Q = 0 has no unique solution" };
  return { ok: true, P: matrixRows(p), residual: lyapunovResidual(a, p, q) };
}

/**
 * The solve of solveLyapunov on ml-matrix matrices, without argument checks: returns P, or null
 * when the vectorised system is singular to working precision. q must be symmetric.
 */
export function lyapunovMatrix(a: Matrix, q: Matrix): Matrix | null {
  const n = a.rows;
  if (n > MAX_LYAPUNOV_ORDER) throw new RangeError(`A: order ${n} exceeds ${MAX_LYAPUNOV_ORDER}, the limit of the vectorised Lyapunov solve`);
  const count = (n * (n + 1)) / 2;
  const index = (i: number, j: number): number => (i <= j ? i * n - (i * (i - 1)) / 2 + (j - i) : j * n - (j * (j - 1)) / 2 + (i - j));
  const m = new Float64Array(count * count);
  const rhs = new Float64Array(count);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const row = index(i, j) * count;
      // (AᵀP)_ij = Σ_k A_ki P_kj,   (PA)_ij = Σ_k P_ik A_kj.
      for (let k = 0; k < n; k++) {
        m[row + index(k, j)] += a.get(k, i);
        m[row + index(i, k)] += a.get(k, j);
      }
      rhs[index(i, j)] = -q.get(i, j);
    }
  }
  const x = solveLinear(m, rhs, count);
  if (!x) return null;
  const p = new Matrix(n, n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = x[index(i, j)];
      p.set(i, j, v);
      p.set(j, i, v);
    }
  }
  return p;
}

/** ‖AᵀP + PA + Q‖_F / (2‖A‖_F‖P‖_F + ‖Q‖_F) (0 when all three vanish). */
export function lyapunovResidual(a: Matrix, p: Matrix, q: Matrix): number {
  const r = a.transpose().mmul(p).add(p.mmul(a)).add(q);
  const scale = 2 * a.norm() * p.norm() + q.norm();
  return scale === 0 ? 0 : r.norm() / scale;
}
