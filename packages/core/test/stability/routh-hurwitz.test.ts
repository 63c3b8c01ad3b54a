import { describe, expect, it } from "vitest";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { isStable } from "../../src/simulation/is-stable.js";
import { routhHurwitz } from "../../src/stability/routh-hurwitz.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";
import { polynomialFromRandomRoots } from "./random-polynomials.js";

/** Number of eigenvalues (companion-matrix roots) with positive real part. */
const rhpCount = (coeffs: number[]): number => polynomialRoots(coeffs).filter((p) => p.re > 0).length;

describe("routhHurwitz on cubics", () => {
  it("routhHurwitz(s³ + a₂s² + a₁s + a₀) is stable iff all aᵢ > 0 and a₂a₁ > a₀, in agreement with the eigenvalues, on 1000 random cubics", () => {
    // Routh (1877) / Ogata (2010) §5-6: the cubic s³ + a₂s² + a₁s + a₀ is Hurwitz iff a₂, a₁, a₀ > 0
    // and a₂a₁ > a₀. Cross-checked with the eigenvalues of the companion matrix (polynomialRoots).
    const rand = seededRandom(20260311);
    let stableCount = 0;
    let checked = 0;
    while (checked < 1000) {
      const [a2, a1, a0] = [rand(), rand(), rand()].map((u) => -1 + 4 * u);
      // Stay off the boundary, where rounding decides (a measure-zero set).
      if (Math.min(Math.abs(a2), Math.abs(a1), Math.abs(a0), Math.abs(a2 * a1 - a0)) < 1e-6) continue;
      const formula = a2 > 0 && a1 > 0 && a0 > 0 && a2 * a1 > a0;
      const result = routhHurwitz([1, a2, a1, a0]);
      expect(result.stable).toBe(formula);
      expect(isStable(polynomialRoots([1, a2, a1, a0]))).toBe(formula);
      expect(result.rhpRoots).toBe(rhpCount([1, a2, a1, a0]));
      if (formula) stableCount++;
      checked++;
    }
    // The draw covers both verdicts well (not a vacuous agreement).
    expect(stableCount).toBeGreaterThan(100);
    expect(stableCount).toBeLessThan(900);
  });
});

describe("routhHurwitz counts right-half-plane roots", () => {
  it("routhHurwitz(p).rhpRoots equals the number of right-half-plane roots for 600 random polynomials of degree 1…8", () => {
    // Routh's theorem (Routh 1877; Ogata 2010 §5-6): sign changes in the first column = roots with
    // Re s > 0. The polynomials are built from known roots with |Re| ≥ 0.2 (none near the axis).
    const rand = seededRandom(8);
    for (let trial = 0; trial < 600; trial++) {
      const degree = 1 + (trial % 8);
      const { coeffs, rhpRoots } = polynomialFromRandomRoots(rand, degree);
      const result = routhHurwitz(coeffs);
      expect(result.rhpRoots, `p = [${coeffs.join(", ")}]`).toBe(rhpRoots);
      expect(result.stable).toBe(rhpRoots === 0);
      expect(result.imaginaryAxisRoots).toBe(false);
      expect(result.table).toHaveLength(degree + 1);
    }
  });
});

