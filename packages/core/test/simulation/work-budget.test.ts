import { describe, expect, it } from "vitest";
import { compileSystem } from "../../src/expressions/compile-system.js";
import { openLoopStep } from "../../src/plants/open-loop-step.js";
import { DormandPrince } from "../../src/simulation/dormand-prince.js";
import { withWorkBudget } from "../../src/simulation/work-budget.js";
import type { NonlinearPlant } from "../../src/plants/nonlinear.js";

/** x' = −x + u typed as an expression: the step from 0 is 1 − e^(−t) (closed form). */
const LAG: NonlinearPlant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + u"], output: "x", initial: [0] };

describe("withWorkBudget", () => {
  it("counts exactly the right-hand-side evaluations DormandPrince counts, and leaves the result untouched", () => {
    const sys = compileSystem({ states: ["x"], parameters: [], derivatives: ["-x + u"], output: "x" });
    const free = new DormandPrince(sys, new Float64Array(0));
    const x = Float64Array.of(0);
    free.advance(x, 0, 5, 1);
    const budgeted = withWorkBudget({ evaluations: 1_000_000 }, () => {
      const solver = new DormandPrince(sys, new Float64Array(0));
      const y = Float64Array.of(0);
      solver.advance(y, 0, 5, 1);
      return y[0];
    });
    expect(budgeted).toEqual({ ok: true, value: x[0], evaluations: free.evaluations });
    // Closed form x(5) = 1 − e^(−5), to the solver's default tolerance.
    expect(Math.abs(x[0]! - (1 - Math.exp(-5)))).toBeLessThan(1e-7);
  });

  it("when a computation passes its budget, then it stops there and says how many evaluations it needed more than", () => {
    const full = withWorkBudget({ evaluations: 10_000_000 }, () => openLoopStep(LAG, 10, 0.01));
    expect(full.ok).toBe(true);
    const limit = Math.floor(full.evaluations / 2);
    const cut = withWorkBudget({ evaluations: limit }, () => openLoopStep(LAG, 10, 0.01));
    expect(cut.ok).toBe(false);
    if (!cut.ok) expect(cut.reason).toBe(`it needs more than ${limit.toLocaleString("en-GB")} right-hand-side evaluations`);
    expect(cut.evaluations).toBeGreaterThan(limit);
    expect(cut.evaluations).toBeLessThanOrEqual(limit + 6);
  });

  it("when no budget is active, then nothing is limited; a bad budget is refused with a RangeError naming it", () => {
    expect(() => openLoopStep(LAG, 10, 0.01)).not.toThrow();
    expect(() => withWorkBudget({ evaluations: 0 }, () => 1)).toThrow(/budget\.evaluations must be a whole number ≥ 1/);
  });
});
