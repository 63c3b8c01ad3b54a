import { describe, expect, it } from "vitest";
import { gridCandidates } from "../../src/sweeps/grid-candidates.js";
import { sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import { expectClose } from "../support/expect-close.js";

describe("gridCandidates", () => {
  const ranges = {
    kp: { min: 1, max: 3, count: 3 },
    ki: { min: 0, max: 0.5, count: 2 },
    kd: { min: 0, max: 0.9, count: 4 },
  };

  it("gridCandidates lists count_kp·count_ki·count_kd candidates, kp slowest and kd fastest", () => {
    // Definition (brief): row-major, index = (i_kp·n_ki + i_ki)·n_kd + i_kd; evenly spaced, inclusive.
    const candidates = gridCandidates(ranges, { mode: "ratio", n: 10 });
    expect(candidates).toHaveLength(24);
    const kps = [1, 2, 3];
    const kis = [0, 0.5];
    const kds = [0, 0.3, 0.6, 0.9];
    candidates.forEach((c, index) => {
      const ikd = index % 4;
      const iki = Math.floor(index / 4) % 2;
      const ikp = Math.floor(index / 8);
      expectClose(c.kp, kps[ikp], 1e-15);
      expectClose(c.ki, kis[iki], 1e-15);
      expectClose(c.kd, kds[ikd], 1e-15);
      // Ratio filter: tf = kd/(n·kp), 0 when kd = 0.
      expectClose(c.tf, c.kd === 0 ? 0 : c.kd / (10 * c.kp), 1e-15);
    });
    expect(candidates[23].kd).toBe(0.9);
  });

  it("gridCandidates uses a fixed tf for every candidate and a single value for count 1", () => {
    const candidates = gridCandidates({ ...ranges, kp: { min: 2, max: 2, count: 1 } }, { mode: "fixed", tf: 0.05 });
    expect(candidates).toHaveLength(8);
    expect(candidates.every((c) => c.kp === 2 && c.tf === 0.05)).toBe(true);
  });

  it("gridCandidates refuses a ratio filter with kp = 0 and kd ≠ 0, naming filter", () => {
    expect(() => gridCandidates({ ...ranges, kp: { min: 0, max: 1, count: 2 } }, { mode: "ratio", n: 10 })).toThrow(/filter/);
    expect(() => gridCandidates(ranges, { mode: "fixed", tf: 0 })).toThrow(/filter\.tf/);
  });

  it("sweepInputSchema reports the same two filter problems on their fields", () => {
    const base = {
      name: "s",
      plantRevisionId: "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11",
      scenario: { horizon: 30, dt: 0.01 },
    };
    const ratio = sweepInputSchema.safeParse({ ...base, ranges: { ...ranges, kp: { min: 0, max: 1, count: 2 } } });
    expect(ratio.success).toBe(false);
    expect(ratio.error?.issues.map((i) => i.path.join("."))).toContain("ranges.kp.min");
    const fixed = sweepInputSchema.safeParse({ ...base, ranges, filter: { mode: "fixed", tf: 0 } });
    expect(fixed.error?.issues.map((i) => i.path.join("."))).toContain("filter.tf");
    expect(sweepInputSchema.safeParse({ ...base, ranges }).success).toBe(true);
  });
});
