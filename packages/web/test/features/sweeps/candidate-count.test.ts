import { describe, expect, it } from "vitest";
import { MAX_SWEEP_CANDIDATES } from "@loopyard/core";
import { candidateCount, isWithinCandidateCap } from "../../../src/features/sweeps/candidate-count.js";

describe("candidateCount", () => {
  // A full grid holds every combination: |kp| · |ki| · |kd| (closed form: product of the counts).
  it("candidateCount multiplies the counts of every swept parameter: 5 × 5 × 1 = 25", () => {
    expect(candidateCount([5, 5, 1])).toBe(25);
    expect(candidateCount([6, 6, 4])).toBe(144);
  });

  it("candidateCount is null while a count is missing, fractional or below 1", () => {
    expect(candidateCount([Number.NaN, 5, 1])).toBeNull();
    expect(candidateCount([2.5, 5, 1])).toBeNull();
    expect(candidateCount([0, 5, 1])).toBeNull();
  });

  it("isWithinCandidateCap allows exactly the cap and refuses one more", () => {
    expect(isWithinCandidateCap(MAX_SWEEP_CANDIDATES)).toBe(true);
    expect(isWithinCandidateCap(MAX_SWEEP_CANDIDATES + 1)).toBe(false);
  });
});
