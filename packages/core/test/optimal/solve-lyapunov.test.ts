import { describe, expect, it } from "vitest";
import { solveLyapunov } from "../../src/optimal/solve-lyapunov.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

describe("solveLyapunov", () => {
  it("solveLyapunov on one state gives p = −q/(2a)", () => {
    // Closed form: n = 1, a·p + p·a + q = 0 ⇒ p = −q/(2a).
    for (const [a, q] of [[-2, 3], [-0.1, 1], [-50, 0.2]]) {
      const result = solveLyapunov([[a]], [[q]]);
      expect(result.ok).toBe(true);
      if (result.ok) expectClose(result.P[0][0], -q / (2 * a), 1e-15, 1e-13);
    }
  });

  it("solveLyapunov on a diagonal A gives p_ij = −q_ij/(a_i + a_j)", () => {
    // Closed form: with A = diag(a), (AᵀP + PA)_ij = (a_i + a_j) p_ij.
    const a = [-1, -2, -5];
    const q = [[2, 1, 0.5], [1, 3, -1], [0.5, -1, 4]];
    const result = solveLyapunov(a.map((v, i) => a.map((_, j) => (i === j ? v : 0))), q);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expectClose(result.P[i][j], -q[i][j] / (a[i] + a[j]), 1e-14, 1e-12);
  });

  it("solveLyapunov leaves a residual below 1e-12 on random stable matrices", () => {
    // Invariant: the returned relative residual ‖AᵀP + PA + Q‖/(2‖A‖‖P‖ + ‖Q‖) is at rounding level.
    const random = seededRandom(1972);
    for (let trial = 0; trial < 40; trial++) {
      const n = 1 + Math.floor(random() * 8);
      const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => random() * 2 - 1 - (i === j ? n : 0)));
      const m = Array.from({ length: n }, () => Array.from({ length: n }, () => random() * 2 - 1));
      const q = m.map((_, i) => m.map((__, j) => m.reduce((s, row) => s + row[i] * row[j], 0)));
      const result = solveLyapunov(a, q);
      expect(result.ok).toBe(true);
      if (result.ok) expect(result.residual).toBeLessThan(1e-12);
    }
  });

  it("solveLyapunov reports no unique solution when A has a pole at 0", () => {
    // λᵢ + λⱼ = 0 for λ = 0: the vectorised operator is singular (Golub & Van Loan 2013, §7.6.3).
    const result = solveLyapunov([[0, 1], [0, -1]], [[1, 0], [0, 1]]);
    expect(result.ok).toBe(false);
  });

  it("solveLyapunov names Q when it is not symmetric", () => {
    expect(() => solveLyapunov([[-1, 0], [0, -1]], [[1, 2], [0, 1]])).toThrow(/Q must be symmetric/);
  });
});
