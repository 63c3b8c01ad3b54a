/**
 * A small Nelder–Mead simplex minimiser for tests, with the standard coefficients
 * (reflection 1, expansion 2, contraction ½, shrink ½), as in J. A. Nelder and R. Mead,
 * "A simplex method for function minimization", The Computer Journal 7(4), 308–313, 1965,
 * and the ordering rules of J. C. Lagarias et al., SIAM J. Optim. 9(1), 112–147, 1998.
 * Stops when the simplex values span less than `fTol` (absolute) and its vertices lie within
 * `xTol` of the best one, or after `maxEvaluations`. A non-finite value counts as +Infinity.
 */
const REFLECTION = 1;
const EXPANSION = 2;
const CONTRACTION = 0.5;
const SHRINK = 0.5;

export interface NelderMeadResult {
  x: number[];
  value: number;
  evaluations: number;
}

export function nelderMead(
  f: (x: readonly number[]) => number,
  start: readonly number[],
  { step = 0.1, xTol = 1e-4, fTol = 1e-10, maxEvaluations = 1000 } = {},
): NelderMeadResult {
  const n = start.length;
  let evaluations = 0;
  const value = (x: number[]) => {
    evaluations++;
    const v = f(x);
    return Number.isFinite(v) ? v : Infinity;
  };
  let simplex = [start.slice()];
  for (let i = 0; i < n; i++) {
    const x = start.slice();
    x[i] += step;
    simplex.push(x);
  }
  let values = simplex.map(value);
  const combine = (a: number[], b: number[], w: number) => a.map((ai, i) => ai + w * (b[i] - ai));
  while (evaluations < maxEvaluations) {
    const order = values.map((_, i) => i).sort((i, j) => values[i] - values[j]);
    simplex = order.map((i) => simplex[i]);
    values = order.map((i) => values[i]);
    const best = simplex[0];
    const spread = Math.max(...simplex.map((x) => Math.max(...x.map((xi, i) => Math.abs(xi - best[i])))));
    if (values[n] - values[0] <= fTol && spread <= xTol) break;
    const centroid = best.map((_, i) => simplex.slice(0, n).reduce((s, x) => s + x[i], 0) / n);
    const worst = simplex[n];
    const reflected = combine(centroid, worst, -REFLECTION);
    const fr = value(reflected);
    if (fr < values[0]) {
      const expanded = combine(centroid, worst, -EXPANSION);
      const fe = value(expanded);
      [simplex[n], values[n]] = fe < fr ? [expanded, fe] : [reflected, fr];
    } else if (fr < values[n - 1]) {
      [simplex[n], values[n]] = [reflected, fr];
    } else {
      const outside = fr < values[n];
      const contracted = outside ? combine(centroid, reflected, CONTRACTION) : combine(centroid, worst, CONTRACTION);
      const fc = value(contracted);
      if (fc < (outside ? fr : values[n])) {
        [simplex[n], values[n]] = [contracted, fc];
      } else {
        for (let i = 1; i <= n; i++) {
          simplex[i] = combine(best, simplex[i], SHRINK);
          values[i] = value(simplex[i]);
        }
      }
    }
  }
  let at = 0;
  for (let i = 1; i <= n; i++) if (values[i] < values[at]) at = i;
  return { x: simplex[at], value: values[at], evaluations };
}
