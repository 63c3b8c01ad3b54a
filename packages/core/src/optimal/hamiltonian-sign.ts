import { LuDecomposition, Matrix, QrDecomposition, inverse } from "ml-matrix";
import { symmetrize } from "./matrix-argument.js";

/** Iteration limit of the sign-function iteration (it converges quadratically once scaled; tens of steps at most). */
export const SIGN_MAX_ITERATIONS = 100;
/** Relative change ‖Z_{k+1} − Z_k‖₁ ≤ SIGN_TOLERANCE·‖Z_{k+1}‖₁ ends the iteration. */
export const SIGN_TOLERANCE = 1e-13;
/** Below this relative change the determinant scaling is switched off (Byers 1987: it only helps far from convergence). */
export const SIGN_SCALING_OFF = 1e-2;

/**
 * The stabilising solution of the continuous algebraic Riccati equation
 * AᵀP + PA − P G P + Q = 0 (G = B R⁻¹ Bᵀ) from the matrix sign function of its Hamiltonian
 *
 *   H = [ A  −G ; −Q  −Aᵀ ],
 *
 * by the Newton iteration Z₀ = H, Z_{k+1} = ½(μ_k Z_k + (μ_k Z_k)⁻¹) with determinant scaling
 * μ_k = |det Z_k|^(−1/2n) (Byers 1987). W = sign(H) = lim Z_k has W + I vanishing on the stable
 * invariant subspace, spanned by [I; P], so P solves the 2n×n least-squares system
 *
 *   [ W₁₂ ; W₂₂ + I ] P = −[ W₁₁ + I ; W₂₁ ]   (Roberts 1980),
 *
 * solved by Householder QR and symmetrised. Returns null when an iterate is singular (H has an
 * eigenvalue on the imaginary axis: the problem is not stabilisable or not detectable) or the
 * iteration does not converge within SIGN_MAX_ITERATIONS.
 *
 * References: J. D. Roberts, "Linear model reduction and solution of the algebraic Riccati
 * equation by use of the sign function", Int. J. Control 32(4), 677–687, 1980 (report 1971);
 * R. Byers, "Solving the algebraic Riccati equation with the matrix sign function", Linear Algebra
 * Appl. 85, 267–279, 1987.
 */
export function riccatiBySignFunction(a: Matrix, g: Matrix, q: Matrix): Matrix | null {
  const n = a.rows;
  const size = 2 * n;
  let z = new Matrix(size, size);
  z.setSubMatrix(a, 0, 0);
  z.setSubMatrix(Matrix.mul(g, -1), 0, n);
  z.setSubMatrix(Matrix.mul(q, -1), n, 0);
  z.setSubMatrix(Matrix.mul(a.transpose(), -1), n, n);
  let scaling = true;
  let converged = false;
  for (let k = 0; k < SIGN_MAX_ITERATIONS; k++) {
    const lu = new LuDecomposition(z);
    if (lu.isSingular()) return null;
    let mu = 1;
    if (scaling) {
      let logDet = 0;
      const u = lu.upperTriangularMatrix;
      for (let i = 0; i < size; i++) logDet += Math.log(Math.abs(u.get(i, i)));
      mu = Math.exp(-logDet / size);
      if (!Number.isFinite(mu) || mu === 0) return null;
    }
    let zi: Matrix;
    try {
      zi = inverse(z);
    } catch {
      return null;
    }
    const next = Matrix.mul(z, mu / 2).add(Matrix.mul(zi, 1 / (2 * mu)));
    const change = Matrix.sub(next, z).norm("frobenius") / Math.max(1e-300, next.norm("frobenius"));
    z = next;
    if (!z.to1DArray().every(Number.isFinite)) return null;
    if (change < SIGN_SCALING_OFF) scaling = false;
    if (change <= SIGN_TOLERANCE) {
      converged = true;
      break;
    }
  }
  if (!converged) return null;
  const lhs = new Matrix(size, n);
  lhs.setSubMatrix(z.subMatrix(0, n - 1, n, size - 1), 0, 0);
  lhs.setSubMatrix(z.subMatrix(n, size - 1, n, size - 1).add(Matrix.eye(n)), n, 0);
  const rhs = new Matrix(size, n);
  rhs.setSubMatrix(Matrix.mul(z.subMatrix(0, n - 1, 0, n - 1).add(Matrix.eye(n)), -1), 0, 0);
  rhs.setSubMatrix(Matrix.mul(z.subMatrix(n, size - 1, 0, n - 1), -1), n, 0);
  const qr = new QrDecomposition(lhs);
  if (!qr.isFullRank()) return null;
  const p = symmetrize(qr.solve(rhs));
  return p.to1DArray().every(Number.isFinite) ? p : null;
}
