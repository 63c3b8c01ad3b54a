import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";

/**
 * A state-space realisation of the proper rational function num(s)/den(s) in controllable
 * (controller) canonical form. With den normalised to sⁿ + a₁ sⁿ⁻¹ + … + aₙ and num padded to
 * b₀ sⁿ + b₁ sⁿ⁻¹ + … + bₙ (both divided by the leading denominator coefficient):
 *
 *       ⎡ −a₁  −a₂  …  −aₙ ⎤        ⎡1⎤
 *   A = ⎢  1    0   …   0  ⎥ ,  B = ⎢0⎥ ,  C = [b₁ − a₁b₀, …, bₙ − aₙb₀],  D = b₀,
 *       ⎢  ⋮    ⋱        ⋮  ⎥        ⎢⋮⎥
 *       ⎣  0    …   1   0  ⎦        ⎣0⎦
 *
 * so that C (sI − A)⁻¹ B + D = num(s)/den(s). D ≠ 0 exactly when deg num = deg den.
 * A constant den (n = 0) gives the static gain D = b₀/a₀ with no states.
 * The dead time of a plant is not part of this realisation.
 *
 * tf: coefficients in descending powers of s; den non-zero, deg num ≤ deg den.
 * Throws a RangeError naming `den` or `num` otherwise.
 *
 * References: G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, 4th ed., Prentice Hall, 2002, §7.4 (control canonical form); T. Kailath,
 * Linear Systems, Prentice Hall, 1980, §2.1.
 */
export function transferFunctionToStateSpace(tf: { num: readonly number[]; den: readonly number[] }): SisoStateSpace {
  const den = trimLeadingZeros(tf.den);
  const numTrimmed = trimLeadingZeros(tf.num);
  if (den.length === 0) throw new RangeError("den: the denominator must not be all zeros");
  if (numTrimmed.length > den.length) {
    throw new RangeError(`num: improper rational function, degree ${numTrimmed.length - 1} > ${den.length - 1}`);
  }
  const n = den.length - 1;
  const lead = den[0];
  const aCoef = den.map((v) => v / lead);
  const bCoef = new Array<number>(n + 1).fill(0);
  for (let i = 0; i < numTrimmed.length; i++) bCoef[n + 1 - numTrimmed.length + i] = numTrimmed[i] / lead;

  const a = new Float64Array(n * n);
  const b = new Float64Array(n);
  const c = new Float64Array(n);
  const d = bCoef[0];
  for (let j = 0; j < n; j++) {
    a[j] = -aCoef[j + 1];
    c[j] = bCoef[j + 1] - aCoef[j + 1] * d;
  }
  for (let i = 1; i < n; i++) a[i * n + i - 1] = 1;
  if (n > 0) b[0] = 1;
  return { n, a, b, c, d };
}
