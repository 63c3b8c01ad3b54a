import { describe, expect, it } from "vitest";
import { comparisonJobId, prescanChunks, prescanChunkSize } from "../../src/comparisons/comparison-jobs.js";
import { fromStoredJson, toStoredJson } from "../../src/comparisons/stored-json.js";

describe("pre-scan chunks", () => {
  it("prescanChunks(total, variants) covers 0 … total − 1 once, in contiguous chunks of at most 1000 point·variants", () => {
    for (const [total, variants] of [[256, 5], [1024, 3], [64, 1], [65_536, 20], [8, 20]] as const) {
      const chunks = prescanChunks(total, variants);
      let next = 0;
      chunks.forEach((c, i) => {
        expect(c.chunk).toBe(i);
        expect(c.start).toBe(next);
        expect(c.end).toBeGreaterThan(c.start);
        // At least 16 points per chunk (fewer only for the last), at most max(16, ⌊1000 / variants⌋).
        expect(c.end - c.start).toBeLessThanOrEqual(Math.max(16, Math.floor(1000 / variants)));
        next = c.end;
      });
      expect(next).toBe(total);
    }
    // The default pre-scan of 256 points on 5 variants: ⌈256 / 16⌉ = 16 points per chunk, 16 chunks.
    expect(prescanChunkSize(256, 5)).toBe(16);
    expect(prescanChunks(256, 5)).toHaveLength(16);
  });

  it("comparisonJobId gives one UUID per piece of work, the same each time", () => {
    const a = comparisonJobId("c1:prescan:0");
    expect(a).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-5[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(comparisonJobId("c1:prescan:0")).toBe(a);
    expect(comparisonJobId("c1:prescan:1")).not.toBe(a);
  });
});

describe("stored JSON", () => {
  it("toStoredJson and fromStoredJson keep NaN, ±∞ and the values of typed arrays", () => {
    const value = { a: Number.NaN, b: [1, Number.POSITIVE_INFINITY, -0.5], c: Float64Array.from([Number.NEGATIVE_INFINITY, 2]), d: Uint8Array.from([0, 3]), e: "x" };
    const stored = toStoredJson(value);
    // jsonb holds no NaN or ∞: what is stored must survive JSON text unchanged.
    expect(JSON.parse(JSON.stringify(stored))).toEqual(stored);
    const back = fromStoredJson<Record<string, unknown>>(stored);
    expect(back.a).toBeNaN();
    expect(back.b).toEqual([1, Number.POSITIVE_INFINITY, -0.5]);
    expect(back.c).toEqual([Number.NEGATIVE_INFINITY, 2]);
    expect(back.d).toEqual([0, 3]);
    expect(back.e).toBe("x");
  });
});
