import { describe, expect, it } from "vitest";
import { chunkJobId } from "../../src/jobs/job-queue.js";
import { chunkRanges, chunkSizeFor } from "../../src/sweeps/sweep-jobs.js";

describe("chunkSizeFor and chunkRanges", () => {
  it("chunkSizeFor keeps a chunk at most 2,000 candidate·variants and at least 100 candidates (common practice: small, even chunks)", () => {
    expect(chunkSizeFor(100_000, 5)).toBe(400); // 2000 / 5
    expect(chunkSizeFor(100_000, 1)).toBe(1563); // ⌈100000 / 64⌉ below the 2000 cap
    expect(chunkSizeFor(1_000_000, 1)).toBe(2000);
    expect(chunkSizeFor(1000, 2)).toBe(100); // ⌈1000 / 64⌉ = 16, raised to the floor of 100
    expect(chunkSizeFor(500, 40)).toBe(100); // 2000 / 40 = 50, raised to 100
  });

  it("chunkRanges covers [0, total) once, in order, the last chunk shorter", () => {
    const chunks = chunkRanges(1050, 100);
    expect(chunks).toHaveLength(11);
    expect(chunks[0]).toEqual({ chunk: 0, start: 0, end: 100 });
    expect(chunks[10]).toEqual({ chunk: 10, start: 1000, end: 1050 });
    let next = 0;
    for (const c of chunks) {
      expect(c.start).toBe(next);
      next = c.end;
    }
    expect(next).toBe(1050);
  });
});

describe("chunkJobId", () => {
  it("chunkJobId is a version-5-shaped UUID, the same for the same (sweep, chunk) and different across chunks (RFC 4122 layout)", () => {
    const sweep = "9b2c2c00-2f6b-4f00-b779-1f0000000000";
    const id = chunkJobId(sweep, 3);
    expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-5[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(chunkJobId(sweep, 3)).toBe(id);
    expect(chunkJobId(sweep, 4)).not.toBe(id);
    expect(chunkJobId(sweep, -1)).not.toBe(chunkJobId(sweep, 0));
  });
});
