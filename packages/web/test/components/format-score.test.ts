import { describe, expect, it } from "vitest";
import { finiteScore, formatScore, scoreTitle } from "../../src/components/format-score.js";

describe("formatScore", () => {
  it("formatScore writes inf as ∞, -inf as −∞, null as — and numbers to 4 significant digits", () => {
    expect(formatScore("inf")).toBe("∞");
    expect(formatScore("-inf")).toBe("−∞");
    expect(formatScore(null)).toBe("—");
    expect(formatScore(1.234567)).toBe("1.235");
  });

  it("scoreTitle says why a score is missing or infinite", () => {
    expect(scoreTitle(null)).toBe("does not apply to this scenario");
    expect(scoreTitle("inf")).toMatch(/not reached/);
    expect(scoreTitle(0.5)).toBe("0.5");
  });

  it("finiteScore keeps only finite numbers (what the front may plot)", () => {
    expect(finiteScore(2)).toBe(2);
    expect(finiteScore("inf")).toBeNull();
    expect(finiteScore(null)).toBeNull();
  });
});
