import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { Complex } from "./complex.js";
import { assertFiniteCoefficients, trimLeadingZeros } from "./polynomial-trim.js";
import { balanceMatrix } from "./balance-matrix.js";

/**
 * All complex roots of a real polynomial p(s) = p₀ sⁿ + p₁ sⁿ⁻¹ + … + pₙ (descending powers),
 * as the eigenvalues of its companion matrix
 *
 *       ⎡ −p₁/p₀  −p₂/p₀  …  −pₙ/p₀ ⎤
 *   C = ⎢   1       0     …    0    ⎥ ,   det(sI − C) = p(s)/p₀,
 *       ⎢   ⋮       ⋱           ⋮    ⎥
 *       ⎣   0       …     1    0    ⎦
 *
 * balanced (Parlett & Reinsch 1969) and handed to the unsymmetric QR algorithm of ml-matrix.
 * Leading zero coefficients are dropped; trailing zeros are exact roots at 0 and are taken out
 * before the eigenvalue step. A constant (degree 0) has no roots: `[]`.
 *
 * Returns the roots sorted by real part, then imaginary part, ascending; multiplicities repeated.
 * Accuracy: a simple root is found to about machine precision times the conditioning of the
 * polynomial; an m-fold root only to about eps^(1/m).
 *
 * Throws a RangeError naming `coeffs` for a non-finite coefficient or the zero polynomial.
 *
 * References: A. Edelman and H. Murakami, "Polynomial roots from companion matrix eigenvalues",
 * Mathematics of Computation 64(210), 763–776, 1995; C. Moler, "Cleve's Corner: ROOTS — of
 * polynomials, that is", MathWorks Newsletter, 1991.
 */
export function polynomialRoots(coeffs: readonly number[]): Complex[] {
  assertFiniteCoefficients(coeffs, "coeffs");
  const p = trimLeadingZeros(coeffs);
  if (p.length === 0) throw new RangeError("coeffs: the zero polynomial has no finite set of roots");

  const roots: Complex[] = [];
  let last = p.length - 1;
  while (last > 0 && p[last] === 0) {
    roots.push({ re: 0, im: 0 });
    last--;
  }
  const degree = last;
  if (degree === 1) {
    roots.push({ re: -p[1] / p[0], im: 0 });
  } else if (degree > 1) {
    const companion = new Float64Array(degree * degree);
    for (let j = 0; j < degree; j++) companion[j] = -p[j + 1] / p[0];
    for (let i = 1; i < degree; i++) companion[i * degree + i - 1] = 1;
    balanceMatrix(companion, degree);
    const rows: number[][] = [];
    for (let i = 0; i < degree; i++) rows.push(Array.from(companion.subarray(i * degree, (i + 1) * degree)));
    const evd = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: false });
    for (let i = 0; i < degree; i++) roots.push({ re: evd.realEigenvalues[i], im: evd.imaginaryEigenvalues[i] });
  }
  return roots.sort((x, y) => x.re - y.re || x.im - y.im);
}
