import { describe, expect, it } from "vitest";
import { solveCare } from "../../src/optimal/solve-care.js";
import { solveRde } from "../../src/optimal/solve-rde.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

const SQRT3 = Math.sqrt(3);

describe("solveCare", () => {
  it("solveCare on the double integrator with Q = I, R = 1 gives K = [1, √3], P = [[√3, 1], [1, √3]]", () => {
    // Closed form (Anderson & Moore 1990, double-integrator example; common practice): with
    // P = [[a, b], [b, c]] the CARE reads, entry by entry: (1,1) 1 − b² = 0 ⇒ b = 1 (stabilising root);
    // (2,2) 2b − c² + 1 = 0 ⇒ c = √3; (1,2) a − b·c = 0 ⇒ a = √3; K = R⁻¹BᵀP = [b, c].
    const result = solveCare([[0, 1], [0, 0]], [[0], [1]], [[1, 0], [0, 1]], [[1]]);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expectClose(result.K[0][0], 1, 1e-12);
    expectClose(result.K[0][1], SQRT3, 1e-12);
    expectClose(result.P[0][0], SQRT3, 1e-12);
    expectClose(result.P[0][1], 1, 1e-12);
    expectClose(result.P[1][0], 1, 1e-12);
    expectClose(result.P[1][1], SQRT3, 1e-12);
    // Closed-loop characteristic polynomial s² + √3 s + 1: poles −√3/2 ± j/2.
    for (const p of result.poles) {
      expectClose(p.re, -SQRT3 / 2, 1e-12);
      expectClose(Math.abs(p.im), 0.5, 1e-12);
    }
  });

  it("solveCare on a scalar plant gives p = (a + √(a² + b²q/r))·r/b²", () => {
    // Closed form: 2ap − p²b²/r + q = 0, the positive root.
    for (const [a, b, q, r] of [[1, 1, 1, 1], [-2, 0.5, 3, 0.1], [5, 2, 0.01, 10]]) {
      const result = solveCare([[a]], [[b]], [[q]], [[r]]);
      expect(result.ok).toBe(true);
      if (result.ok) expectClose(result.P[0][0], ((a + Math.sqrt(a * a + (b * b * q) / r)) * r) / (b * b), 1e-13, 1e-11);
    }
  });

  it("solveCare leaves a relative residual below 1e-9 on 60 random stabilisable systems (n ≤ 6)", () => {
    // Common practice: random B is generically controllable and Q = MᵀM + εI positive definite,
    // so a stabilising solution exists; the residual must be at rounding level and A − BK Hurwitz.
    const random = seededRandom(1968);
    const normal = (): number => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + Math.floor(random() * 6);
      const m = 1 + Math.floor(random() * 2);
      const a = Array.from({ length: n }, () => Array.from({ length: n }, normal));
      const b = Array.from({ length: n }, () => Array.from({ length: m }, normal));
      const w = Array.from({ length: n }, () => Array.from({ length: n }, normal));
      const q = w.map((_, i) => w.map((__, j) => w.reduce((s, row) => s + row[i] * row[j], 0) + (i === j ? 0.01 : 0)));
      const rDiag = Array.from({ length: m }, () => 0.1 + random() * 2);
      const r = rDiag.map((v, i) => rDiag.map((_, j) => (i === j ? v : 0)));
      const result = solveCare(a, b, q, r);
      expect(result.ok, `trial ${trial}`).toBe(true);
      if (!result.ok) continue;
      expect(result.residual).toBeLessThan(1e-9);
      for (const p of result.poles) expect(p.re).toBeLessThan(0);
    }
  });

  it("solveCare names the mode when (A, B) is not stabilisable", () => {
    // PBH (Hautus 1969): the unstable mode at 2 is not reached by B = [1; 0].
    const result = solveCare([[1, 0], [0, 2]], [[1], [0]], [[1, 0], [0, 1]], [[1]]);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/not stabilisable.*λ = 2/);
  });

  it("solveCare names the mode when (Q, A) is not detectable", () => {
    // Q = 0 does not see the double integrator's modes at 0.
    const result = solveCare([[0, 1], [0, 0]], [[0], [1]], [[0, 0], [0, 0]], [[1]]);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/not detectable/);
  });

  it("solveCare names R when it is not positive definite", () => {
    expect(() => solveCare([[0]], [[1]], [[1]], [[0]])).toThrow(/R must be positive definite/);
  });
});

describe("solveRde", () => {
  it("solveRde on x' = u, q = r = 1 gives P(0) = tanh(T)", () => {
    // Closed form: −ṗ = 1 − p², p(T) = 0 ⇒ p(t) = tanh(T − t).
    for (const horizon of [0.1, 1, 3]) {
      const result = solveRde([[0]], [[1]], [[1]], [[1]], horizon);
      expect(result.ok).toBe(true);
      if (result.ok) expectClose(result.P[0][0], Math.tanh(horizon), 1e-14, 1e-12);
    }
  });

  it("solveRde on the double integrator tends to the CARE solution as T grows", () => {
    // Anderson & Moore 1990, §3.1: P(0; T) increases with T to the stabilising CARE solution.
    const care = solveCare([[0, 1], [0, 0]], [[0], [1]], [[1, 0], [0, 1]], [[1]]);
    expect(care.ok).toBe(true);
    if (!care.ok) return;
    let previous = 0;
    for (const horizon of [1, 5, 60]) {
      const rde = solveRde([[0, 1], [0, 0]], [[0], [1]], [[1, 0], [0, 1]], [[1]], horizon);
      expect(rde.ok).toBe(true);
      if (!rde.ok) continue;
      expect(rde.P[1][1]).toBeGreaterThanOrEqual(previous);
      previous = rde.P[1][1];
      if (horizon === 60) for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expectClose(rde.P[i][j], care.P[i][j], 1e-12, 1e-11);
    }
  });

  it("solveRde with a terminal weight F equal to the CARE solution stays at it", () => {
    // The CARE solution is an equilibrium of the Riccati flow.
    const care = solveCare([[1, 2], [0, -1]], [[0], [1]], [[1, 0], [0, 0.5]], [[2]]);
    expect(care.ok).toBe(true);
    if (!care.ok) return;
    const rde = solveRde([[1, 2], [0, -1]], [[0], [1]], [[1, 0], [0, 0.5]], [[2]], 3, care.P);
    expect(rde.ok).toBe(true);
    if (rde.ok) for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expectClose(rde.P[i][j], care.P[i][j], 1e-11, 1e-10);
  });
});
