/**
 * Product of two polynomials in descending powers of s (discrete convolution):
 *
 *   (p·q)_k = Σ_{i+j=k} p_i q_j,   deg(p·q) = deg p + deg q.
 *
 * An empty array stands for the zero polynomial; the product with it is `[]`.
 */
export function polynomialMultiply(p: readonly number[], q: readonly number[]): number[] {
  if (p.length === 0 || q.length === 0) return [];
  const out = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) {
    const pi = p[i];
    if (pi === 0) continue;
    for (let j = 0; j < q.length; j++) out[i + j] += pi * q[j];
  }
  return out;
}
