import { describe, expect, it } from "vitest";
import { deploymentSheet } from "../../src/deployment/deployment-sheet.js";
import { discretizePid } from "../../src/deployment/discretize-pid.js";
import { roundToFixedPoint } from "../../src/deployment/fixed-point.js";
import { expectClose } from "../support/expect-close.js";

const discrete = discretizePid({ kp: 2.5, ki: 1.2, kd: 0.3, tf: 0.02, b: 0.8, c: 0 }, { sampleTime: 0.001, method: "tustin", limits: { min: 0, max: 100 } });

describe("roundToFixedPoint", () => {
  it("Q15 with one exponent 0 stores 0.1 as 3277/32768", () => {
    // Plain Q15 (common practice): m = round(0.1·2¹⁵) = round(3276.8) = 3277, value 3277/32768 = 0.100006103515625.
    const d = { ...discrete, coefficients: { ...discrete.coefficients, pr: 0.1 } };
    const { report } = roundToFixedPoint(d, { format: "q15", scaling: { exponent: 0 } });
    const pr = report.coefficients.find((c) => c.name === "pr")!;
    expect(pr.mantissa).toBe(3277);
    expect(pr.rounded).toBe(0.100006103515625);
  });

  it("per-coefficient scaling keeps every coefficient within half a least significant bit, with integer mantissas in range", () => {
    // |c − m·2^(e−F)| ≤ 2^(e−F−1) for round-to-nearest (common practice), −2^F ≤ m ≤ 2^F − 1.
    for (const [format, bits] of [["q15", 15], ["q31", 31]] as const) {
      const { pid, report } = roundToFixedPoint(discrete, { format });
      expect(report.fractionalBits).toBe(bits);
      expect(report.saturated).toEqual([]);
      for (const c of report.coefficients) {
        expect(Number.isInteger(c.mantissa)).toBe(true);
        expect(c.mantissa).toBeGreaterThanOrEqual(-(2 ** bits));
        expect(c.mantissa).toBeLessThanOrEqual(2 ** bits - 1);
        expect(Math.abs(c.error)).toBeLessThanOrEqual(2 ** (c.exponent - bits - 1));
        if (c.exact !== 0) expect(Math.abs(c.exact)).toBeLessThan(2 ** c.exponent);
        expect(pid.coefficients[c.name]).toBe(c.rounded);
      }
      // The limits are not coefficients: left as they are.
      expect(pid.limits).toEqual(discrete.limits);
    }
  });

  it("a common exponent too small for a coefficient saturates it and says so", () => {
    // kp = 2.5 does not fit Q15 with exponent 0 (largest value 32767/32768): clipped and reported.
    const { report } = roundToFixedPoint(discrete, { format: "q15", scaling: { exponent: 0 } });
    // So does dy = 2kd/(2tf + h) = 0.6/0.041 ≈ 14.6 (dr = c·dy = 0 fits).
    expect(report.saturated).toEqual(["pr", "py", "dy"]);
    const py = report.coefficients.find((c) => c.name === "py")!;
    expect(py.mantissa).toBe(32767);
    expectClose(py.rounded, 32767 / 32768, 0);
    // bi1 = ki·h/2 = 6e-4 keeps only 20 of 32768 steps: not zero, so not an underflow.
    expect(report.underflowed).toEqual([]);
    const sheet = deploymentSheet({ kind: "pid2dof", kp: 2.5, ki: 1.2, kd: 0.3, tf: 0.02, b: 0.8, c: 0 }, {
      sampleTime: 0.001,
      method: "tustin",
      fixedPoint: { format: "q15", scaling: { exponent: 0 } },
    });
    expect(sheet.notes.some((n) => /pr, py, dy do not fit/.test(n))).toBe(true);
  });

  it("a coefficient that rounds to zero is reported as an underflow", () => {
    const d = { ...discrete, coefficients: { ...discrete.coefficients, bi1: 1e-6, bi0: 1e-6 } };
    const { report } = roundToFixedPoint(d, { format: "q15", scaling: { exponent: 0 } });
    expect(report.underflowed).toEqual(["bi1", "bi0"]);
  });
});
