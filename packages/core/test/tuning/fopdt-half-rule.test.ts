import { describe, expect, it } from "vitest";
import type { Plant } from "../../src/plants/plant.js";
import { halfRule, halfRuleFopdt, halfRuleSopdt } from "../../src/tuning/fopdt-half-rule.js";
import { expectClose } from "../support/expect-close.js";

const tf = (num: number[], den: number[], delay = 0): Plant => ({ kind: "transfer-function", num, den, delay });
/** Product of polynomials in descending powers. */
const poly = (...factors: number[][]): number[] =>
  factors.reduce((a, b) => {
    const out = new Array<number>(a.length + b.length - 1).fill(0);
    a.forEach((x, i) => b.forEach((y, j) => (out[i + j] += x * y)));
    return out;
  });

// Companion-matrix roots of repeated factors are accurate to about eps^(1/m); the fits are compared to 1e-6.
const ATOL = 1e-6;

describe("halfRule", () => {
  it("halfRule on Skogestad's worked example splits τ2 half and half and turns the inverse response into dead time", () => {
    // Skogestad 2003, §3 worked example (from memory):
    //   g0(s) = (−0.3s + 1)(0.08s + 1) / ((2s + 1)(s + 1)(0.4s + 1)(0.2s + 1)(0.05s + 1)³)
    // Zero 0.08 against its neighbour lag 0.2 (rule T3, τc = θ ≫ 0.2): (0.08s+1)/(0.2s+1) ≈ 1/(0.12s + 1).
    // FOPDT: τ = 2 + 1/2 = 2.5,  θ = 1/2 + 0.4 + 0.12 + 3·0.05 + 0.3 = 1.47   (the paper's numbers).
    // SOPDT: τ1 = 2, τ2 = 1 + 0.4/2 = 1.2,  θ = 0.4/2 + 0.12 + 0.15 + 0.3 = 0.77.
    const plant = tf(poly([-0.3, 1], [0.08, 1]), poly([2, 1], [1, 1], [0.4, 1], [0.2, 1], [0.05, 1], [0.05, 1], [0.05, 1]));
    const fit = halfRule(plant);
    if (!fit.ok) throw new Error(fit.reason);
    expectClose(fit.fopdt.k, 1, ATOL);
    expectClose(fit.fopdt.tau, 2.5, ATOL);
    expectClose(fit.fopdt.theta, 1.47, ATOL);
    expectClose(fit.sopdt.tau1, 2, ATOL);
    expectClose(fit.sopdt.tau2, 1.2, ATOL);
    expectClose(fit.sopdt.theta, 0.77, ATOL);
  });

  it("halfRuleFopdt of e^(−s)/((6s+1)(2s+1)) gives τ = 7, θ = 2 and the SOPDT is the plant itself", () => {
    // Half rule (Skogestad 2003, eq. 10): τ = τ1 + τ2/2 = 6 + 1 = 7, θ = θ0 + τ2/2 = 1 + 1 = 2.
    // SOPDT with two lags keeps both: τ1 = 6, τ2 = 2, θ = 1.
    const plant = tf([3], poly([6, 1], [2, 1]), 1);
    const fopdt = halfRuleFopdt(plant);
    const sopdt = halfRuleSopdt(plant);
    if (!fopdt.ok || !sopdt.ok) throw new Error("fit refused");
    expectClose(fopdt.model.k, 3, ATOL);
    expectClose(fopdt.model.tau, 7, ATOL);
    expectClose(fopdt.model.theta, 2, ATOL);
    expect(sopdt.model).toEqual({ k: expect.closeTo(3, 9), tau1: expect.closeTo(6, 9), tau2: expect.closeTo(2, 9), theta: expect.closeTo(1, 9) });
  });

  it("halfRuleFopdt of 1/(s+1)³ puts half of the second lag and all of the third into the dead time", () => {
    // Half rule: τ = 1 + 1/2 = 1.5, θ = 1/2 + 1 = 1.5 (SOPDT: τ1 = 1, τ2 = 1.5, θ = 0.5).
    const fit = halfRule(tf([1], [1, 3, 3, 1]));
    if (!fit.ok) throw new Error(fit.reason);
    expectClose(fit.fopdt.tau, 1.5, ATOL);
    expectClose(fit.fopdt.theta, 1.5, ATOL);
    expectClose(fit.sopdt.tau2, 1.5, ATOL);
    expectClose(fit.sopdt.theta, 0.5, ATOL);
  });

  it("halfRuleFopdt of 1/(s+1)ⁿ, n = 4…8, is τ = 1.5, θ = n − 1.5 although the computed roots form a complex ring", () => {
    // Half rule: τ = 1 + 1/2, θ = 1/2 + (n − 2)·1. The companion-matrix roots of (s+1)⁸ scatter by ≈ 0.017 off the
    // real axis (eps^(1/8)); their cluster mean is −1 to rounding (see ROOT_CLUSTER_TOLERANCE).
    for (let n = 4; n <= 8; n++) {
      const den = poly(...Array.from({ length: n }, () => [1, 1]));
      const fit = halfRuleFopdt(tf([1], den));
      if (!fit.ok) throw new Error(`n = ${n}: ${fit.reason}`);
      expectClose(fit.model.tau, 1.5, ATOL);
      expectClose(fit.model.theta, n - 1.5, ATOL);
    }
  });

  it("halfRuleFopdt adds an inverse-response time constant to the dead time", () => {
    // (−T0 s + 1) ≈ e^(−T0 s) (Skogestad 2003, eq. 7): (−s + 1)/((5s+1)(s+1)) → τ = 5.5, θ = 0.5 + 1 = 1.5.
    const fit = halfRuleFopdt(tf([-1, 1], poly([5, 1], [1, 1])));
    if (!fit.ok) throw new Error(fit.reason);
    expectClose(fit.model.tau, 5.5, ATOL);
    expectClose(fit.model.theta, 1.5, ATOL);
    expectClose(fit.model.k, 1, ATOL);
  });

  it("halfRuleFopdt of a zero above every lag uses rule T1 (T0/τ0 into the gain)", () => {
    // (10s + 1)/((4s + 1)(s + 1)(0.5s + 1)): first pass without the zero θ = 0.5 + 0.5 = 1 = τc.
    // The zero 10 is above every lag: paired with the largest, τ0 = 4 ≥ τc → factor T0/τ0 = 2.5 (rule T1).
    // Remaining lags 1, 0.5: τ = 1 + 0.25 = 1.25, θ = 0.25; k = 1·2.5.
    const fit = halfRuleFopdt(tf(poly([10, 1]), poly([4, 1], [1, 1], [0.5, 1])));
    if (!fit.ok) throw new Error(fit.reason);
    expectClose(fit.model.k, 2.5, ATOL);
    expectClose(fit.model.tau, 1.25, ATOL);
    expectClose(fit.model.theta, 0.25, ATOL);
  });

  it("halfRule on a state-space plant equals the fit of its transfer function", () => {
    // Two lags in series realise 1/((6s+1)(2s+1)): x1' = (−x1 + u)/6, x2' = (−x2 + x1)/2, y = x2.
    // Half rule: τ = 6 + 2/2 = 7, θ = 2/2 = 1.
    const plant: Plant = { kind: "state-space", A: [[-1 / 6, 0], [0.5, -0.5]], B: [[1 / 6], [0]], C: [[0, 1]], D: [[0]] };
    const fit = halfRuleFopdt(plant);
    if (!fit.ok) throw new Error(fit.reason);
    expectClose(fit.model.k, 1, ATOL);
    expectClose(fit.model.tau, 7, ATOL);
    expectClose(fit.model.theta, 1, ATOL);
  });

  it("halfRule refuses unstable, integrating, oscillatory and static plants with a reason (a status, not an exception)", () => {
    const cases: [Plant, RegExp][] = [
      [tf([1], [1, -1]), /unstable/],
      [tf([1], [1, 1, 0]), /integrating/],
      [tf([1], [1, 0.4, 1]), /complex poles/],
      [tf([2], [1], 1), /no lag/],
      [tf([1, 0], [1, 1]), /zero at the origin/],
    ];
    for (const [plant, reason] of cases) {
      const fit = halfRule(plant);
      expect(fit.ok).toBe(false);
      if (!fit.ok) expect(fit.reason).toMatch(reason);
    }
  });

  it("halfRule throws a RangeError naming the field of a malformed plant", () => {
    expect(() => halfRule(tf([1], [0, 0]))).toThrow(/plant\.den/);
  });
});
