/** Hard cap on halvings (2⁻²⁰⁰ of any bracket is below every tolerance used). */
const MAX_HALVINGS = 200;

/**
 * The point in [a, b] where the predicate `above` changes value, given that it differs at a and
 * b (`aboveAtA` = above(a)), by bisection: halve the bracket, keep the half whose ends differ,
 * until b − a ≤ tolerance; returns the midpoint of the last bracket. Bisection never leaves the
 * bracket and needs only the sign of the function behind the predicate (here ln|L| > 0, Im L > 0,
 * |S| ≥ 1/√2 on a log-frequency axis), however flat it is.
 *
 * Reference: W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §9.1.
 */
export function bisectSignChange(above: (x: number) => boolean, a: number, b: number, aboveAtA: boolean, tolerance: number): number {
  for (let i = 0; i < MAX_HALVINGS && b - a > tolerance; i++) {
    const m = 0.5 * (a + b);
    if (above(m) === aboveAtA) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}
