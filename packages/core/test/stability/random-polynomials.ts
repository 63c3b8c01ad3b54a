import { polynomialMultiply } from "../../src/linear-algebra/polynomial-multiply.js";

/** A real polynomial built from chosen roots, with the count of its right-half-plane roots. */
export interface PolynomialWithRoots {
  coeffs: number[];
  rhpRoots: number;
}

/**
 * Random real polynomial of the given degree from random roots: real roots and complex pairs whose
 * real parts have magnitude in [minReal, 3] (so no root is near the imaginary axis) and random sign,
 * times a random leading factor of either sign. rand: uniform [0, 1) generator.
 */
export function polynomialFromRandomRoots(rand: () => number, degree: number, minReal = 0.2): PolynomialWithRoots {
  let coeffs = [1];
  let rhpRoots = 0;
  let remaining = degree;
  while (remaining > 0) {
    const re = (rand() < 0.5 ? -1 : 1) * (minReal + (3 - minReal) * rand());
    if (remaining >= 2 && rand() < 0.5) {
      const im = 0.1 + 3 * rand();
      coeffs = polynomialMultiply(coeffs, [1, -2 * re, re * re + im * im]);
      if (re > 0) rhpRoots += 2;
      remaining -= 2;
    } else {
      coeffs = polynomialMultiply(coeffs, [1, -re]);
      if (re > 0) rhpRoots += 1;
      remaining -= 1;
    }
  }
  const lead = (rand() < 0.5 ? -1 : 1) * (0.5 + 2 * rand());
  return { coeffs: coeffs.map((c) => c * lead), rhpRoots };
}
