/**
 * Sum of two polynomials in descending powers of s, aligned at the constant term:
 * `[1, 0, 0] + [2, 3]` (s² + 2s + 3) = `[1, 2, 3]`. The result has the length of the longer one.
 */
export function polynomialAdd(p: readonly number[], q: readonly number[]): number[] {
  const n = Math.max(p.length, q.length);
  const out = new Array<number>(n).fill(0);
  for (let i = 0; i < p.length; i++) out[n - p.length + i] += p[i];
  for (let i = 0; i < q.length; i++) out[n - q.length + i] += q[i];
  return out;
}
