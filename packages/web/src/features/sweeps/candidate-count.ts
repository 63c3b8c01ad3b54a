import { MAX_SWEEP_CANDIDATES } from "@loopyard/core";

interface CountedRange {
  count: number;
}

/** How many candidates a grid sweep holds: the product of the three counts; null while a count is not a whole number ≥ 1. */
export function candidateCount(ranges: { kp: CountedRange; ki: CountedRange; kd: CountedRange }): number | null {
  const counts = [ranges.kp.count, ranges.ki.count, ranges.kd.count];
  if (counts.some((c) => typeof c !== "number" || !Number.isInteger(c) || c < 1)) return null;
  return counts.reduce((product, c) => product * c, 1);
}

/** True when a grid of this size may be run in one sweep. */
export function isWithinCandidateCap(count: number): boolean {
  return count <= MAX_SWEEP_CANDIDATES;
}
