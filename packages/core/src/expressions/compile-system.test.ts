import { describe, expect, it } from "vitest";
import { compileSystem } from "./compile-system.js";
import { DeclaredNameError } from "./declared-name-error.js";
import { ExpressionError } from "./expression-error.js";

// Reference values are hand computations (closed form, stated before each check).

describe("compileSystem", () => {
  // Two tanks in cascade: A1·h1' = −a1·√h1 + b·u ; A2·h2' = a1·√h1 − a2·√h2 ; y = h2
  const cascade = compileSystem({
    states: ["h1", "h2"],
    parameters: ["a1", "a2", "b", "A1", "A2"],
    derivatives: ["(-a1*sqrt(h1) + b*u)/A1", "(a1*sqrt(h1) - a2*sqrt(h2))/A2"],
    output: "h2",
  });
  const p = Float64Array.of(0.5, 0.25, 2, 10, 5);

  it("compileSystem(...).derivatives writes dx/dt into the given array", () => {
    const dx = new Float64Array(2);
    // h1 = 4, h2 = 1, u = 1: dh1 = (−0.5·2 + 2)/10 = 0.1 ; dh2 = (0.5·2 − 0.25·1)/5 = 0.15
    cascade.derivatives(0, Float64Array.of(4, 1), p, 1, dx);
    expect(dx[0]).toBeCloseTo(0.1, 15);
    expect(dx[1]).toBeCloseTo(0.15, 15);
  });

  it("compileSystem(...).derivatives reuses the caller's array and returns nothing", () => {
    const dx = new Float64Array(2);
    const result = cascade.derivatives(0, Float64Array.of(9, 4), p, 0, dx) as unknown;
    expect(result).toBeUndefined();
    // h1 = 9, h2 = 4, u = 0: dh1 = −0.5·3/10 = −0.15 ; dh2 = (0.5·3 − 0.25·2)/5 = 0.2
    expect(dx[0]).toBeCloseTo(-0.15, 15);
    expect(dx[1]).toBeCloseTo(0.2, 15);
  });

  it("compileSystem(...).derivatives is correct even when dx is the state array itself", () => {
    const x = Float64Array.of(4, 1);
    cascade.derivatives(0, x, p, 1, x);
    expect(x[0]).toBeCloseTo(0.1, 15);
    expect(x[1]).toBeCloseTo(0.15, 15);
  });

  it("compileSystem(...).output reads the states, and the time when declared", () => {
    expect(cascade.output(0, Float64Array.of(4, 1.5), p, 0)).toBe(1.5);
    const forced = compileSystem({
      states: ["z"],
      parameters: ["k"],
      derivatives: ["-k*z + u*cos(t)"],
      output: "z + t",
      time: "t",
    });
    const dx = new Float64Array(1);
    // z = 2, k = 3, u = 4, t = 0: dz = −6 + 4 = −2 ; y = 2 + 0
    forced.derivatives(0, Float64Array.of(2), Float64Array.of(3), 4, dx);
    expect(dx[0]).toBe(-2);
    expect(forced.output(1.5, Float64Array.of(2), Float64Array.of(3), 4)).toBe(3.5);
  });

  it("compileSystem reports the counts of states and parameters", () => {
    expect(cascade.stateCount).toBe(2);
    expect(cascade.parameterCount).toBe(5);
  });

  it("compileSystem tags a refused derivative with its field derivatives.<i>", () => {
    try {
      compileSystem({ states: ["h"], parameters: ["a"], derivatives: ["-a*h + k"], output: "h" });
      throw new Error("expected a refusal");
    } catch (error) {
      expect(error).toBeInstanceOf(ExpressionError);
      const refused = error as ExpressionError;
      expect(refused.field).toBe("derivatives.0");
      expect(refused.message).toBe('unknown name "k" at column 8; declared names are h, a, u');
      expect(refused.token).toBe("k");
      expect(refused.index).toBe(7);
    }
  });

  it("compileSystem tags a refused output with the field output", () => {
    expect(() => compileSystem({ states: ["h"], parameters: [], derivatives: ["-h"], output: "h.constructor" }))
      .toThrow(expect.objectContaining({ field: "output", token: ".constructor" }));
  });

  it("compileSystem refuses a count of derivatives that differs from the count of states", () => {
    expect(() => compileSystem({ states: ["h", "v"], parameters: [], derivatives: ["v"], output: "h" }))
      .toThrow(new RangeError("derivatives: expected one expression per state (2), got 1"));
    expect(() => compileSystem({ states: [], parameters: [], derivatives: [], output: "u" }))
      .toThrow(new RangeError("states: declare at least one state"));
  });

  it("compileSystem refuses a bad declared name with its field", () => {
    expect(() => compileSystem({ states: ["h", "h"], parameters: [], derivatives: ["1", "2"], output: "h" }))
      .toThrow(expect.objectContaining({ name: "DeclaredNameError", field: "states.1" }));
    expect(() => compileSystem({ states: ["h"], parameters: ["exp"], derivatives: ["1"], output: "h" }))
      .toThrow(DeclaredNameError);
  });
});
