import { describe, expect, it } from "vitest";
import { distinguishingDigits, MAX_DIGITS, MIN_DIGITS } from "../../../src/features/fronts/column-digits.js";
import { formatNumber } from "../../../src/components/format-number.js";

describe("distinguishingDigits", () => {
  it("distinguishingDigits keeps 4 digits when neighbours already differ", () => {
    expect(distinguishingDigits([1.121, 1.134, 1.181])).toBe(MIN_DIGITS);
  });

  it("distinguishingDigits adds digits until adjacent values print apart (closed form: 1.23456 and 1.23461 first differ at the 6th digit)", () => {
    const digits = distinguishingDigits([1.23456, 1.23461]);
    expect(digits).toBe(6);
    expect(formatNumber(1.23456, digits)).toBe("1.23456");
    expect(formatNumber(1.23461, digits)).toBe("1.23461");
  });

  it("distinguishingDigits leaves equal neighbours alone and skips scores that are not finite numbers", () => {
    expect(distinguishingDigits([2.5, 2.5, 2.5])).toBe(MIN_DIGITS);
    // "inf" and null between them: 1.00001 and 1.00002 are the neighbours compared.
    expect(distinguishingDigits([1.00001, "inf", null, 1.00002])).toBe(6);
  });

  it("distinguishingDigits works through exponent notation and stops at MAX_DIGITS", () => {
    // 123456.7 and 123457.1 print as 1.23457e5 at 6 digits; 7 digits tell them apart.
    expect(distinguishingDigits([123456.7, 123457.1])).toBe(7);
    expect(distinguishingDigits([1, 1 + 1e-15])).toBe(MAX_DIGITS);
  });

  it("every pair of adjacent rows of a dense front prints apart at the digits chosen (invariant)", () => {
    const column = Array.from({ length: 200 }, (_, i) => 3.7 + i * 2e-6);
    const digits = distinguishingDigits(column);
    for (let i = 1; i < column.length; i++) expect(formatNumber(column[i], digits)).not.toBe(formatNumber(column[i - 1], digits));
    expect(digits).toBeLessThan(MAX_DIGITS);
  });
});
