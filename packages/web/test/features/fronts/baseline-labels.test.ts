import { describe, expect, it } from "vitest";
import { markerLabels, toPixel, type PlotFrame } from "../../../src/features/fronts/baseline-labels.js";

describe("toPixel and markerLabels", () => {
  const frame: PlotFrame = { width: 400, height: 200, xRange: [0, 10], yRange: [0, 100] };

  it("toPixel maps data to the plot area linearly, y downwards (closed form: px = (x − x0)/(x1 − x0)·w, py = h − (y − y0)/(y1 − y0)·h)", () => {
    expect(toPixel(5, 25, frame, false)).toEqual({ x: 200, y: 150 });
    expect(toPixel(0, 100, frame, false)).toEqual({ x: 0, y: 0 });
  });

  it("toPixel on log axes maps log10 of the value, and refuses values ≤ 0", () => {
    const logFrame: PlotFrame = { width: 300, height: 300, xRange: [0, 3], yRange: [-1, 2] };
    const at = toPixel(100, 1, logFrame, true);
    expect(at?.x).toBeCloseTo(200, 9);
    expect(at?.y).toBeCloseTo(200, 9);
    expect(toPixel(0, 1, logFrame, true)).toBeNull();
  });

  it("markerLabels labels only the markers inside the frame, at their axis-unit positions", () => {
    const labels = markerLabels(
      [
        { label: "SIMC PI", x: 5, y: 50 },
        { label: "far", x: 50, y: 50 },
      ],
      [],
      frame,
      false,
    );
    expect(labels.map((l) => l.text)).toEqual(["SIMC PI"]);
    expect(labels[0]?.x).toBe(5);
    expect(labels[0]?.y).toBe(50);
    // A lone marker in open space: the label sits to its right (label-placement's first choice).
    expect(labels[0]?.ax).toBeGreaterThan(0);
    expect(labels[0]?.ay).toBeCloseTo(0, 12);
  });

  it("markerLabels gives positions in log10 units on a log axis (plotly's annotation convention)", () => {
    const logFrame: PlotFrame = { width: 300, height: 300, xRange: [0, 3], yRange: [0, 3] };
    const [label] = markerLabels([{ label: "AMIGO PID", x: 100, y: 10 }], [], logFrame, true);
    expect(label?.x).toBeCloseTo(2, 12);
    expect(label?.y).toBeCloseTo(1, 12);
  });
});
