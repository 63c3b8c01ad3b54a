import { describe, expect, it } from "vitest";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { isStable } from "../../src/simulation/is-stable.js";
import { isHurwitz } from "../../src/stability/is-hurwitz.js";
import { routhHurwitz } from "../../src/stability/routh-hurwitz.js";
import { seededRandom } from "../support/seeded-random.js";
import { polynomialFromRandomRoots } from "./random-polynomials.js";

describe("isHurwitz", () => {
  it("isHurwitz agrees with routhHurwitz(p).stable and with the eigenvalues on 2000 random polynomials of degree 0…10", () => {
    // Routh (1877): the same first column; eigenvalues of the companion matrix as the independent check.
    const rand = seededRandom(99);
    let stableCount = 0;
    for (let trial = 0; trial < 2000; trial++) {
      const degree = trial % 11;
      // Half of the draws are stable by construction (roots in the left half-plane).
      const coeffs =
        trial % 2 === 0
          ? polynomialFromRandomRoots(rand, degree).coeffs
          : Array.from({ length: degree + 1 }, () => -0.3 + 3 * rand());
      const verdict = isHurwitz(coeffs);
      expect(verdict).toBe(routhHurwitz(coeffs).stable);
      if (degree > 0) expect(verdict).toBe(isStable(polynomialRoots(coeffs)));
      if (verdict) stableCount++;
    }
    expect(stableCount).toBeGreaterThan(200);
  });

  it("isHurwitz calls the special cases not stable: zero pivot, zero row, roots at 0", () => {
    // s⁴ + s³ + 2s² + 2s + 3 (2 RHP roots), (s + 1)(s² + 1), s(s + 1), (s + 3)(s² + 3): closed forms.
    for (const coeffs of [[1, 1, 2, 2, 3], [1, 1, 1, 1], [1, 1, 0], [1, 3, 3, 9]]) expect(isHurwitz(coeffs)).toBe(false);
    expect(isHurwitz([1, 3, 3, 8.999])).toBe(true);
  });

  it("isHurwitz accepts a Float64Array, skips leading zeros and ignores an overall sign", () => {
    expect(isHurwitz(new Float64Array([0, 1, 3, 3, 1]))).toBe(true);
    expect(isHurwitz([-1, -3, -3, -1])).toBe(true);
    expect(isHurwitz([7])).toBe(true);
  });

  it("isHurwitz names coeffs for bad input", () => {
    expect(() => isHurwitz([0, 0])).toThrow(/coeffs/);
    expect(() => isHurwitz([1, Number.POSITIVE_INFINITY, 1])).toThrow(/coeffs\[1\]/);
  });

  it("isHurwitz decides 200,000 quintics within a generous budget of 2 s", () => {
    // Work budget (common practice for sweep code): about 30 multiply-adds per call.
    const p = new Float64Array([1, 5, 10, 10, 5, 1]);
    const start = performance.now();
    let count = 0;
    for (let i = 0; i < 200_000; i++) {
      p[5] = 1 + (i % 7) * 0.1;
      if (isHurwitz(p)) count++;
    }
    expect(count).toBe(200_000);
    expect(performance.now() - start).toBeLessThan(2000);
  });
});
