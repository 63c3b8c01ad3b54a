import { describe, expect, it } from "vitest";
import type { CandidateDto } from "@loopyard/core";
import { defaultAxes, frontPoints, plottableCriteria } from "../../../src/features/fronts/front-points.js";

// A load-step sweep as the API sends it: settling time does not apply (null), an infinite IAE is "inf" (shapes of ScoreValue in core api/dto.ts).
const candidates: CandidateDto[] = [
  { index: 0, params: [1], status: "stable", scores: [2, null, 0.5] },
  { index: 1, params: [2], status: "stable", scores: ["inf", null, 0.4] },
  { index: 2, params: [3], status: "unstable", scores: null },
  { index: 3, params: [4], status: "diverged", scores: null },
];
const criteria = ["iae", "settlingTime", "effort"] as const;

describe("front points", () => {
  it("frontPoints keeps stable candidates with finite scores on both axes only", () => {
    expect(frontPoints(candidates, criteria, "iae", "effort")).toEqual([{ index: 0, x: 2, y: 0.5 }]);
    expect(frontPoints(candidates, criteria, "iae", "settlingTime")).toEqual([]);
  });

  it("plottableCriteria leaves out a criterion no candidate has a finite score for", () => {
    expect(plottableCriteria(candidates, criteria)).toEqual(["iae", "effort"]);
  });

  it("defaultAxes passes over a criterion that does not apply, and keeps ISE against effort when both are scored", () => {
    expect(defaultAxes(criteria, candidates)).toEqual({ x: "iae", y: "effort" });
    expect(defaultAxes(["iae", "ise", "itae", "effort"])).toEqual({ x: "ise", y: "effort" });
  });
});
