import { Matrix, SingularValueDecomposition } from "ml-matrix";
import type { Complex } from "../linear-algebra/complex.js";
import { HURWITZ_MARGIN, matrixEigenvalues } from "./matrix-eigenvalues.js";

/** Relative size of the smallest singular value below which a PBH test matrix counts as rank deficient. */
export const PBH_RANK_TOLERANCE = 1e-9;

/**
 * The first eigenvalue λ of A with Re λ ≥ −HURWITZ_MARGIN·max(1, |λ|) that the input cannot move,
 * or null when (A, B) is stabilisable. PBH test: (A, B) is stabilisable iff rank [A − λI, B] = n
 * for every eigenvalue λ of A in the closed right half plane. A complex λ = σ + jω is tested in its
 * real 2n-row form [[A − σI, B, ωI, 0], [−ωI, 0, A − σI, B]], full rank iff the complex matrix is.
 * Reference: M. L. J. Hautus, "Controllability and observability conditions of linear autonomous
 * systems", Proc. KNAW A 72, 443–448, 1969; K. Zhou, J. C. Doyle and K. Glover, Robust and Optimal
 * Control, Prentice Hall, 1996, §3.2.
 */
export function unstabilizableMode(a: Matrix, b: Matrix): Complex | null {
  return failingMode(a, b);
}

/**
 * The first eigenvalue λ of A in the closed right half plane whose mode the weight Q does not see,
 * or null when (Q, A) is detectable: rank [A − λI; Q] = n (the dual PBH test; for a symmetric
 * Q ⪰ 0, Q and Q^½ have the same null space). Same references as unstabilizableMode.
 */
export function undetectableMode(a: Matrix, q: Matrix): Complex | null {
  return failingMode(a.transpose(), q.transpose());
}

function failingMode(a: Matrix, b: Matrix): Complex | null {
  const n = a.rows;
  const m = b.columns;
  const scale = Math.max(1, a.norm(), b.norm());
  for (const lambda of matrixEigenvalues(a)) {
    if (lambda.re < -HURWITZ_MARGIN * Math.max(1, Math.hypot(lambda.re, lambda.im))) continue;
    const { re: s, im: w } = lambda;
    const test = new Matrix(2 * n, 2 * (n + m));
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const v = a.get(i, j) - (i === j ? s : 0);
        test.set(i, j, v);
        test.set(n + i, n + m + j, v);
      }
      for (let j = 0; j < m; j++) {
        test.set(i, n + j, b.get(i, j));
        test.set(n + i, 2 * n + m + j, b.get(i, j));
      }
      test.set(i, n + m + i, w);
      test.set(n + i, i, -w);
    }
    const sigma = new SingularValueDecomposition(test.transpose(), { autoTranspose: true }).diagonal;
    const smallest = Math.min(...sigma.slice(0, 2 * n));
    if (smallest <= PBH_RANK_TOLERANCE * scale) return lambda;
  }
  return null;
}
