import { describe, expect, it } from "vitest";
import { formatNumber } from "../../src/components/format-number.js";

describe("formatNumber", () => {
  it("formatNumber keeps 4 significant digits and drops trailing zeros (common practice for tables)", () => {
    expect(formatNumber(3.14159)).toBe("3.142");
    expect(formatNumber(2.5)).toBe("2.5");
    expect(formatNumber(1200)).toBe("1200");
  });

  it("formatNumber switches to exponent notation for very small and very large magnitudes", () => {
    expect(formatNumber(0.000123456)).toBe("1.235e−4");
    expect(formatNumber(123456)).toBe("1.235e5");
  });

  it("formatNumber writes negatives with a true minus sign and missing values as a dash", () => {
    expect(formatNumber(-0.5)).toBe("−0.5");
    expect(formatNumber(null)).toBe("—");
    expect(formatNumber(Number.NaN)).toBe("—");
  });
});
