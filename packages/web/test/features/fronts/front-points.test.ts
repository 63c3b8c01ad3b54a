import { describe, expect, it } from "vitest";
import { cloudPoints, defaultAxes, pointDescriber, positionFinder } from "../../../src/features/fronts/front-points.js";

// A PointsDto's columns as the server sends them (shape in core api/dto.ts): aligned by position.
const columns = { indices: [0, 4, 9], xs: [2, 1.5, 3], ys: [0.5, 0.7, 0.1], params: [[1, 2, 3], [0.1, 0.2, 0.3]] };

describe("front points", () => {
  it("cloudPoints picks the wanted candidates by index, in the wanted order, and passes over unknown ones", () => {
    expect(cloudPoints(columns, positionFinder(columns.indices), [9, 0, 5, 4])).toEqual([
      { index: 9, x: 3, y: 0.1 },
      { index: 0, x: 2, y: 0.5 },
      { index: 4, x: 1.5, y: 0.7 },
    ]);
  });

  it("positionFinder finds every index of a sorted column by bisection and of an unsorted one by a map, −1 otherwise", () => {
    const sorted = Array.from({ length: 1001 }, (_, i) => 3 * i + 1);
    const find = positionFinder(sorted);
    sorted.forEach((index, at) => expect(find(index)).toBe(at));
    for (const missing of [0, 2, 3, 3002, 3004, -1]) expect(find(missing)).toBe(-1);
    const unsorted = positionFinder([7, 2, 9, 4]);
    expect([7, 2, 9, 4, 5].map(unsorted)).toEqual([0, 1, 2, 3, -1]);
    expect(positionFinder([])(0)).toBe(-1);
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
