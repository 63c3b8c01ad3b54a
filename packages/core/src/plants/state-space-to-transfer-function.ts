import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";

/**
 * The transfer function C (sI − A)⁻¹ B + D = num(s)/den(s) of a SISO state space, without
 * cancelling common factors (so every eigenvalue of A stays a root of den, hidden modes included).
 * Faddeev–LeVerrier recurrence, with M₀ = 0, c₀ = 1:
 *
 *   M_k = A M_{k−1} + c_{k−1} I,   c_k = −tr(A M_k)/k,   k = 1…n,
 *   det(sI − A) = Σ c_k s^(n−k),   adj(sI − A) = Σ_{k=1}^{n} M_k s^(n−k),
 *   num(s) = Σ_k (C M_k B) s^(n−k) + D·det(sI − A).
 *
 * Returns coefficients in descending powers, den monic of degree n.
 * Adequate for the small orders here (n ≤ 10); the recurrence loses accuracy for large n.
 * Reference: F. R. Gantmacher, The Theory of Matrices, vol. 1, Chelsea, 1959, ch. IV §4.
 */
export function stateSpaceToTransferFunction(ss: SisoStateSpace): { num: number[]; den: number[] } {
  const { n, a, b, c, d } = ss;
  const den = [1];
  const num = [d];
  let m = new Float64Array(n * n);
  let coef = 1;
  for (let k = 1; k <= n; k++) {
    const next = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let acc = i === j ? coef : 0;
        for (let l = 0; l < n; l++) acc += a[i * n + l] * m[l * n + j];
        next[i * n + j] = acc;
      }
    }
    m = next;
    let cmb = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) cmb += c[i] * m[i * n + j] * b[j];
    let trace = 0;
    for (let i = 0; i < n; i++) for (let l = 0; l < n; l++) trace += a[i * n + l] * m[l * n + i];
    coef = -trace / k;
    den.push(coef);
    num.push(cmb + d * coef);
  }
  return { num, den };
}
