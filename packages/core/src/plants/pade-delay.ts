/** Order of the Padé approximant of e^(−θs) used for closed-loop stability verdicts. */
export const DELAY_PADE_ORDER = 6;

/**
 * Diagonal [m/m] Padé approximant of a dead time, e^(−θs) ≈ q(−θs)/q(θs), with
 *
 *   q(x) = Σ_{k=0}^{m} c_k x^k,   c_k = (2m − k)! m! / ((2m)! k! (m − k)!).
 *
 * It is all-pass (|q(−jω)/q(jω)| = 1) and matches the phase −ωθ well while ωθ ≲ m; beyond that
 * the phase error grows, so verdicts based on it are approximations.
 *
 * theta: dead time [s] ≥ 0; order: m ≥ 0 (m = 0 gives 1/1).
 * Returns { num, den } in descending powers of s, den monic for θ > 0.
 *
 * References: G. A. Baker and P. Graves-Morris, Padé Approximants, 2nd ed., Cambridge
 * University Press, 1996, §1.2 (the exponential's Padé table); G. F. Franklin, J. D. Powell and
 * A. Emami-Naeini, Feedback Control of Dynamic Systems, 4th ed., 2002, §5.6.3.
 */
export function padeDelay(theta: number, order: number = DELAY_PADE_ORDER): { num: number[]; den: number[] } {
  if (!Number.isFinite(theta) || theta < 0) throw new RangeError(`theta must be a finite dead time ≥ 0 s, got ${theta}`);
  if (!Number.isInteger(order) || order < 0) throw new RangeError(`order must be a whole number ≥ 0, got ${order}`);
  if (theta === 0 || order === 0) return { num: [1], den: [1] };
  // c_k by the recurrence c_{k+1} = c_k (m − k) / ((2m − k)(k + 1)), c₀ = 1.
  const c = [1];
  for (let k = 0; k < order; k++) c.push((c[k] * (order - k)) / ((2 * order - k) * (k + 1)));
  const num: number[] = [];
  const den: number[] = [];
  for (let k = order; k >= 0; k--) {
    const coef = c[k] * theta ** k;
    den.push(coef);
    num.push(k % 2 === 0 ? coef : -coef);
  }
  const lead = den[0];
  return { num: num.map((v) => v / lead), den: den.map((v) => v / lead) };
}
