import { assertFiniteCoefficients, trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";

/**
 * True when every root of the real polynomial p(z) = p₀zᴺ + p₁zᴺ⁻¹ + … + p_N (descending powers)
 * lies strictly inside the unit circle (a Schur-stable polynomial: the discrete-time closed loop
 * whose characteristic polynomial it is decays).
 *
 * Method: the Schur–Cohn recursion, which is Jury's table computed row by row. With the reciprocal
 * polynomial p*(z) = zᴺ p(1/z) and the reflection coefficient k = p_N/p₀,
 *
 *   p stable  ⇔  |k| < 1  and  q(z) = (p(z) − k·p*(z))/z  is stable,
 *
 * q of degree N − 1 with coefficients q_i = p_i − k·p_{N−i}, i = 0…N−1. (On |z| = 1, |k·p*| = |k|·|p|
 * < |p|, so by Rouché p − k·p* = z·q has as many roots inside as p.) A degree-0 polynomial is stable.
 * O(N²) operations; each row is scaled by its leading coefficient so nothing overflows. A root on the
 * circle (|k| = 1 at some row) is not stable. Accuracy: the reflection coefficients of a polynomial
 * whose roots cluster near z = 1 (a short sample time, several slow poles) come within rounding of ±1,
 * so callers prefer the eigenvalues of the closed-loop matrix for small orders (sampledLoopStability).
 *
 * Throws a RangeError naming `coeffs` for a non-finite coefficient or the zero polynomial.
 * References: E. I. Jury, Theory and Application of the z-Transform Method, Wiley, 1964, §3;
 * K. J. Åström and B. Wittenmark, Computer-Controlled Systems, 3rd ed., Prentice Hall, 1997, §3.2
 * (Jury's stability test and its reduction p_{k−1} = (p_k − α_k p_k*)/z).
 */
export function isSchurStable(coeffs: readonly number[]): boolean {
  assertFiniteCoefficients(coeffs, "coeffs");
  const trimmed = trimLeadingZeros(coeffs);
  if (trimmed.length === 0 || trimmed.every((c) => c === 0)) throw new RangeError("coeffs: the zero polynomial has no roots to judge");
  let p = Float64Array.from(trimmed);
  let degree = p.length - 1;
  let q = new Float64Array(p.length);
  while (degree > 0) {
    const lead = p[0];
    for (let i = 0; i <= degree; i++) p[i] /= lead;
    const k = p[degree];
    if (!(Math.abs(k) < 1)) return false;
    for (let i = 0; i < degree; i++) q[i] = p[i] - k * p[degree - i];
    const swap = p;
    p = q;
    q = swap;
    degree--;
  }
  return true;
}
