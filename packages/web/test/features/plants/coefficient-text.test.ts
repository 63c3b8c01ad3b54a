import { describe, expect, it } from "vitest";
import { formatCoefficientText, parseCoefficients } from "../../../src/features/plants/coefficient-text.js";

describe("parseCoefficients", () => {
  it("parseCoefficients reads commas and spaces alike: '1, 3 2' → [1, 3, 2]", () => {
    expect(parseCoefficients("1, 3 2")).toEqual({ ok: true, values: [1, 3, 2] });
    expect(parseCoefficients("  16,10,1 ")).toEqual({ ok: true, values: [16, 10, 1] });
  });

  it("parseCoefficients accepts decimals, exponents and the typographic minus", () => {
    const parsed = parseCoefficients("0.5 −2 1e-3 .25");
    expect(parsed.ok).toBe(true);
    if (parsed.ok) {
      expect(parsed.values[0]).toBeCloseTo(0.5, 12);
      expect(parsed.values[1]).toBeCloseTo(-2, 12);
      expect(parsed.values[2]).toBeCloseTo(0.001, 12);
      expect(parsed.values[3]).toBeCloseTo(0.25, 12);
    }
  });

  it("parseCoefficients names the first bad token and its position", () => {
    const parsed = parseCoefficients("1 3x 2");
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.message).toContain("“3x”");
      expect(parsed.message).toContain("coefficient 2");
    }
  });

  it("parseCoefficients refuses empty text and non-finite words", () => {
    expect(parseCoefficients("   ").ok).toBe(false);
    expect(parseCoefficients("1 Infinity").ok).toBe(false);
    expect(parseCoefficients("1 NaN").ok).toBe(false);
  });

  it("formatCoefficientText writes a list back so that parsing returns it", () => {
    const values = [1.2, 0, -3, 1e-7];
    const parsed = parseCoefficients(formatCoefficientText(values));
    expect(parsed).toEqual({ ok: true, values });
  });
});
