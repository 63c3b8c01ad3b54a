import { describe, expect, it } from "vitest";
import { changeValueText } from "../../../src/features/revisions/revision-diff-text.js";

describe("changeValueText", () => {
  it("changeValueText shows numbers with their sign (a minus sign, not a hyphen) and lists in brackets", () => {
    // Common practice: a stored −1 must never read as 1 (issue: "[5, −1]" shown as "[5, 1]").
    expect(changeValueText(-1)).toBe("−1");
    expect(changeValueText([5, -1])).toBe("[5, −1]");
    expect(changeValueText([[-1, 0.5], [0, -2]])).toBe("[[−1, 0.5], [0, −2]]");
    expect(changeValueText(-0)).toBe("0");
  });

  it("changeValueText names a variant by its label and parameter values, quotes text, and shortens long values", () => {
    expect(changeValueText({ plantRevisionId: "x", label: "Ember 800", parameters: { Ta: 303 } })).toBe("Ember 800 (Ta 303)");
    expect(changeValueText("u: W")).toBe("“u: W”");
    expect(changeValueText(undefined)).toBe("—");
    expect(changeValueText("x".repeat(400), 20)).toHaveLength(20);
  });
});
