import { describe, expect, it } from "vitest";
import { downsampleIndices, MAX_TRACE_POINTS, pick } from "../../src/traces/downsample-trace.js";

describe("downsampleIndices", () => {
  it("downsampleIndices(n) keeps every point when n is within the limit", () => {
    expect(downsampleIndices(5, 10)).toEqual([0, 1, 2, 3, 4]);
    expect(downsampleIndices(MAX_TRACE_POINTS)).toHaveLength(MAX_TRACE_POINTS);
    expect(downsampleIndices(0)).toEqual([]);
  });

  it("downsampleIndices(n) thins to at most the limit, evenly, keeping the first and last point", () => {
    for (const length of [2001, 4001, 12_345, 200_001]) {
      const indices = downsampleIndices(length);
      expect(indices.length).toBeLessThanOrEqual(MAX_TRACE_POINTS);
      expect(indices.length).toBeGreaterThan(MAX_TRACE_POINTS / 2);
      expect(indices[0]).toBe(0);
      expect(indices[indices.length - 1]).toBe(length - 1);
      for (let k = 1; k < indices.length; k += 1) expect((indices[k] as number) > (indices[k - 1] as number)).toBe(true);
    }
  });

  it("downsampleIndices rejects a limit below 2", () => {
    expect(() => downsampleIndices(10, 1)).toThrow(RangeError);
  });

  it("pick(values, indices) reads a Float64Array into a plain array", () => {
    expect(pick(Float64Array.from([10, 11, 12, 13]), [0, 3])).toEqual([10, 13]);
  });
});
