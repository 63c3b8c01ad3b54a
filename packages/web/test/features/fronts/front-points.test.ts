import { describe, expect, it } from "vitest";
import { columnPoints, defaultAxes, pointDescriber } from "../../../src/features/fronts/front-points.js";

// A PointsDto's columns as the server sends them (shape in core api/dto.ts): aligned by position.
const columns = { indices: [0, 4, 9], xs: [2, 1.5, 3], ys: [0.5, 0.7, 0.1], params: [[1, 2, 3], [0.1, 0.2, 0.3]] };

describe("front points", () => {
  it("columnPoints pairs the columns position by position", () => {
    expect(columnPoints(columns)).toEqual([
      { index: 0, x: 2, y: 0.5 },
      { index: 4, x: 1.5, y: 0.7 },
      { index: 9, x: 3, y: 0.1 },
    ]);
  });

  it("pointDescriber names the swept parameters of a candidate by its index, and nothing for an unknown one", () => {
    const describe = pointDescriber(columns, ["kp", "ki"], String);
    expect(describe(4)).toBe("kp = 2, ki = 0.2");
    expect(describe(5)).toBe("");
  });

  it("defaultAxes passes over a criterion that cannot be plotted, and keeps ISE against effort when both are scored", () => {
    expect(defaultAxes(["iae", "settlingTime", "effort"], ["iae", "effort"])).toEqual({ x: "iae", y: "effort" });
    expect(defaultAxes(["iae", "ise", "itae", "effort"])).toEqual({ x: "ise", y: "effort" });
  });
});
