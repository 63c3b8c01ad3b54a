import { CholeskyDecomposition, Matrix, inverse, solve } from "ml-matrix";
import { expm } from "../linear-algebra/expm.js";
import { assertSymmetric, matrixArgument, matrixRows, riccatiArguments, symmetrize } from "./matrix-argument.js";

/** ‖M‖₁·h ≤ RDE_STEP_NORM for each Davison–Maki step (keeps e^(Mh) and the re-initialised inverse well conditioned). */
export const RDE_STEP_NORM = 1;
/** Most steps solveRde takes before it gives up. */
export const RDE_MAX_STEPS = 2_000_000;
/** Relative change per step below which P has reached its steady state (the CARE solution) and stepping stops. */
export const RDE_STEADY_TOLERANCE = 1e-15;

/** The finite-horizon solution: P(0), the gain K(0) = R⁻¹BᵀP(0) and the number of steps taken. */
export type RdeResult = { ok: true; P: number[][]; K: number[][]; steps: number } | { ok: false; reason: string };

/**
 * The Riccati differential equation over [0, T], integrated backwards from P(T) = F:
 *
 *   −Ṗ = AᵀP + PA − P B R⁻¹ Bᵀ P + Q,   P(T) = F (default 0),
 *
 * so that x₀ᵀ P(0) x₀ is the least value of ∫₀ᵀ (xᵀQx + uᵀRu) dt + x(T)ᵀF x(T) over all inputs along
 * x' = Ax + Bu, x(0) = x₀ (Anderson & Moore 1990, §2.3) — the finite-horizon LQ cost.
 *
 * Method: in the time to go τ = T − t, P = Y X⁻¹ where [X; Y]' = M [X; Y], M = [−A, G; Q, Aᵀ],
 * G = B R⁻¹ Bᵀ, X(0) = I, Y(0) = F. With Φ = e^(Mh) (expm, Higham 2005) one step is exact:
 *
 *   P(τ + h) = (Φ₂₁ + Φ₂₂ P(τ)) (Φ₁₁ + Φ₁₂ P(τ))⁻¹,
 *
 * re-initialising [X; Y] = [I; P] after every step (the modified Davison–Maki method of Kenney &
 * Leipnik 1985), so the growing and decaying modes of M never meet in one product. h = T/N with
 * ‖M‖₁·h ≤ RDE_STEP_NORM. Exact up to rounding (no truncation error), stiff-safe; once P stops
 * changing (relative change < RDE_STEADY_TOLERANCE) it has reached the CARE solution and stepping
 * stops. For T → ∞, P(0) tends to the stabilising CARE solution (solveCare) when (A, B) is
 * stabilisable and (Q, A) detectable.
 *
 * A: n×n, B: n×m, Q, F: n×n symmetric ⪰ 0, R: m×m symmetric ≻ 0, horizon T > 0 [s], finite.
 * Throws a RangeError naming the bad argument.
 * References: E. J. Davison and M. C. Maki, "The numerical solution of the matrix Riccati
 * differential equation", IEEE Trans. Automatic Control 18(1), 71–73, 1973; C. S. Kenney and
 * R. B. Leipnik, "Numerical integration of the differential matrix Riccati equation", IEEE Trans.
 * Automatic Control 30(10), 962–970, 1985; B. D. O. Anderson and J. B. Moore, Optimal Control:
 * Linear Quadratic Methods, 1990, §2.3.
 */
export function solveRde(
  A: readonly (readonly number[])[],
  B: readonly (readonly number[])[],
  Q: readonly (readonly number[])[],
  R: readonly (readonly number[])[],
  horizon: number,
  F?: readonly (readonly number[])[],
): RdeResult {
  const { n, a, b, q, r } = riccatiArguments(A, B, Q, R);
  const f = F === undefined ? new Matrix(n, n) : matrixArgument(F, "F", n, n);
  assertSymmetric(f, "F");
  if (typeof horizon !== "number" || !(horizon > 0) || !Number.isFinite(horizon)) throw new RangeError(`horizon must be a finite time > 0 s, got ${String(horizon)}`);
  if (!new CholeskyDecomposition(symmetrize(r)).isPositiveDefinite()) throw new RangeError("R must be positive definite (all eigenvalues > 0)");
  const rInverse = symmetrize(inverse(symmetrize(r)));
  const g = symmetrize(b.mmul(rInverse).mmul(b.transpose()));
  const flow = riccatiFlow(a, g, symmetrize(q), symmetrize(f), horizon);
  if (!flow) return { ok: false, reason: "the Riccati differential equation escaped to infinity or needed too many steps" };
  const p = flow.p;
  return { ok: true, P: matrixRows(p), K: matrixRows(rInverse.mmul(b.transpose()).mmul(p)), steps: flow.steps };
}

/**
 * The backward Riccati flow of solveRde on checked matrices (g = BR⁻¹Bᵀ): P after time to go
 * `horizon`, starting from f. `onStep(τ, P)`, when given, sees every node τ_k = k·h (k = 0…N) and
 * forces all N steps to be taken (no early stop). Returns null when P stops being finite or
 * N > RDE_MAX_STEPS.
 */
export function riccatiFlow(
  a: Matrix,
  g: Matrix,
  q: Matrix,
  f: Matrix,
  horizon: number,
  onStep?: (tau: number, p: Matrix) => void,
  minSteps = 1,
): { p: Matrix; steps: number; h: number } | null {
  const n = a.rows;
  const size = 2 * n;
  const m = new Float64Array(size * size);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      m[i * size + j] = -a.get(i, j);
      m[i * size + n + j] = g.get(i, j);
      m[(n + i) * size + j] = q.get(i, j);
      m[(n + i) * size + n + j] = a.get(j, i);
    }
  }
  let norm = 0;
  for (let j = 0; j < size; j++) {
    let col = 0;
    for (let i = 0; i < size; i++) col += Math.abs(m[i * size + j]);
    norm = Math.max(norm, col);
  }
  const steps = Math.max(minSteps, Math.ceil((horizon * norm) / RDE_STEP_NORM));
  if (steps > RDE_MAX_STEPS) return null;
  const h = horizon / steps;
  for (let i = 0; i < m.length; i++) m[i] *= h;
  const phiFlat = expm(m, size);
  const phi = Matrix.from1DArray(size, size, phiFlat);
  const p11 = phi.subMatrix(0, n - 1, 0, n - 1);
  const p12 = phi.subMatrix(0, n - 1, n, size - 1);
  const p21 = phi.subMatrix(n, size - 1, 0, n - 1);
  const p22 = phi.subMatrix(n, size - 1, n, size - 1);
  let p = f.clone();
  onStep?.(0, p);
  for (let k = 1; k <= steps; k++) {
    const x = Matrix.add(p11, p12.mmul(p));
    const y = Matrix.add(p21, p22.mmul(p));
    // P⁺ = Y X⁻¹  ⇔  Xᵀ P⁺ᵀ = Yᵀ.
    let next: Matrix;
    try {
      next = symmetrize(solve(x.transpose(), y.transpose()).transpose());
    } catch {
      return null;
    }
    if (!next.to1DArray().every(Number.isFinite)) return null;
    const change = Matrix.sub(next, p).norm() / Math.max(1e-300, next.norm());
    p = next;
    onStep?.(k * h, p);
    if (!onStep && change < RDE_STEADY_TOLERANCE) return { p, steps: k, h };
  }
  return { p, steps, h };
}
