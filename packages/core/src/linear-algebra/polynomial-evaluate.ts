/**
 * Value of a polynomial in descending powers of s at a real point x, by Horner's scheme:
 *
 *   p(x) = (…((p₀ x + p₁) x + p₂) …) x + pₙ.
 *
 * The zero polynomial `[]` evaluates to 0.
 * References: W. G. Horner, "A new method of solving numerical equations of all orders",
 * Phil. Trans. R. Soc. London 109, 1819; D. E. Knuth, TAOCP vol. 2, §4.6.4.
 */
export function polynomialEvaluate(p: readonly number[], x: number): number {
  let acc = 0;
  for (let i = 0; i < p.length; i++) acc = acc * x + p[i];
  return acc;
}
