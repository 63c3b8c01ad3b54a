import { describe, expect, it } from "vitest";
import { compileSystem } from "../../src/expressions/compile-system.js";
import { DormandPrince } from "../../src/simulation/dormand-prince.js";
import { expectClose } from "../support/expect-close.js";

describe("DormandPrince", () => {
  it("integrates x' = −x + u to the closed form x(t) = u + (x₀ − u)e^(−t) within tolerance and budget", () => {
    const sys = compileSystem({ states: ["x"], parameters: [], derivatives: ["-x + u"], output: "x" });
    const solver = new DormandPrince(sys, new Float64Array(0), { rtol: 1e-10, atol: 1e-12 });
    const x = Float64Array.of(2);
    for (let k = 0; k < 100; k++) expect(solver.advance(x, k * 0.05, (k + 1) * 0.05, 0.5)).toBe(true);
    expectClose(x[0], 0.5 + 1.5 * Math.exp(-5), 1e-9);
    expect(solver.evaluations).toBeLessThan(100 * 7 * 3);
  });

  it("integrates the harmonic oscillator x'' = −x over a period back to its start (closed form cos, sin)", () => {
    const sys = compileSystem({ states: ["p", "q"], parameters: [], derivatives: ["q", "-p"], output: "p" });
    const solver = new DormandPrince(sys, new Float64Array(0), { rtol: 1e-11, atol: 1e-12 });
    const x = Float64Array.of(1, 0);
    expect(solver.advance(x, 0, 2 * Math.PI, 0)).toBe(true);
    expectClose(x[0], 1, 1e-8);
    expectClose(x[1], 0, 1e-8);
  });

  it("reports failure instead of throwing when the state blows up (x' = x², x₀ = 1 escapes at t = 1)", () => {
    const sys = compileSystem({ states: ["x"], parameters: [], derivatives: ["x^2"], output: "x" });
    const solver = new DormandPrince(sys, new Float64Array(0));
    const x = Float64Array.of(1);
    expect(solver.advance(x, 0, 2, 0)).toBe(false);
  });
});
