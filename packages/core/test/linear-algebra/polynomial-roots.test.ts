import { describe, expect, it } from "vitest";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { expectClose } from "../support/expect-close.js";

describe("polynomialRoots", () => {
  it("polynomialRoots([1, 6, 11, 6]) finds −1, −2, −3", () => {
    // Closed form: s³ + 6s² + 11s + 6 = (s + 1)(s + 2)(s + 3).
    const roots = polynomialRoots([1, 6, 11, 6]);
    expect(roots).toHaveLength(3);
    [-3, -2, -1].forEach((r, i) => {
      expectClose(roots[i].re, r, 1e-12);
      expectClose(roots[i].im, 0, 1e-12);
    });
  });

  it("polynomialRoots([1, 0, 1]) finds the conjugate pair ±j", () => {
    // Closed form: s² + 1 = (s − j)(s + j).
    const roots = polynomialRoots([1, 0, 1]);
    expectClose(roots[0].re, 0, 1e-14);
    expectClose(roots[0].im, -1, 1e-14);
    expectClose(roots[1].im, 1, 1e-14);
  });

  it("polynomialRoots([1, 0, 0, -1]) finds the cube roots of unity", () => {
    // Closed form: s³ − 1 = 0 ⇒ s = 1, −1/2 ± j√3/2.
    const roots = polynomialRoots([1, 0, 0, -1]);
    expectClose(roots[0].re, -0.5, 1e-13);
    expectClose(roots[0].im, -Math.sqrt(3) / 2, 1e-13);
    expectClose(roots[1].re, -0.5, 1e-13);
    expectClose(roots[1].im, Math.sqrt(3) / 2, 1e-13);
    expectClose(roots[2].re, 1, 1e-13);
  });

  it("polynomialRoots drops leading zeros and handles degree 0 and 1", () => {
    // 0·s³ + 0·s² + s − 2 = s − 2 ⇒ s = 2; a non-zero constant has no roots.
    expect(polynomialRoots([0, 0, 1, -2])).toEqual([{ re: 2, im: 0 }]);
    expect(polynomialRoots([5])).toEqual([]);
    expect(polynomialRoots([0, 3])).toEqual([]);
  });

  it("polynomialRoots takes trailing zeros out as exact roots at 0", () => {
    // s⁴ − s³ = s³(s − 1): a triple root at exactly 0, not one scattered by rounding.
    const roots = polynomialRoots([1, -1, 0, 0, 0]);
    expect(roots.filter((r) => r.re === 0 && r.im === 0)).toHaveLength(3);
    expectClose(roots[3].re, 1, 1e-15);
  });

  it("polynomialRoots is not thrown by widely spread coefficients", () => {
    // (s + 1e-3)(s + 1)(s + 1e3), coefficients spanning 9 decades; balancing keeps all three accurate.
    const roots = polynomialRoots([1, 1001.001, 1001.001, 1]);
    expectClose(roots[0].re, -1e3, 0, 1e-10);
    expectClose(roots[1].re, -1, 0, 1e-10);
    expectClose(roots[2].re, -1e-3, 0, 1e-9);
  });

  it("polynomialRoots finds the roots of Wilkinson's degree-10 polynomial to its conditioning", () => {
    // ∏_{k=1}^{10} (s − k): an ill-conditioned classic (J. H. Wilkinson, Rounding Errors in
    // Algebraic Processes, 1963); relative accuracy 1e-7 is within what its conditioning allows.
    let p = [1];
    for (let k = 1; k <= 10; k++) {
      const q = new Array(p.length + 1).fill(0);
      p.forEach((c, i) => {
        q[i] += c;
        q[i + 1] -= k * c;
      });
      p = q;
    }
    const roots = polynomialRoots(p);
    roots.forEach((r, i) => {
      expectClose(r.re, i + 1, 0, 1e-7);
      expectClose(r.im, 0, 1e-6);
    });
  });

  it("polynomialRoots rejects the zero polynomial and non-finite coefficients naming coeffs", () => {
    expect(() => polynomialRoots([0, 0])).toThrow(RangeError);
    expect(() => polynomialRoots([1, NaN])).toThrow(/coeffs\[1\]/);
  });
});
