import { describe, expect, it } from "vitest";
import { MAX_SWEEP_CANDIDATES } from "@loopyard/core";
import { candidateCount, isWithinCandidateCap } from "../../../src/features/sweeps/candidate-count.js";

describe("candidateCount", () => {
  // A full grid holds every combination: |kp| · |ki| · |kd| (closed form: product of the counts).
  it("candidateCount multiplies the three counts: 5 × 5 × 1 = 25", () => {
    expect(candidateCount({ kp: { count: 5 }, ki: { count: 5 }, kd: { count: 1 } })).toBe(25);
    expect(candidateCount({ kp: { count: 6 }, ki: { count: 6 }, kd: { count: 4 } })).toBe(144);
  });

  it("candidateCount is null while a count is missing, fractional or below 1", () => {
    expect(candidateCount({ kp: { count: Number.NaN }, ki: { count: 5 }, kd: { count: 1 } })).toBeNull();
    expect(candidateCount({ kp: { count: 2.5 }, ki: { count: 5 }, kd: { count: 1 } })).toBeNull();
    expect(candidateCount({ kp: { count: 0 }, ki: { count: 5 }, kd: { count: 1 } })).toBeNull();
  });

  it("isWithinCandidateCap allows exactly the cap and refuses one more", () => {
    expect(isWithinCandidateCap(MAX_SWEEP_CANDIDATES)).toBe(true);
    expect(isWithinCandidateCap(MAX_SWEEP_CANDIDATES + 1)).toBe(false);
  });
});
