import { EigenvalueDecomposition, type Matrix } from "ml-matrix";
import type { Complex } from "../linear-algebra/complex.js";

/**
 * Eigenvalues of a real square matrix by the unsymmetric QR algorithm of ml-matrix (Hessenberg
 * reduction and shifted QR, after the EISPACK hqr2 routine), sorted by real part, then imaginary
 * part, ascending. Reference: G. H. Golub and C. F. Van Loan, Matrix Computations, 4th ed., 2013,
 * §7.5.
 */
export function matrixEigenvalues(m: Matrix): Complex[] {
  if (m.rows === 0) return [];
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: false });
  const out: Complex[] = [];
  for (let i = 0; i < m.rows; i++) out.push({ re: evd.realEigenvalues[i], im: evd.imaginaryEigenvalues[i] });
  return out.sort((x, y) => x.re - y.re || x.im - y.im);
}

/**
 * True when every eigenvalue λ of m has Re λ < −HURWITZ_MARGIN·max(1, |λ|) (a Hurwitz matrix:
 * x' = m x is asymptotically stable). Poles on the imaginary axis count as not stable.
 */
export function isHurwitzMatrix(m: Matrix): boolean {
  return matrixEigenvalues(m).every((p) => p.re < -HURWITZ_MARGIN * Math.max(1, Math.hypot(p.re, p.im)));
}

/** Relative distance from the imaginary axis below which an eigenvalue counts as on it. */
export const HURWITZ_MARGIN = 1e-9;
