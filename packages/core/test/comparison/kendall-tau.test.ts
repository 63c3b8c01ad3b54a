import { describe, expect, it } from "vitest";
import { kendallTau, kendallTauMatrix } from "../../src/comparison/kendall-tau.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

/**
 * The direct O(n²) count of the definition: every pair (i, j) is concordant, discordant or tied
 * in x, in y or in both, and τ_b = (C − D)/√((n₀ − n₁)(n₀ − n₂)) — M. G. Kendall, "The treatment
 * of ties in ranking problems", Biometrika 33(3), 239–251, 1945. Pairs with a NaN are left out.
 */
function directTauB(x: readonly number[], y: readonly number[]): number {
  const keep = x.map((_, i) => i).filter((i) => !Number.isNaN(x[i]) && !Number.isNaN(y[i]));
  let concordant = 0;
  let discordant = 0;
  let tiedX = 0;
  let tiedY = 0;
  for (let a = 0; a < keep.length; a++) {
    for (let b = a + 1; b < keep.length; b++) {
      const dx = Math.sign(x[keep[b]] - x[keep[a]] || 0);
      const dy = Math.sign(y[keep[b]] - y[keep[a]] || 0);
      const sx = x[keep[a]] === x[keep[b]] ? 0 : dx;
      const sy = y[keep[a]] === y[keep[b]] ? 0 : dy;
      if (sx === 0) tiedX++;
      if (sy === 0) tiedY++;
      if (sx !== 0 && sy !== 0) {
        if (sx === sy) concordant++;
        else discordant++;
      }
    }
  }
  const n0 = (keep.length * (keep.length - 1)) / 2;
  return (concordant - discordant) / Math.sqrt((n0 - tiedX) * (n0 - tiedY));
}

describe("kendallTau (Knight 1966, τ_b)", () => {
  it("kendallTau(x, y) equals the direct O(n²) count on seeded random data with and without ties", () => {
    const random = seededRandom(1966);
    for (let trial = 0; trial < 200; trial++) {
      const n = 2 + Math.floor(random() * 120);
      // Every third trial draws from few levels, so ties in x, in y and in both are common.
      const levels = trial % 3 === 0 ? 1 + Math.floor(random() * 6) : 0;
      const draw = () => (levels > 0 ? Math.floor(random() * levels) : random() * 10 - 5);
      const x = Array.from({ length: n }, draw);
      const y = Array.from({ length: n }, (_, i) => (trial % 2 === 0 ? draw() : x[i] + 0.7 * draw()));
      const expected = directTauB(x, y);
      const actual = kendallTau(x, y);
      if (Number.isNaN(expected)) expect(actual).toBeNaN();
      else expectClose(actual, expected, 1e-12);
    }
  });

  it("kendallTau(x, f(x)) is 1 for a strictly increasing f and −1 for a strictly decreasing one", () => {
    const random = seededRandom(7);
    const x = Array.from({ length: 1000 }, () => random() * 4 - 2);
    expect(kendallTau(x, x.map((v) => Math.exp(3 * v) + v ** 3))).toBe(1);
    expect(kendallTau(x, x.map((v) => -Math.atan(v) - v))).toBe(-1);
  });

  it("kendallTau gives the textbook value on a small hand-counted sample", () => {
    // x = 1…5, y = (1, 3, 2, 5, 4): of the 10 pairs, 2 are discordant ((3,2), (5,4)), so
    // τ = (8 − 2)/10 = 0.6 (no ties; hand count, from the definition of Kendall 1938).
    expect(kendallTau([1, 2, 3, 4, 5], [1, 3, 2, 5, 4])).toBeCloseTo(0.6, 14);
  });

  it("kendallTau drops pairs with NaN and ranks ±Infinity as extreme values tied with each other", () => {
    const x = [1, 2, NaN, 3, 4, 5, 6];
    const y = [1, 2, 99, NaN, 3, Infinity, Infinity];
    // After dropping positions 2 and 3: x = (1, 2, 4, 5, 6), y = (1, 2, 3, ∞, ∞) — one tie in y.
    expectClose(kendallTau(x, y), directTauB([1, 2, 4, 5, 6], [1, 2, 3, Infinity, Infinity]), 1e-15);
    expectClose(kendallTau(x, y), 9 / Math.sqrt(10 * 9), 1e-15);
  });

  it("kendallTau is NaN when a sample is constant or fewer than two pairs remain", () => {
    expect(kendallTau([1, 1, 1], [1, 2, 3])).toBeNaN();
    expect(kendallTau([1], [2])).toBeNaN();
    expect(kendallTau([1, NaN], [NaN, 2])).toBeNaN();
    expect(() => kendallTau([1, 2], [1])).toThrow(RangeError);
  });

  it("kendallTauMatrix holds kendallTau of every pair, symmetric, 1 on the diagonal", () => {
    const random = seededRandom(42);
    const n = 300;
    const base = Array.from({ length: n }, () => random());
    const samples = [
      base,
      base.map((v) => v + 0.3 * random()),
      base.map((v) => -v + 0.5 * random()),
      base.map((v, i) => (i % 17 === 0 ? NaN : Math.round(v * 4))),
    ];
    const m = kendallTauMatrix(samples);
    for (let a = 0; a < 4; a++) {
      expect(m[a * 4 + a]).toBe(1);
      for (let b = 0; b < 4; b++) {
        expect(m[a * 4 + b]).toBe(m[b * 4 + a]);
        expectClose(m[a * 4 + b], directTauB(samples[a], samples[b]), 1e-12);
      }
    }
  });
});
