import { describe, expect, it } from "vitest";
import { formatEta, formatRate, sweepProgress } from "../../../src/features/sweeps/sweep-progress.js";

describe("sweepProgress", () => {
  it("sweepProgress falls back to done/total when the server sends no progress block (sweeps of the first version)", () => {
    const p = sweepProgress({ done: 30, total: 120 });
    // 30/120 = 0.25 (closed form)
    expect(p.fraction).toBeCloseTo(0.25, 12);
    expect(p.ratePerSecond).toBeNull();
    expect(p.etaSeconds).toBeNull();
    expect(p.workersActive).toBeNull();
    expect(p.failures).toEqual([]);
  });

  it("sweepProgress reads rate, ETA, workers and failed chunks from the progress block", () => {
    const p = sweepProgress({
      done: 10,
      total: 100,
      progress: {
        done: 40,
        total: 100,
        ratePerSecond: 12.5,
        etaSeconds: 4.8,
        workersActive: 2,
        chunksTotal: 10,
        chunksDone: 4,
        chunksFailed: 1,
        failures: [{ chunk: 3, error: "boom" }],
      },
    });
    expect(p.done).toBe(40);
    expect(p.fraction).toBeCloseTo(0.4, 12);
    expect(p.ratePerSecond).toBeCloseTo(12.5, 12);
    expect(p.workersActive).toBe(2);
    expect(p.chunksFailed).toBe(1);
    expect(p.failures[0]?.error).toBe("boom");
  });

  it("sweepProgress keeps the fraction at 0 for an empty sweep and at most 1 (common practice)", () => {
    expect(sweepProgress({ done: 0, total: 0 }).fraction).toBe(0);
    expect(sweepProgress({ done: 12, total: 10 }).fraction).toBe(1);
  });
});

describe("formatRate and formatEta", () => {
  it("formatRate groups large rates and keeps 3 significant digits for small ones (common practice)", () => {
    expect(formatRate(1240.4)).toBe("1,240 candidates/s");
    expect(formatRate(12.345)).toBe("12.3 candidates/s");
    expect(formatRate(null)).toBe("—");
  });

  it("formatEta writes seconds, minutes and hours in words a reader takes in at a glance", () => {
    expect(formatEta(null)).toBe("—");
    expect(formatEta(3)).toBe("under 5 s");
    expect(formatEta(42)).toBe("42 s");
    // 200 s = 3 min 20 s (closed form)
    expect(formatEta(200)).toBe("3 min 20 s");
    expect(formatEta(1500)).toBe("25 min");
    // 7500 s = 2 h 5 min (closed form)
    expect(formatEta(7500)).toBe("2 h 05 min");
  });
});
