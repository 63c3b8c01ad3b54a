import { balanceMatrix } from "../linear-algebra/balance-matrix.js";

/**
 * Largest h·ρ allowed for the classical Runge–Kutta method, ρ an estimate of the spectral radius of
 * the loop's Jacobian. RK4 is stable on the negative real axis up to h|λ| ≈ 2.785 (E. Hairer and
 * G. Wanner, Solving ODEs II, 2nd ed., Springer, 1996, §IV.2, Fig. 2.1); at h|λ| ≤ 1 its amplification
 * factor 1 − hλ + (hλ)²/2 − (hλ)³/6 + (hλ)⁴/24 stays within 2 % of e^(−h|λ|), so a fast mode (a
 * derivative filter, a stiff plant pole) is followed, not only kept bounded.
 */
export const RK4_STEP_LIMIT = 1;

/**
 * Most internal steps per grid step of the joint loop. A loop that needs more — a derivative filter
 * or a loop pole more than about 8/dt fast, or θ < dt/8 — is stiff at this dt: simulateLoop runs it
 * on the grid loop's zero-order-hold scheme instead (stable for any stiffness, first order in dt),
 * so one such candidate does not cost as much as hundreds of others in a sweep.
 */
export const MAX_SUBSTEPS = 8;

/**
 * Number s of equal internal steps h = dt/s per grid step for the joint Runge–Kutta loop:
 *
 *   s = max(1, ⌈dt·ρ / RK4_STEP_LIMIT⌉, ⌈dt/θ⌉ when θ > 0)   (compare with MAX_SUBSTEPS),
 *
 * ρ = ‖D⁻¹JD‖∞ of the balanced Jacobian J (an upper bound of the spectral radius that balancing
 * brings close to it; B. N. Parlett and C. Reinsch, Numer. Math. 13, 1969), and h ≤ θ so that every
 * stage reads the delayed input from the stored past, never from the step being taken.
 * jacobian: n×n row-major (copied, not modified); dt [s]; delay θ [s] ≥ 0.
 */
export function jointSubsteps(jacobian: Float64Array, n: number, dt: number, delay: number): number {
  let rho = 0;
  if (n > 0) {
    const a = Float64Array.from(jacobian);
    balanceMatrix(a, n);
    for (let i = 0; i < n; i++) {
      let row = 0;
      for (let j = 0; j < n; j++) row += Math.abs(a[i * n + j]);
      rho = Math.max(rho, row);
    }
  }
  let s = 1;
  if (Number.isFinite(rho)) s = Math.max(s, Math.ceil((dt * rho) / RK4_STEP_LIMIT));
  else s = Infinity;
  if (delay > 0) s = Math.max(s, Math.ceil(dt / delay - 1e-9));
  return s;
}
