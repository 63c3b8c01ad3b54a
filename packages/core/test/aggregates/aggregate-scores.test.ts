import { describe, expect, it } from "vitest";
import { aggregateScores, percentileType7 } from "../../src/aggregates/aggregate-scores.js";
import { STATUS_DIVERGED, STATUS_STABLE, STATUS_UNSTABLE } from "../../src/batch/batch-status.js";
import type { CriterionId } from "../../src/criteria/criterion-id.js";

// Two candidates × four variants × two criteria, laid out as evaluateBatch writes them:
// scores[(i·F + f)·C + c]. IAE is smaller-is-better, the phase margin larger-is-better.
const CRITERIA: CriterionId[] = ["iae", "phaseMargin"];
const F = 4;
const IAE = [
  [1, 4, 2, 3],
  [5, 5, 6, 8],
];
const PM = [
  [60, 45, 50, 40],
  [30, 35, 20, 25],
];
function layout(): Float64Array {
  const scores = new Float64Array(2 * F * 2);
  for (let i = 0; i < 2; i++) {
    for (let f = 0; f < F; f++) {
      scores[(i * F + f) * 2] = IAE[i][f];
      scores[(i * F + f) * 2 + 1] = PM[i][f];
    }
  }
  return scores;
}
const STABLE = new Uint8Array(2 * F).fill(STATUS_STABLE);

describe("aggregateScores", () => {
  it("worst takes the largest IAE and the smallest phase margin over the family", () => {
    // By hand: candidate 0 → IAE max(1,4,2,3) = 4, PM min(60,45,50,40) = 40; candidate 1 → 8, 20.
    expect(Array.from(aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "worst" }))).toEqual([4, 40, 8, 20]);
  });

  it("mean is the arithmetic mean over the variants", () => {
    // By hand: (1+4+2+3)/4 = 2.5, (60+45+50+40)/4 = 48.75, (5+5+6+8)/4 = 6, (30+35+20+25)/4 = 27.5.
    const mean = aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "mean" });
    [2.5, 48.75, 6, 27.5].forEach((v, i) => expect(mean[i]).toBeCloseTo(v, 14));
  });

  it("percentile p counts from best to worst by Hyndman & Fan type 7; p = 100 is the worst case", () => {
    // Type 7, N = 4, p = 75: h = 3·0.75 = 2.25. IAE of candidate 0 sorted 1,2,3,4 → 3 + 0.25·(4 − 3) = 3.25.
    // PM is larger-is-better, so p = 75 from best to worst is the 25th percentile ascending:
    // sorted 40,45,50,60, h = 0.75 → 40 + 0.75·5 = 43.75. Candidate 1: IAE 5,5,6,8 → 6 + 0.25·2 = 6.5;
    // PM 20,25,30,35 → 20 + 0.75·5 = 23.75.
    const q = aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "percentile", p: 75 });
    [3.25, 43.75, 6.5, 23.75].forEach((v, i) => expect(q[i]).toBeCloseTo(v, 14));
    const worst = aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "worst" });
    expect(Array.from(aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "percentile", p: 100 }))).toEqual(Array.from(worst));
    // p = 50 is the median: IAE of candidate 0 → (2 + 3)/2 = 2.5.
    expect(aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "percentile", p: 50 })[0]).toBeCloseTo(2.5, 14);
  });

  it("a candidate unstable or diverged on any one variant gets NaN for every criterion; NaN scores stay NaN", () => {
    const status = STABLE.slice();
    status[1] = STATUS_UNSTABLE; // candidate 0, variant 1
    const worst = aggregateScores(layout(), status, 2, F, CRITERIA, { kind: "worst" });
    expect(Number.isNaN(worst[0]) && Number.isNaN(worst[1])).toBe(true);
    expect(Array.from(worst.subarray(2))).toEqual([8, 20]);
    status[F + 3] = STATUS_DIVERGED; // candidate 1, variant 3
    expect(Array.from(aggregateScores(layout(), status, 2, F, CRITERIA, { kind: "mean" })).every(Number.isNaN)).toBe(true);
    // A criterion that does not apply on one variant (NaN) is NaN in the aggregate; the others are kept.
    const scores = layout();
    scores[(1 * F + 2) * 2 + 1] = NaN;
    const mean = aggregateScores(scores, STABLE, 2, F, CRITERIA, { kind: "mean" });
    expect(mean[2]).toBeCloseTo(6, 14);
    expect(Number.isNaN(mean[3])).toBe(true);
  });

  it("percentileType7 matches the R / NumPy default on a textbook sample", () => {
    // Hyndman & Fan (1996) type 7 on 1…10 (by hand): p = 10 → h = 0.9 → 1.9; p = 90 → h = 8.1 → 9.1.
    const x = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    expect(percentileType7(x, 10)).toBeCloseTo(1.9, 14);
    expect(percentileType7(x, 90)).toBeCloseTo(9.1, 14);
    expect(percentileType7(x, 0)).toBe(1);
    expect(percentileType7(x, 100)).toBe(10);
    expect(percentileType7([1, Infinity, Infinity], 80)).toBe(Infinity);
  });

  it("aggregateScores rejects bad arguments naming them", () => {
    expect(() => aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "percentile", p: 120 })).toThrow(/aggregate\.p/);
    expect(() => aggregateScores(layout(), STABLE, 2, F, CRITERIA, { kind: "median" } as never)).toThrow(/aggregate\.kind/);
    expect(() => aggregateScores(layout(), STABLE, 3, F, CRITERIA, { kind: "mean" })).toThrow(/scores/);
    expect(() => aggregateScores(layout(), new Uint8Array(3), 2, F, CRITERIA, { kind: "mean" })).toThrow(/status/);
  });
});
