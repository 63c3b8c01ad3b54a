import { MAX_SWEEP_CANDIDATES } from "@loopyard/core";

/** How many candidates a grid sweep holds: the product of the counts; null while a count is not a whole number ≥ 1. */
export function candidateCount(counts: readonly number[]): number | null {
  if (counts.some((c) => typeof c !== "number" || !Number.isInteger(c) || c < 1)) return null;
  return counts.reduce((product, c) => product * c, 1);
}

/** True when a grid of this size may be run in one sweep. */
export function isWithinCandidateCap(count: number): boolean {
  return count <= MAX_SWEEP_CANDIDATES;
}
