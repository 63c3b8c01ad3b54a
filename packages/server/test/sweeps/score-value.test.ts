import { describe, expect, it } from "vitest";
import { fromScoreValue, toScoreValue } from "../../src/sweeps/score-value.js";

describe("score values", () => {
  it("toScoreValue keeps finite numbers and writes ±Infinity as \"inf\"/\"-inf\" and NaN as null (the ScoreValue contract)", () => {
    expect(toScoreValue(1.25)).toBe(1.25);
    expect(toScoreValue(0)).toBe(0);
    expect(toScoreValue(Number.POSITIVE_INFINITY)).toBe("inf");
    expect(toScoreValue(Number.NEGATIVE_INFINITY)).toBe("-inf");
    expect(toScoreValue(Number.NaN)).toBeNull();
  });

  it("fromScoreValue inverts toScoreValue, null and a missing entry reading as NaN", () => {
    for (const v of [2.5, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) expect(fromScoreValue(toScoreValue(v))).toBe(v);
    expect(fromScoreValue(null)).toBeNaN();
    expect(fromScoreValue(undefined)).toBeNaN();
  });
});
