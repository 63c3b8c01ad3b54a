import { describe, expect, it } from "vitest";
import { formatRegret, REGRET_SCALE_TOP, regretColours, regretPosition } from "../../../src/features/comparisons/regret-scale.js";
import { numberOf } from "../../../src/features/comparisons/comparison-result-types.js";
import { parseWeights, weightLabel } from "../../../src/features/comparisons/comparison-form-values.js";

/** Lightness [%] of an "hsl(h s% l%)" colour. */
const lightness = (colour: string) => Number(/ ([\d.]+)%\)$/.exec(colour)?.[1]);

describe("regret scale", () => {
  it("regretPosition(r) is log10(1 + r) / log10(1 + top), 0 at the best and 1 from the top on", () => {
    // Definition of the scale (regret-scale.ts): t = log10(1 + r) / log10(1 + REGRET_SCALE_TOP).
    expect(regretPosition(0)).toBe(0);
    expect(regretPosition(9)).toBeCloseTo(1 / Math.log10(1 + REGRET_SCALE_TOP), 12);
    expect(regretPosition(REGRET_SCALE_TOP)).toBe(1);
    expect(regretPosition(10 * REGRET_SCALE_TOP)).toBe(1);
    expect(regretPosition(Number.POSITIVE_INFINITY)).toBe(1);
    expect(regretPosition(Number.NaN)).toBeNaN();
  });

  it("regretColours darkens strictly with regret (order carried by lightness alone) and keeps the number readable", () => {
    const steps = [0, 1, 3, 10, 30, 100, 300, 1000].map((r) => regretColours(r));
    const l = steps.map((c) => lightness(c.background));
    for (let i = 1; i < l.length; i++) expect(l[i]).toBeLessThan(l[i - 1] as number);
    // White text on the dark half, ink on the light half (common practice for contrast).
    expect(steps[0]?.text).toBe("#22262b");
    expect(steps.at(-1)?.text).toBe("#ffffff");
    expect(regretColours(Number.NaN).background).toBe("transparent");
  });

  it("formatRegret prints best, signed per cent with sensible digits, ∞ and a dash", () => {
    expect(formatRegret(0)).toBe("best");
    expect(formatRegret(3.14159)).toBe("+3.1 %");
    expect(formatRegret(141.6)).toBe("+142 %");
    expect(formatRegret(Number.POSITIVE_INFINITY)).toBe("+∞ %");
    expect(formatRegret(Number.NaN)).toBe("—");
  });
});

describe("comparison wire numbers and form helpers", () => {
  it("numberOf reads the API's numbers: null is NaN, \"inf\" and \"-inf\" are infinities", () => {
    expect(numberOf(1.5)).toBe(1.5);
    expect(numberOf(null)).toBeNaN();
    expect(numberOf("inf")).toBe(Number.POSITIVE_INFINITY);
    expect(numberOf("-inf")).toBe(Number.NEGATIVE_INFINITY);
  });

  it("parseWeights reads r values separated by commas and refuses a negative or a word with a sentence", () => {
    expect(parseWeights("0.01, 0.1 1")).toEqual({ ok: true, values: [0.01, 0.1, 1] });
    expect(parseWeights("")).toEqual({ ok: true, values: [] });
    const bad = parseWeights("0.1, -1");
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/“-1” is not a weight/);
    expect(weightLabel(0.1)).toBe("J(r=0.1)");
  });
});
