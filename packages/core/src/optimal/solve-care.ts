import { CholeskyDecomposition, Matrix, inverse } from "ml-matrix";
import type { Complex } from "../linear-algebra/complex.js";
import { riccatiBySignFunction } from "./hamiltonian-sign.js";
import { matrixRows, riccatiArguments, symmetrize } from "./matrix-argument.js";
import { HURWITZ_MARGIN, matrixEigenvalues } from "./matrix-eigenvalues.js";
import { newtonKleinman } from "./newton-kleinman.js";
import { undetectableMode, unstabilizableMode } from "./stabilizability.js";

/** Relative residual above which a computed solution is refused. */
export const CARE_RESIDUAL_LIMIT = 1e-8;

/** The stabilising solution of the CARE with its LQR gain and closed-loop poles. */
export interface CareSolution {
  ok: true;
  /** The stabilising solution, n×n symmetric positive semidefinite. */
  P: number[][];
  /** The LQR gain K = R⁻¹BᵀP, m×n: u = −K x. */
  K: number[][];
  /** Eigenvalues of A − BK, sorted by real part then imaginary part. */
  poles: Complex[];
  /** ‖AᵀP + PA − PBR⁻¹BᵀP + Q‖_F / (‖AᵀP‖_F + ‖PA‖_F + ‖PBR⁻¹BᵀP‖_F + ‖Q‖_F). */
  residual: number;
}

export type CareResult = CareSolution | { ok: false; reason: string };

/**
 * The stabilising solution P of the continuous algebraic Riccati equation
 *
 *   AᵀP + PA − P B R⁻¹ Bᵀ P + Q = 0,
 *
 * the LQR gain K = R⁻¹BᵀP and the closed-loop poles eig(A − BK). x₀ᵀPx₀ is the least value of
 * ∫₀^∞ (xᵀQx + uᵀRu) dt over all inputs along x' = Ax + Bu, x(0) = x₀ (Kalman 1960; Anderson &
 * Moore 1990, §3.3), reached by u = −Kx.
 *
 * A: n×n, B: n×m, Q: n×n symmetric ⪰ 0, R: m×m symmetric ≻ 0 (rows of numbers).
 * Method: the matrix sign function of the Hamiltonian with determinant scaling (Roberts 1980,
 * Byers 1987; see riccatiBySignFunction), then up to NEWTON_KLEINMAN_STEPS Newton–Kleinman steps
 * (Kleinman 1968) that polish the residual to rounding level. A stabilising solution exists iff
 * (A, B) is stabilisable and (Q, A) has no unobservable mode on the imaginary axis; this solver
 * also asks for detectability of (Q, A), so that P is the unique solution making A − BK Hurwitz
 * and every finite-cost input drives x to 0. Failures come back as `{ ok: false, reason }`
 * naming the offending mode (PBH tests, stabilizability.ts).
 *
 * Throws a RangeError naming A, B, Q or R for a bad shape, a non-finite entry, an asymmetric Q or
 * R, a Q that is not ⪰ 0 or an R that is not ≻ 0.
 * References: R. E. Kalman, "Contributions to the theory of optimal control", Bol. Soc. Mat.
 * Mexicana 5, 102–119, 1960; B. D. O. Anderson and J. B. Moore, Optimal Control: Linear
 * Quadratic Methods, Prentice Hall, 1990, §3.3 and §3.4.
 */
export function solveCare(
  A: readonly (readonly number[])[],
  B: readonly (readonly number[])[],
  Q: readonly (readonly number[])[],
  R: readonly (readonly number[])[],
): CareResult {
  const { a, b, q, r } = riccatiArguments(A, B, Q, R);
  const qScale = Math.max(1e-300, q.norm());
  if (matrixEigenvalues(symmetrize(q)).some((l) => l.re < -1e-12 * qScale)) throw new RangeError("Q must be positive semidefinite (all eigenvalues ≥ 0)");
  if (!new CholeskyDecomposition(symmetrize(r)).isPositiveDefinite()) throw new RangeError("R must be positive definite (all eigenvalues > 0)");
  return careMatrices(a, b, symmetrize(q), symmetrize(r));
}

/** solveCare on checked ml-matrix matrices (q symmetric ⪰ 0, r symmetric ≻ 0). */
export function careMatrices(a: Matrix, b: Matrix, q: Matrix, r: Matrix): CareResult {
  const blocked = diagnose(a, b, q);
  if (blocked) return { ok: false, reason: blocked };
  const rInverse = symmetrize(inverse(r));
  const g = symmetrize(b.mmul(rInverse).mmul(b.transpose()));
  const residualOf = (p: Matrix): number => careResidual(a, g, q, p);
  const start = riccatiBySignFunction(a, g, q);
  if (!start) return { ok: false, reason: "the Hamiltonian has eigenvalues on or too near the imaginary axis; no stabilising solution was found" };
  const p = newtonKleinman(a, b, q, r, rInverse, start, residualOf);
  const gain = rInverse.mmul(b.transpose()).mmul(p);
  const closed = Matrix.sub(a, b.mmul(gain));
  const poles = matrixEigenvalues(closed);
  const residual = residualOf(p);
  if (!poles.every((l) => l.re < -HURWITZ_MARGIN * Math.max(1, Math.hypot(l.re, l.im)))) {
    return { ok: false, reason: "the computed gain does not stabilise A − BK; the problem is too close to losing stabilisability or detectability" };
  }
  if (!(residual <= CARE_RESIDUAL_LIMIT)) return { ok: false, reason: `the Riccati residual ${residual.toExponential(2)} stayed above ${CARE_RESIDUAL_LIMIT}; the problem is too ill-conditioned` };
  return { ok: true, P: matrixRows(p), K: matrixRows(gain), poles, residual };
}

/** The relative CARE residual reported in CareSolution.residual. */
export function careResidual(a: Matrix, g: Matrix, q: Matrix, p: Matrix): number {
  const atp = a.transpose().mmul(p);
  const pa = p.mmul(a);
  const pgp = p.mmul(g).mmul(p);
  const res = Matrix.add(atp, pa).sub(pgp).add(q);
  const scale = atp.norm() + pa.norm() + pgp.norm() + q.norm();
  return scale === 0 ? 0 : res.norm() / scale;
}

function diagnose(a: Matrix, b: Matrix, q: Matrix): string | null {
  const u = unstabilizableMode(a, b);
  if (u) return `(A, B) is not stabilisable: the mode at λ = ${formatComplex(u)} cannot be moved by the input`;
  const d = undetectableMode(a, q);
  if (d) return `(Q, A) is not detectable: the mode at λ = ${formatComplex(d)} is not weighted by Q, so no finite cost forces it to decay`;
  return null;
}

function formatComplex(l: Complex): string {
  const re = Number(l.re.toPrecision(6));
  const im = Number(l.im.toPrecision(6));
  if (im === 0) return `${re}`;
  return `${re} ${im < 0 ? "−" : "+"} ${Math.abs(im)}j`;
}
