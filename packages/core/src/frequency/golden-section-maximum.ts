/** 1/φ = (√5 − 1)/2, the golden-section ratio. */
const INVERSE_GOLDEN = (Math.sqrt(5) - 1) / 2;
/** Hard cap on iterations (each shrinks the bracket by 1/φ ≈ 0.618). */
const MAX_ITERATIONS = 200;

/**
 * The maximum of f on [a, b] by golden-section search: keep two interior points
 * x₁ = b − (b − a)/φ, x₂ = a + (b − a)/φ and drop the end beyond the smaller value, until
 * b − a ≤ tolerance. Exact for a unimodal f on [a, b]; otherwise a local maximum. Returns the best
 * point seen (including the end points, which the search never evaluates itself: pass their
 * values as fa, fb).
 *
 * Near a smooth maximum the value error is of order f''·tolerance², so a tolerance of 1e-9 in the
 * argument gives the peak value to rounding.
 *
 * Reference: J. Kiefer, "Sequential minimax search for a maximum", Proc. AMS 4(3), 502–506, 1953;
 * W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §10.2.
 */
export function goldenSectionMaximum(
  f: (x: number) => number,
  a: number,
  b: number,
  fa: number,
  fb: number,
  tolerance: number,
): { x: number; value: number } {
  let best = fa >= fb ? { x: a, value: fa } : { x: b, value: fb };
  let x1 = b - INVERSE_GOLDEN * (b - a);
  let x2 = a + INVERSE_GOLDEN * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < MAX_ITERATIONS && b - a > tolerance; i++) {
    if (f1 >= f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - INVERSE_GOLDEN * (b - a);
      f1 = f(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + INVERSE_GOLDEN * (b - a);
      f2 = f(x2);
    }
  }
  if (f1 > best.value) best = { x: x1, value: f1 };
  if (f2 > best.value) best = { x: x2, value: f2 };
  return best;
}
