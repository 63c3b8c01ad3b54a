import { describe, expect, it } from "vitest";
import {
  formatDelay,
  formatPolynomial,
  formatTransferFunction,
} from "../../../src/features/plants/format-transfer-function.js";

describe("formatPolynomial", () => {
  it("formatPolynomial writes descending powers with superscripts: [1, 3, 2] → s² + 3s + 2", () => {
    expect(formatPolynomial([1, 3, 2])).toBe("s² + 3s + 2");
  });

  it("formatPolynomial leaves out zero terms and writes negative ones with a minus sign", () => {
    expect(formatPolynomial([2, 0, -1])).toBe("2s² − 1");
    expect(formatPolynomial([-1, 0.5, 0])).toBe("−s² + 0.5s");
  });

  it("formatPolynomial handles constants, high orders and the zero polynomial", () => {
    expect(formatPolynomial([1.5])).toBe("1.5");
    expect(formatPolynomial([1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1])).toBe("s¹⁰ + 1");
    expect(formatPolynomial([0, 0])).toBe("0");
  });
});

describe("formatTransferFunction", () => {
  // (20s+1)(4s+1) = 80s² + 24s + 1, the demo "Ember 800 plate" with 1 s of dead time.
  it("formatTransferFunction groups multi-term polynomials and appends the dead time", () => {
    expect(formatTransferFunction({ num: [1.5], den: [80, 24, 1], delay: 1 })).toBe("G(s) = 1.5 / (80s² + 24s + 1) · e^(−1s)");
  });

  it("formatTransferFunction leaves the dead-time factor out when it is zero", () => {
    expect(formatTransferFunction({ num: [1, 1], den: [1, 3, 2], delay: 0 })).toBe("G(s) = (s + 1) / (s² + 3s + 2)");
    expect(formatDelay(0)).toBe("");
    expect(formatDelay(0.25)).toBe("e^(−0.25s)");
  });
});
