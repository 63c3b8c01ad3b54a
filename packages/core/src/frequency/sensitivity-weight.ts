import { assertFiniteCoefficients, trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";

/**
 * A frequency weight W(s) = num(s)/den(s) on the sensitivity, descending powers of s. The weighted
 * sensitivity norm ‖W·S‖∞ = sup_ω |W(jω)·S(jω)| is below 1 exactly when |S(jω)| < 1/|W(jω)| at
 * every frequency: 1/|W| is the upper bound the designer puts on |S|.
 */
export interface SensitivityWeight {
  num: readonly number[];
  den: readonly number[];
}

/**
 * Checks a weight and returns it trimmed: finite coefficients, den not all zero, proper
 * (deg num ≤ deg den, so |W| stays bounded at high frequency). Throws a RangeError naming
 * `weight.num` or `weight.den`.
 */
export function assertValidWeight(weight: SensitivityWeight): { num: number[]; den: number[] } {
  if (weight === null || typeof weight !== "object") throw new TypeError("weight must be { num, den }");
  assertFiniteCoefficients(weight.num, "weight.num");
  assertFiniteCoefficients(weight.den, "weight.den");
  const num = trimLeadingZeros(weight.num);
  const den = trimLeadingZeros(weight.den);
  if (den.length === 0) throw new RangeError("weight.den: the denominator must not be all zeros");
  if (num.length === 0) throw new RangeError("weight.num: the weight must not be zero");
  if (num.length > den.length) {
    throw new RangeError(`weight.num: the weight must be proper, numerator degree ${num.length - 1} exceeds denominator degree ${den.length - 1}`);
  }
  return { num, den };
}

/** |num(jω)/den(jω)| by Horner's scheme in complex arithmetic (unchecked). */
export function weightMagnitude(num: readonly number[], den: readonly number[], omega: number): number {
  return Math.hypot(...horner(num, omega)) / Math.hypot(...horner(den, omega));
}

function horner(p: readonly number[], omega: number): [number, number] {
  let re = 0;
  let im = 0;
  for (const c of p) {
    const r = -im * omega + c;
    im = re * omega;
    re = r;
  }
  return [re, im];
}