describe("routhHurwitz special cases", () => {
  it("routhHurwitz(s⁴ + s³ + 2s² + 2s + 3) replaces the zero pivot by ε and finds two right-half-plane roots", () => {
    // Common textbook example of the ε rule (Ogata 2010 §5-6; from memory): rows 1 2 3 / 1 2 / 0→ε 3 /
    // 2 − 3/ε / 3 — two sign changes. Cross-checked with the eigenvalues.
    const result = routhHurwitz([1, 1, 2, 2, 3]);
    expect(result.special).toBe("zero-pivot");
    expect(result.stable).toBe(false);
    expect(result.rhpRoots).toBe(2);
    expect(rhpCount([1, 1, 2, 2, 3])).toBe(2);
    expect(result.table[2][0]).toBeGreaterThan(0);
    expect(result.table[2][0]).toBeLessThan(1e-6);
    expect(result.table[3][0]).toBeLessThan(-1e6);
    expectClose(result.table[4][0], 3, 1e-9);
  });

  it("routhHurwitz(s³ + s² + s + 1) meets a zero row, uses dA/ds of A = s² + 1 and reports roots ±j: marginal, not stable", () => {
    // Closed form: s³ + s² + s + 1 = (s + 1)(s² + 1), roots −1, ±j. Row s¹ vanishes; A(s) = s² + 1,
    // dA/ds = 2s gives the row [2] (Ogata 2010 §5-6).
    const result = routhHurwitz([1, 1, 1, 1]);
    expect(result.special).toBe("zero-row");
    expect(result.stable).toBe(false);
    expect(result.rhpRoots).toBe(0);
    expect(result.imaginaryAxisRoots).toBe(true);
    expect(result.table[2]).toEqual([2]);
    expect(result.table[3]).toEqual([1]);
  });

  it("routhHurwitz(s⁵ + 2s⁴ + 24s³ + 48s² − 25s − 50) finds the auxiliary 2s⁴ + 48s² − 50, one right-half-plane root and roots on the axis", () => {
    // Textbook zero-row example (Ogata 2010 §5-6, from memory); closed form:
    // (s² − 1)(s² + 25)(s + 2) = s⁵ + 2s⁴ + 24s³ + 48s² − 25s − 50, roots ±1, ±5j, −2.
    const result = routhHurwitz([1, 2, 24, 48, -25, -50]);
    expect(result.special).toBe("zero-row");
    expect(result.table[1]).toEqual([2, 48, -50]); // row s⁴ = A(s)
    expect(result.table[2]).toEqual([8, 96]); // row s³: dA/ds = 8s³ + 96s
    expect(result.rhpRoots).toBe(1);
    expect(result.imaginaryAxisRoots).toBe(true);
    expect(result.stable).toBe(false);
  });

  it("routhHurwitz marks 1/(s + 1)³ under kp = 8 marginal: s³ + 3s² + 3s + 9 = (s + 3)(s² + 3)", () => {
    // Closed form: a₂a₁ = a₀ exactly, a pair at ±j√3 (Routh 1877).
    const result = routhHurwitz([1, 3, 3, 9]);
    expect(result.special).toBe("zero-row");
    expect(result.imaginaryAxisRoots).toBe(true);
    expect(result.stable).toBe(false);
    expect(result.rhpRoots).toBe(0);
  });

  it("routhHurwitz finds double roots ±j in (s + 2)(s² + 1)² through two zero rows", () => {
    // Closed form: (s + 2)(s⁴ + 2s² + 1) = s⁵ + 2s⁴ + 2s³ + 4s² + s + 2.
    const result = routhHurwitz([1, 2, 2, 4, 1, 2]);
    expect(result.special).toBe("zero-row");
    expect(result.rhpRoots).toBe(0);
    expect(result.imaginaryAxisRoots).toBe(true);
  });

  it("routhHurwitz treats roots at s = 0 as roots on the axis", () => {
    // s(s + 1) and s²(s² + s + 1): roots at the origin are on the imaginary axis (closed form).
    for (const coeffs of [[1, 1, 0], [1, 1, 1, 0, 0], [1, 0]]) {
      const result = routhHurwitz(coeffs);
      expect(result.stable).toBe(false);
      expect(result.imaginaryAxisRoots).toBe(true);
      expect(result.rhpRoots).toBe(0);
    }
    // s(s − 1): one root at 0, one at +1.
    const mixed = routhHurwitz([1, -1, 0]);
    expect(mixed.rhpRoots).toBe(1);
    expect(mixed.imaginaryAxisRoots).toBe(true);
  });

  it("routhHurwitz calls s⁴ + 5s² + 4 = (s² + 1)(s² + 4) marginal (zero second row)", () => {
    const result = routhHurwitz([1, 0, 5, 0, 4]);
    expect(result.special).toBe("zero-row");
    expect(result.table[1]).toEqual([4, 10]);
    expect(result.imaginaryAxisRoots).toBe(true);
    expect(result.rhpRoots).toBe(0);
  });
});

describe("routhHurwitz on low degrees and input handling", () => {
  it("routhHurwitz handles degree 0, 1 and 2 by the closed forms", () => {
    // Degree 0: no roots. Degree 1: a₀s + a₁ has root −a₁/a₀. Degree 2: stable iff the three
    // coefficients share one sign (Routh 1877; Ogata 2010 §5-6).
    expect(routhHurwitz([5])).toMatchObject({ stable: true, rhpRoots: 0, table: [[5]] });
    expect(routhHurwitz([2, 1])).toMatchObject({ stable: true, rhpRoots: 0 });
    expect(routhHurwitz([2, -1])).toMatchObject({ stable: false, rhpRoots: 1 });
    expect(routhHurwitz([1, 3, 2]).stable).toBe(true);
    expect(routhHurwitz([1, -3, 2])).toMatchObject({ stable: false, rhpRoots: 2 });
    expect(routhHurwitz([1, 3, -2])).toMatchObject({ stable: false, rhpRoots: 1 });
  });

  it("routhHurwitz drops leading zeros and ignores an overall sign", () => {
    // −p(s) has the roots of p(s).
    expect(routhHurwitz([0, 0, 1, 3, 3, 1]).table).toHaveLength(4);
    expect(routhHurwitz([-1, -3, -3, -1]).stable).toBe(true);
    expect(routhHurwitz([-1, 1, -3, -1]).rhpRoots).toBe(rhpCount([-1, 1, -3, -1]));
  });

  it("routhHurwitz short-circuits a missing or sign-changing coefficient to not stable", () => {
    // Stodola's necessary condition: s³ + s + 1 lacks s², so it is not Hurwitz (2 RHP roots).
    const result = routhHurwitz([1, 0, 1, 1]);
    expect(result.stable).toBe(false);
    expect(result.rhpRoots).toBe(rhpCount([1, 0, 1, 1]));
  });

  it("routhHurwitz names coeffs for the zero polynomial and non-finite entries", () => {
    expect(() => routhHurwitz([0, 0])).toThrow(/coeffs/);
    expect(() => routhHurwitz([])).toThrow(/coeffs/);
    expect(() => routhHurwitz([1, Number.NaN])).toThrow(/coeffs\[1\]/);
  });
});
