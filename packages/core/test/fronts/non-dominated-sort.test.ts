import { describe, expect, it } from "vitest";
import { nonDominatedSort } from "../../src/fronts/non-dominated-sort.js";
import { paretoFront } from "../../src/fronts/pareto-front.js";
import { seededRandom } from "../support/seeded-random.js";

/**
 * Brute force of the definition (Deb et al. 2002, §III-A): peel off the non-dominated points of
 * the remaining finite set, front by front, O(k·n³); non-finite points rank one past the last front.
 */
function bruteForceRanks(f: number[], n: number, k: number): number[] {
  const finite = (i: number) => f.slice(i * k, i * k + k).every(Number.isFinite);
  const dominates = (q: number, p: number) => {
    let strict = false;
    for (let j = 0; j < k; j++) {
      if (f[q * k + j] > f[p * k + j]) return false;
      if (f[q * k + j] < f[p * k + j]) strict = true;
    }
    return strict;
  };
  const rank = new Array<number>(n).fill(-1);
  let remaining = Array.from({ length: n }, (_, i) => i).filter(finite);
  let r = 0;
  while (remaining.length > 0) {
    const front = remaining.filter((p) => !remaining.some((q) => q !== p && dominates(q, p)));
    for (const p of front) rank[p] = r;
    remaining = remaining.filter((p) => rank[p] === -1);
    r++;
  }
  for (let i = 0; i < n; i++) if (!finite(i)) rank[i] = r;
  return rank;
}

function randomSet(random: () => number, n: number, k: number): number[] {
  // Coarse values force ties and exact duplicates; a few NaN and Infinity entries.
  return Array.from({ length: n * k }, () => {
    const u = random();
    if (u < 0.02) return NaN;
    if (u < 0.03) return Infinity;
    return Math.floor(random() * 8);
  });
}

describe("nonDominatedSort", () => {
  it("nonDominatedSort agrees with brute-force peeling on seeded random sets for k = 1…5", () => {
    const random = seededRandom(51);
    for (let trial = 0; trial < 300; trial++) {
      const k = 1 + (trial % 5);
      const n = Math.floor(random() * 70);
      const f = randomSet(random, n, k);
      expect(Array.from(nonDominatedSort(Float64Array.from(f), n, k))).toEqual(bruteForceRanks(f, n, k));
    }
  });

  it("nonDominatedSort with k = 2 puts exactly paretoFront's points at rank 0", () => {
    const random = seededRandom(77);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(random() * 200);
      const f = Float64Array.from(randomSet(random, n, 2));
      const x = Array.from({ length: n }, (_, i) => f[2 * i]);
      const y = Array.from({ length: n }, (_, i) => f[2 * i + 1]);
      const ranks = nonDominatedSort(f, n, 2);
      const front = paretoFront(x, y).sort((a, b) => a - b);
      const finiteCount = x.filter((v, i) => Number.isFinite(v) && Number.isFinite(y[i])).length;
      if (finiteCount === 0) continue;
      const rankZero = Array.from(ranks.keys()).filter((i) => ranks[i] === 0);
      expect(rankZero).toEqual(front);
    }
  });

  it("nonDominatedSort ranks a hand-made set: chain, ties and a NaN", () => {
    // By the definition: the two copies of (1,1) do not dominate each other (rank 0); (1,1) dominates
    // (2,2), (1,3) and (3,1) (rank 1); (2,2) dominates (3,3) (rank 2); the NaN point ranks last (3).
    const f = Float64Array.from([1, 1, 2, 2, 3, 3, 1, 3, 3, 1, 1, 1, NaN, 0]);
    expect(Array.from(nonDominatedSort(f, 7, 2))).toEqual([0, 1, 2, 1, 1, 0, 3]);
    expect(Array.from(nonDominatedSort(new Float64Array(0), 0, 3))).toEqual([]);
  });

  it("nonDominatedSort handles 20 000 points in 3 objectives within a work budget", () => {
    const random = seededRandom(5);
    const n = 20_000;
    const f = Float64Array.from({ length: 3 * n }, random);
    const started = performance.now();
    const ranks = nonDominatedSort(f, n, 3);
    expect(performance.now() - started).toBeLessThan(5000);
    expect(Math.max(...ranks)).toBeGreaterThan(0);
  });

  it("nonDominatedSort rejects bad sizes naming them", () => {
    expect(() => nonDominatedSort(new Float64Array(5), 2, 2)).toThrow(/objectives/);
    expect(() => nonDominatedSort(new Float64Array(0), 0, 0)).toThrow(/k must/);
    expect(() => nonDominatedSort(new Float64Array(0), -1, 2)).toThrow(/n must/);
  });
});
