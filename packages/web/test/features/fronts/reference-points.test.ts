import { describe, expect, it } from "vitest";
import type { BaselineDto, ReferencesDto } from "@loopyard/core";
import { baselinePoints, boundTrace } from "../../../src/features/fronts/reference-points.js";

// A bound curve as the API sends it (ratio ascending: ISE rises, effort falls; shape of ReferencesDto in core api/dto.ts).
const bound: ReferencesDto["bound"] = {
  ok: true,
  points: [
    { ratio: 0.01, ise: 0.5, effort: 100 },
    { ratio: 0.1, ise: 1, effort: 10 },
    { ratio: 1, ise: 2, effort: 1 },
    { ratio: 10, ise: 4, effort: 0.1 },
    { ratio: 100, ise: 5, effort: 0.01 },
  ],
};

describe("reference points", () => {
  it("boundTrace draws the curve on (ISE, effort), swapped on (effort, ISE), and not on other axes", () => {
    expect(boundTrace(bound, "ise", "effort")).toEqual({ x: [0.5, 1, 2, 4, 5], y: [100, 10, 1, 0.1, 0.01] });
    expect(boundTrace(bound, "effort", "ise")?.x).toEqual([100, 10, 1, 0.1, 0.01]);
    expect(boundTrace(bound, "iae", "effort")).toBeNull();
    expect(boundTrace({ ok: false, reason: "nonlinear", points: [] }, "ise", "effort")).toBeNull();
  });

  it("boundTrace keeps the points near the plotted box and one beyond each end", () => {
    // Box x ∈ [1.5, 3] widened by 0.375, y ∈ [0.5, 2] widened by 0.375: only (2, 1) inside; (1, 10) and (4, 0.1) are its neighbours.
    const trace = boundTrace(bound, "ise", "effort", { xs: [1.5, 3], ys: [2, 0.5] });
    expect(trace).toEqual({ x: [1, 2, 4], y: [10, 1, 0.1] });
  });

  it("baselinePoints keeps stable baselines with finite scores on both axes", () => {
    const baselines: BaselineDto[] = [
      { rule: "simc", variant: "pi", label: "SIMC PI", params: { kp: 1 }, status: "stable", scores: [1, 2, null] },
      { rule: "amigo", variant: "pi", label: "AMIGO PI", params: { kp: 2 }, status: "stable", scores: [3, "inf", 4] },
      { rule: "imc", variant: "pid", label: "IMC PID", params: { kp: 3 }, status: "unstable", scores: [null, null, null] },
    ];
    expect(baselinePoints(baselines, ["ise", "effort", "ms"], "ise", "effort")).toEqual([{ label: "SIMC PI", rule: "simc", x: 1, y: 2, params: { kp: 1 } }]);
    expect(baselinePoints(baselines, ["ise", "effort", "ms"], "ise", "ms")).toEqual([{ label: "AMIGO PI", rule: "amigo", x: 3, y: 4, params: { kp: 2 } }]);
  });
});

describe("fitted axis ranges", () => {
  it("fittedRange pads the span by RANGE_PADDING on each side, in log10 units on a log axis", async () => {
    const { fittedRange, inRange } = await import("../../../src/features/fronts/reference-points.js");
    // Span 10 − 0 = 10, padding 0.06·10 = 0.6 (linear); log10 span 2 − 0 = 2, padding 0.12 decades.
    const linear = fittedRange([0, 4, 10], false);
    expect(linear?.[0]).toBeCloseTo(-0.6, 12);
    expect(linear?.[1]).toBeCloseTo(10.6, 12);
    const log = fittedRange([1, 100], true);
    expect(log?.[0]).toBeCloseTo(-0.12, 12);
    expect(log?.[1]).toBeCloseTo(2.12, 12);
    expect(fittedRange([0, 1], true)).toBeNull();
    expect(inRange(2000, linear, false)).toBe(false);
    expect(inRange(50, log, true)).toBe(true);
  });

  it("fits 200 000 values (more than Math.min(...values) can take as arguments) and NaN gives no range", async () => {
    const { extent, fittedRange } = await import("../../../src/features/fronts/reference-points.js");
    const many = Float64Array.from({ length: 200_000 }, (_, i) => Math.sin(i));
    const [lo, hi] = extent(many);
    expect(lo).toBeGreaterThanOrEqual(-1);
    expect(lo).toBeLessThan(-0.9999);
    expect(hi).toBeGreaterThan(0.9999);
    expect(fittedRange(many, false)?.[1]).toBeCloseTo(hi + 0.06 * (hi - lo), 12);
    expect(extent([1, Number.NaN, 2]).every(Number.isNaN)).toBe(true);
  });
});
