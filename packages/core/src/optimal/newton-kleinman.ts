import { Matrix } from "ml-matrix";
import { symmetrize } from "./matrix-argument.js";
import { isHurwitzMatrix } from "./matrix-eigenvalues.js";
import { lyapunovMatrix } from "./solve-lyapunov.js";

/** Refinement steps after the sign function (each step squares the error near the solution). */
export const NEWTON_KLEINMAN_STEPS = 3;

/**
 * Newton–Kleinman refinement of a stabilising approximate solution P of the continuous algebraic
 * Riccati equation AᵀP + PA − P B R⁻¹ Bᵀ P + Q = 0: with K = R⁻¹BᵀP and A_K = A − B K Hurwitz,
 * the next iterate solves the Lyapunov equation
 *
 *   A_Kᵀ P⁺ + P⁺ A_K + Q + Kᵀ R K = 0,
 *
 * which converges quadratically and keeps A − B R⁻¹BᵀP⁺ Hurwitz. Stops after `steps` steps, when
 * A_K is not Hurwitz (the start was not stabilising) or when a step does not lower the residual
 * `residualOf`; returns the best iterate (possibly the start).
 * Reference: D. L. Kleinman, "On an iterative technique for Riccati equation computations",
 * IEEE Trans. Automatic Control 13(1), 114–115, 1968.
 */
export function newtonKleinman(
  a: Matrix,
  b: Matrix,
  q: Matrix,
  r: Matrix,
  rInverse: Matrix,
  start: Matrix,
  residualOf: (p: Matrix) => number,
  steps = NEWTON_KLEINMAN_STEPS,
): Matrix {
  let best = start;
  let bestResidual = residualOf(start);
  for (let k = 0; k < steps && bestResidual > 0; k++) {
    const gain = rInverse.mmul(b.transpose()).mmul(best);
    const closed = Matrix.sub(a, b.mmul(gain));
    if (!isHurwitzMatrix(closed)) break;
    const weight = symmetrize(Matrix.add(q, gain.transpose().mmul(r).mmul(gain)));
    const next = lyapunovMatrix(closed, weight);
    if (!next) break;
    const residual = residualOf(next);
    if (!(residual < bestResidual)) break;
    best = next;
    bestResidual = residual;
  }
  return best;
}
