import { describe, expect, it } from "vitest";
import { LOG_TICK_FORMAT, logTicks, TICK_SPACING } from "../../../src/features/fronts/log-ticks.js";

describe("logTicks", () => {
  it("logTicks labels 1, 2, 5 in each decade when the narrowest gap (log10 2 of a decade) leaves the spacing (common practice)", () => {
    // 1.4 decades on 300 px: 214 px per decade, 0.301 · 214 = 64.5 px ≥ 56 px.
    expect(logTicks([0, 1.4], 300, "x")).toEqual({ dtick: "D2", tickformat: LOG_TICK_FORMAT });
  });

  it("logTicks falls back to one label per decade, then to every k-th decade (k = ceil(spacing / px per decade))", () => {
    // 3 decades on 300 px: 100 px per decade, 30 px between 1 and 2 < 56 px, 100 px between decades ≥ 56 px.
    expect(logTicks([0, 3], 300, "x").dtick).toBe(1);
    // 6 decades on 300 px: 50 px per decade < 56 px → every 2nd decade.
    expect(logTicks([-2, 4], 300, "x").dtick).toBe(2);
    // y labels are shorter along the axis (24 px): 6 decades on 300 px have room for one per decade.
    expect(TICK_SPACING.y).toBe(24);
    expect(logTicks([-2, 4], 300, "y").dtick).toBe(1);
  });

  it("logTicks leaves the ticks to plotly under one decade or without a length, and always prints labels in full", () => {
    expect(logTicks([0.2, 0.9], 300, "x")).toEqual({ tickformat: LOG_TICK_FORMAT });
    expect(logTicks([0, 3], 0, "x")).toEqual({ tickformat: LOG_TICK_FORMAT });
    expect(LOG_TICK_FORMAT).toBe("~g");
  });
});
