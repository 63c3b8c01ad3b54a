import { describe, expect, it } from "vitest";
import { criterionSense, orientForMinimisation } from "../../src/criteria/criterion-sense.js";
import { paretoFront } from "../../src/fronts/pareto-front.js";

describe("criterionSense and orientForMinimisation", () => {
  it("criterionSense marks margins, crossover and bandwidth larger-is-better, the rest smaller", () => {
    // Common practice: a larger margin or bandwidth is the better loop (Åström & Hägglund 2006, §4.2).
    for (const id of ["gainMargin", "phaseMargin", "crossoverFrequency", "bandwidth"] as const) expect(criterionSense(id)).toBe("larger");
    for (const id of ["ise", "effort", "iae", "ms", "mt", "wsNorm", "settlingTime"] as const) expect(criterionSense(id)).toBe("smaller");
    expect(() => criterionSense("nope" as never)).toThrow(RangeError);
  });

  it("orientForMinimisation negates larger-is-better values and keeps non-finite ones non-finite", () => {
    expect(Array.from(orientForMinimisation([30, 60, Infinity, NaN], "phaseMargin"))).toEqual([-30, -60, -Infinity, NaN]);
    const ise = [1, 2];
    const oriented = orientForMinimisation(ise, "ise");
    expect(Array.from(oriented)).toEqual([1, 2]);
    expect(oriented).not.toBe(ise);
  });

  it("a front on (ise, phaseMargin) keeps the candidate with the largest margin among equal ISE", () => {
    // By the definition of dominance (Kung, Luccio & Preparata 1975) with PM maximised: among equal ISE only
    // the largest PM is non-dominated; a smaller ISE with a smaller PM is a trade-off and stays too.
    const ise = [1, 1, 1, 0.5, 2];
    const pm = [40, 65, 50, 30, 60];
    const front = paretoFront(orientForMinimisation(ise, "ise"), orientForMinimisation(pm, "phaseMargin"));
    expect(front).toEqual([3, 1]);
    // Without orientation the smallest margin would be kept instead — the bug this guards against.
    expect(paretoFront(ise, pm)).toEqual([3]);
  });
});
