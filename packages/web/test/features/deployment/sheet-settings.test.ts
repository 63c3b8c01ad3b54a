import { describe, expect, it } from "vitest";
import { changePercent, sheetQuery, sheetSettingsFrom } from "../../../src/features/deployment/sheet-settings.js";

describe("sheet settings", () => {
  it("sheetSettingsFrom reads the page address and falls back to 1 kHz Tustin without fixed point", () => {
    expect(sheetSettingsFrom(new URLSearchParams(""))).toEqual({ sampleTime: 0.001, method: "tustin", format: null });
    expect(sheetSettingsFrom(new URLSearchParams("sampleTime=0.01&method=backward-euler&format=q15"))).toEqual({ sampleTime: 0.01, method: "backward-euler", format: "q15" });
    // An unknown method or format falls back; a bad sample time is kept for the server to refuse with its sentence.
    expect(sheetSettingsFrom(new URLSearchParams("sampleTime=abc&method=euler&format=q7"))).toMatchObject({ method: "tustin", format: null });
    expect(sheetSettingsFrom(new URLSearchParams("sampleTime=abc")).sampleTime).toBeNaN();
  });

  it("sheetQuery round-trips through sheetSettingsFrom", () => {
    const settings = { sampleTime: 0.0005, method: "tustin", format: "q31" } as const;
    expect(sheetSettingsFrom(new URLSearchParams(sheetQuery(settings)))).toEqual(settings);
  });

  it("changePercent is (b − a)/|a| in per cent, 0 for equal values, NaN where it has no meaning", () => {
    // Relative change, common practice: 1.0 → 1.05 is +5 %; −2 → −1 is +50 % (less negative).
    expect(changePercent(1, 1.05)).toBeCloseTo(5, 12);
    expect(changePercent(-2, -1)).toBeCloseTo(50, 12);
    expect(changePercent(0, 0)).toBe(0);
    expect(changePercent(0, 1)).toBeNaN();
    expect(changePercent(Number.POSITIVE_INFINITY, 1)).toBeNaN();
  });
});
