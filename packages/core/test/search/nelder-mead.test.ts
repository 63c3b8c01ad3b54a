import { describe, expect, it } from "vitest";
import type { ParameterSpace } from "../../src/batch/parameter-space.js";
import { nelderMead, NelderMeadSimplex } from "../../src/search/nelder-mead.js";
import { createNelderMeadSearch, multiStartNelderMead } from "../../src/search/nelder-mead-search.js";

/** Rosenbrock's function, minimum 0 at (1, 1) (H. H. Rosenbrock, The Computer Journal 3(3), 1960). */
const rosenbrock = (x: Float64Array) => 100 * (x[1] - x[0] ** 2) ** 2 + (1 - x[0]) ** 2;

describe("nelderMead", () => {
  it("nelderMead finds Rosenbrock's minimum (1, 1) from (−1.2, 1) within 1e-4", () => {
    // Standard start of Rosenbrock (1960); the exact minimiser is (1, 1) with f = 0 (closed form).
    const r = nelderMead(rosenbrock, [-1.2, 1], { xTolerance: 1e-10, fTolerance: 1e-14, maxIterations: 2000 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.x[0] - 1)).toBeLessThan(1e-4);
    expect(Math.abs(r.x[1] - 1)).toBeLessThan(1e-4);
    expect(r.value).toBeLessThan(1e-8);
    // Work budget: Lagarias et al. (1998) report a few hundred evaluations for this problem; allow 1000.
    expect(r.evaluations).toBeLessThan(1000);
  });

  it("nelderMead minimises a quadratic bowl in 4 dimensions to its centre", () => {
    // f = Σ w_j (x_j − c_j)², minimum at c (closed form).
    const c = [0.3, -2, 5, 1.5];
    const w = [1, 4, 0.5, 2];
    const f = (x: Float64Array) => x.reduce((s, xj, j) => s + w[j] * (xj - c[j]) ** 2, 0);
    const r = nelderMead(f, [0, 0, 0, 0], { step: 1, xTolerance: 1e-9, fTolerance: 1e-16, maxIterations: 5000 });
    c.forEach((cj, j) => expect(r.x[j]).toBeCloseTo(cj, 6));
  });

  it("nelderMead keeps every evaluated point inside the bounds and stops on the bound when the minimum lies beyond", () => {
    // Minimum of (x−3)² + (y+1)² over [0, 2] × [0, 2] is the corner (2, 0) (closed form: projection of (3, −1)).
    let outside = 0;
    const f = (x: Float64Array) => {
      if (x[0] < 0 || x[0] > 2 || x[1] < 0 || x[1] > 2) outside++;
      return (x[0] - 3) ** 2 + (x[1] + 1) ** 2;
    };
    const r = nelderMead(f, [1, 1], { lower: [0, 0], upper: [2, 2], xTolerance: 1e-10 });
    expect(outside).toBe(0);
    expect(r.x[0]).toBeCloseTo(2, 8);
    expect(r.x[1]).toBeCloseTo(0, 8);
  });

  it("NelderMeadSimplex treats a non-finite value as +Infinity and refuses a tell after it is done", () => {
    // The region x < 0 returns NaN (an 'unstable' candidate); the minimum of (x − 1)² is at 1.
    const r = nelderMead((x) => (x[0] < 0 ? NaN : (x[0] - 1) ** 2), [0.05], { step: -0.5 });
    expect(r.x[0]).toBeCloseTo(1, 6);
    const s = new NelderMeadSimplex([0], { maxIterations: 1 });
    for (let guard = 0; guard < 10 && !s.done; guard++) s.tell(s.ask().map((p) => p[0] ** 2));
    expect(s.done).toBe(true);
    expect(s.iterations).toBe(1);
    expect(s.ask()).toEqual([]);
    expect(() => s.tell([1])).toThrow(/done/);
    expect(() => nelderMead(rosenbrock, [0, NaN])).toThrow(/x0\[1\]/);
  });
});

describe("createNelderMeadSearch / multiStartNelderMead", () => {
  const SPACE: ParameterSpace = [
    { name: "a", min: -2, max: 2 },
    { name: "b", min: 0.01, max: 100, scale: "log" },
  ];
  // Minimum at a = 0.5, b = 3 (closed form), b searched in log b.
  const f = (x: Float64Array) => (x[0] - 0.5) ** 2 + Math.log(x[1] / 3) ** 2;

  it("multiStartNelderMead finds the minimum on a linear and a log axis", () => {
    const r = multiStartNelderMead(f, SPACE, { starts: 4, seed: 1 });
    expect(r.x).not.toBeNull();
    expect(r.x![0]).toBeCloseTo(0.5, 4);
    expect(r.x![1]).toBeCloseTo(3, 3);
    expect(r.runs.length).toBe(4);
    expect(r.evaluations).toBe(r.runs.reduce((s, run) => s + run.evaluations, 0));
  });

  it("multiStartNelderMead escapes a local minimum that a single start would keep", () => {
    // f(x) = (x² − 1)² + 0.3·x on [−2, 2]: two valleys near ±1; the global one is near x = −1
    // (the tilt lowers the left valley; closed form of the stationary points not needed).
    const g = (x: Float64Array) => (x[0] ** 2 - 1) ** 2 + 0.3 * x[0];
    const space: ParameterSpace = [{ name: "x", min: -2, max: 2 }];
    const single = nelderMead(g, [1.5], { lower: [-2], upper: [2] });
    expect(single.x[0]).toBeGreaterThan(0);
    const multi = multiStartNelderMead(g, space, { starts: 6, seed: 4 });
    expect(multi.x![0]).toBeLessThan(-0.9);
    expect(multi.value).toBeLessThan(single.value);
  });

  it("the ask/tell search asks d + 1 points per start first, respects the bounds and is deterministic per seed", () => {
    const run = (seed: number) => {
      const search = createNelderMeadSearch(SPACE, { starts: 3, seed, iterations: 50 });
      const asks: number[][] = [];
      let first = true;
      while (!search.done) {
        const c = search.ask();
        if (first) expect(c.length).toBe(3 * 3 * 2);
        first = false;
        for (let i = 0; i < c.length; i += 2) {
          expect(c[i] >= -2 && c[i] <= 2 && c[i + 1] >= 0.01 && c[i + 1] <= 100).toBe(true);
        }
        asks.push(Array.from(c));
        const values = new Float64Array(c.length / 2);
        for (let i = 0; i < values.length; i++) values[i] = f(c.subarray(2 * i, 2 * i + 2));
        search.tell(values);
      }
      return { asks, best: search.best! };
    };
    const a = run(7);
    const b = run(7);
    expect(b.asks).toEqual(a.asks);
    expect(run(8).asks[0]).not.toEqual(a.asks[0]);
    expect(a.best.value).toBeLessThan(1e-6);
  });

  it("the search refuses misuse: tell before ask, ask twice, wrong value count", () => {
    const search = createNelderMeadSearch(SPACE, { starts: 2, seed: 1 });
    expect(() => search.tell(new Float64Array(1))).toThrow(/ask/);
    search.ask();
    expect(() => search.ask()).toThrow(/told/);
    expect(() => search.tell(new Float64Array(5))).toThrow(/values/);
    expect(() => createNelderMeadSearch(SPACE, { starts: 0, seed: 1 })).toThrow(/starts/);
  });
});
