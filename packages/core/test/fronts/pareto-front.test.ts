import { describe, expect, it } from "vitest";
import { paretoFront } from "../../src/fronts/pareto-front.js";
import { seededRandom } from "../support/seeded-random.js";

/** Definition, by brute force O(n²): i is on the front unless some j is ≤ in both and < in one. */
function bruteForceFront(x: number[], y: number[]): number[] {
  const finite = (i: number) => Number.isFinite(x[i]) && Number.isFinite(y[i]);
  const front: number[] = [];
  for (let i = 0; i < x.length; i++) {
    if (!finite(i)) continue;
    let dominated = false;
    for (let j = 0; j < x.length && !dominated; j++) {
      if (j === i || !finite(j)) continue;
      dominated = x[j] <= x[i] && y[j] <= y[i] && (x[j] < x[i] || y[j] < y[i]);
    }
    if (!dominated) front.push(i);
  }
  return front.sort((a, b) => x[a] - x[b] || a - b);
}

describe("paretoFront", () => {
  it("paretoFront agrees with the brute-force definition on seeded random points", () => {
    const random = seededRandom(20260512);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(random() * 60);
      // Coarse values force ties in x, in y and exact duplicates; some points are NaN or Infinity.
      const value = () => {
        const r = random();
        if (r < 0.03) return NaN;
        if (r < 0.05) return Infinity;
        return Math.floor(random() * 8);
      };
      const x = Array.from({ length: n }, value);
      const y = Array.from({ length: n }, value);
      expect(paretoFront(x, y)).toEqual(bruteForceFront(x, y));
    }
  });

  it("paretoFront keeps every copy of an equal non-dominated point", () => {
    // (1, 1) twice: neither dominates the other (dominance needs a strict improvement).
    expect(paretoFront([1, 2, 1, 0.5], [1, 0.5, 1, 3])).toEqual([3, 0, 2, 1]);
  });

  it("paretoFront drops the worse of equal-x or equal-y points", () => {
    expect(paretoFront([1, 1, 2], [2, 1, 1])).toEqual([1]);
    expect(paretoFront([], [])).toEqual([]);
    expect(() => paretoFront([1], [])).toThrow(RangeError);
  });
});
