import { describe, expect, it } from "vitest";
import { searchObjectiveMatrix } from "../../src/search/search-objectives.js";

describe("searchObjectiveMatrix", () => {
  it("searchObjectiveMatrix picks the objective columns, negates larger-is-better criteria and fills NaN for unstable candidates", () => {
    // phaseMargin is better larger (CriterionDefinition.better), iae smaller: minimising −PM maximises PM (common practice).
    const criteria = ["iae", "effort", "phaseMargin"] as const;
    const rows = [[1, 2, 45], null, [3, 4, 60]];
    const m = searchObjectiveMatrix((i) => rows[i] ?? null, 3, criteria, ["phaseMargin", "iae"]);
    expect(Array.from(m)).toEqual([-45, 1, NaN, NaN, -60, 3]);
  });

  it("searchObjectiveMatrix refuses an objective the sweep did not score", () => {
    expect(() => searchObjectiveMatrix(() => [1], 1, ["iae"], ["ise"])).toThrow(/"ise" is not one of the criteria iae/);
  });
});
