import { ROUTH_ZERO_TOLERANCE } from "./routh-hurwitz.js";

/** Reused work array of isHurwitz; grown when a longer polynomial arrives, never shrunk. */
let scratch = new Float64Array(16);

/**
 * Fast predicate: true when every root of p(s) = a₀sⁿ + … + aₙ (descending powers) lies in the
 * open left half-plane. The same Routh recurrence as routhHurwitz (and the same
 * ROUTH_ZERO_TOLERANCE), done in place on one reused scratch array: with c = sign(a₀)·a,
 *
 *   step k = 0 … n−2:  μ = c[k] / c[k+1];  c[i] ← c[i] − μ·c[i+1]  for i = k+2, k+4, … ≤ n
 *
 * (c[n+1] = 0), after which c[0], c[1], …, c[n] are the first column of the Routh array; the
 * polynomial is Hurwitz iff all of them are > 0. It returns false at the first coefficient that is
 * ≤ 0 (Stodola's necessary condition) or the first pivot that is ≤ 0 or cancelled to rounding
 * level — so it never needs the ε or auxiliary-polynomial cases, which only arise for polynomials
 * that are not Hurwitz. Leading zeros are skipped; a non-zero constant is Hurwitz (no roots).
 *
 * Meant for sweeps (one call per candidate): it allocates nothing after the first calls.
 * coeffs: finite, not all zero (a RangeError naming `coeffs` otherwise).
 *
 * References: E. J. Routh, A Treatise on the Stability of a Given State of Motion, 1877;
 * K. Ogata, Modern Control Engineering, 5th ed., 2010, §5-6.
 */
export function isHurwitz(coeffs: ArrayLike<number>): boolean {
  const length = coeffs.length;
  let first = 0;
  while (first < length && coeffs[first] === 0) first++;
  if (first === length) throw new RangeError("coeffs: the zero polynomial has no roots to locate");
  const n = length - 1 - first;
  if (scratch.length < n + 2) scratch = new Float64Array(2 * (n + 2));
  const c = scratch;
  const sign = coeffs[first] > 0 ? 1 : -1;
  let allPositive = true;
  for (let k = 0; k <= n; k++) {
    const v = coeffs[first + k];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new RangeError(`coeffs[${first + k}] must be a finite number, got ${String(v)}`);
    }
    c[k] = sign * v;
    if (!(c[k] > 0)) allPositive = false;
  }
  if (!allPositive) return false;
  c[n + 1] = 0;
  for (let k = 0; k + 2 <= n; k++) {
    const mu = c[k] / c[k + 1];
    for (let i = k + 2; i <= n; i += 2) {
      const b = c[i];
      const d = mu * c[i + 1];
      const v = b - d;
      c[i] = Math.abs(v) <= ROUTH_ZERO_TOLERANCE * (Math.abs(b) + Math.abs(d)) ? 0 : v;
    }
    if (!(c[k + 2] > 0)) return false;
  }
  return true;
}
