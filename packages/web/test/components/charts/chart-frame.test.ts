import { describe, expect, it } from "vitest";
import { LEGEND_CHAR_PX, LEGEND_ENTRY_PAD_PX, LEGEND_ROW_PX, NARROW_CHART_PX, NARROW_LEGEND_BAND_PX, chartFrame, legendBelowFrame, legendRows } from "../../../src/components/charts/chart-frame.js";

const WIDE = { height: 420, margin: { l: 64, r: 16, t: 40, b: 48 } };

describe("chartFrame", () => {
  it("chartFrame keeps the wide frame and the legend over the plot on a wide or unmeasured container", () => {
    for (const width of [null, NARROW_CHART_PX, 1200]) {
      const frame = chartFrame(width, WIDE);
      expect(frame.height).toBe(420);
      expect(frame.margin).toEqual(WIDE.margin);
      expect(frame.legend.y).toBe(1.08);
    }
  });

  it("chartFrame on a phone moves the legend to the bottom band and keeps the plot area's height (closed form: h − t − b equal)", () => {
    const frame = chartFrame(326, WIDE);
    expect(frame.legend).toMatchObject({ yref: "container", y: 0, yanchor: "bottom" });
    expect(frame.margin.b).toBe(WIDE.margin.b + NARROW_LEGEND_BAND_PX);
    expect(frame.height - frame.margin.t - frame.margin.b).toBe(WIDE.height - WIDE.margin.t - WIDE.margin.b);
  });
});

describe("legendRows and legendBelowFrame", () => {
  it("legendRows packs entries left to right and wraps when the next does not fit (closed form for equal entries: ceil(n / floor(w / entry)))", () => {
    const entry = LEGEND_ENTRY_PAD_PX + 10 * LEGEND_CHAR_PX; // 10-character names
    const names = Array.from({ length: 6 }, (_, i) => `pick ${i} xxx`.slice(0, 10));
    const width = 2 * entry + 1; // two a row
    expect(legendRows(names, width)).toBe(Math.ceil(6 / 2));
    expect(legendRows(names, 10_000)).toBe(1);
    expect(legendRows([], 300)).toBe(0);
    // Unmeasured: one row per entry, so a first draw never covers the axis.
    expect(legendRows(names, null)).toBe(6);
  });

  it("legendBelowFrame keeps the plot area's height whatever the legend takes", () => {
    const names = ["setpoint r", "IAE's pick (on Ember 800)", "ITAE's pick (on Ember 800)"];
    for (const width of [300, 600, 1200]) {
      const frame = legendBelowFrame(width, names, 190);
      expect(frame.height - frame.margin.t - frame.margin.b).toBe(190);
      expect(frame.margin.b).toBe(44 + legendRows(names, width) * LEGEND_ROW_PX + 6);
    }
  });
});
