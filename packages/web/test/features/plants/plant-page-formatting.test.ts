import { describe, expect, it } from "vitest";
import type { Plant } from "@loopyard/core";
import { coefficientList, formatCoefficient, formatTransferFunction } from "../../../src/features/plants/format-transfer-function.js";
import { stateSpaceProblems, transferFunctionProblems } from "../../../src/features/plants/plant-preview-checks.js";
import { actuatorUnits, inputUnitOf } from "../../../src/features/plants/plant-units.js";
import { poleMeaning, zeroVerdict } from "../../../src/features/plants/poles-table.js";

describe("coefficients with their signs", () => {
  it("a stored denominator [5, −1] shows as [5, −1] under G(s) = 1/(5s − 1)", () => {
    // The plant page listed it as "[5, 1]" before: the sign of each stored coefficient must show.
    expect(coefficientList([5, -1])).toBe("[5, −1]");
    expect(formatTransferFunction({ num: [1], den: [5, -1], delay: 0 })).toBe("G(s) = 1 / (5s − 1)");
    expect(formatCoefficient(-0.25)).toBe("−0.25");
    expect(formatCoefficient(2.5)).toBe("2.5");
    expect(coefficientList([-2, 0, 1.5e-7])).toBe("[−2, 0, 1.5e-7]");
  });
});

describe("poles and zeros", () => {
  it("an unstable real pole is shown as unstable, with no (negative) time constant", () => {
    // p = +0.2 s⁻¹: the response grows as e^(0.2t); τ = −1/p = −5 s would be meaningless (closed form).
    const unstable = poleMeaning({ re: 0.2, im: 0 });
    expect(unstable.stable).toBe(false);
    expect(unstable.timeConstant).toBeNull();
    expect(unstable.verdict).toBe("unstable: grows as e^(0.2t)");
    // p = −0.2: τ = 5 s.
    expect(poleMeaning({ re: -0.2, im: 0 }).timeConstant).toBeCloseTo(5, 12);
    // p = −1 ± 1j: ωn = √2, ζ = 1/√2 (standard second-order parametrisation, closed form).
    const pair = poleMeaning({ re: -1, im: 1 });
    expect(pair.naturalFrequency).toBeCloseTo(Math.SQRT2, 12);
    expect(pair.damping).toBeCloseTo(Math.SQRT1_2, 12);
    expect(poleMeaning({ re: 0.5, im: 2 }).verdict).toBe("unstable: growing oscillation");
  });

  it("a right-half-plane zero is marked", () => {
    expect(zeroVerdict({ re: 0.5, im: 0 })).toBe("right half-plane: the step response starts the wrong way");
    expect(zeroVerdict({ re: -1.5, im: 0 })).toBe("left half-plane");
  });
});

describe("the live preview agrees with validation", () => {
  it("a zero leading denominator coefficient and an all-zero denominator preview as errors, not as 1/0", () => {
    expect(transferFunctionProblems([1], [0, 1], 0)).toEqual(["denominator: the leading denominator coefficient must be non-zero"]);
    expect(transferFunctionProblems([1], [0], 0)).toEqual(["denominator: the leading denominator coefficient must be non-zero"]);
    expect(transferFunctionProblems([1, 0, 0], [1, 1], 0)[0]).toContain("the plant must be proper");
    expect(transferFunctionProblems([1], [5, -1], 0)).toEqual([]);
  });

  it("state-space dimension errors are reported all at once", () => {
    const problems = stateSpaceProblems([[-1, 0], [0, -2]], [[1], [1], [1]], [[1, 0, 0]], [[0, 0]]);
    expect(problems).toEqual(["B must be 2×1 (one input)", "C must be 1×2 (one output)", "D must be 1×1"]);
  });
});

describe("units of the actuator limits", () => {
  const tf: Plant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
  it("the input's unit is read from the units note, and the rate is per second", () => {
    expect(inputUnitOf(tf, "u: heater power [W]; y: plate temperature [°C]")).toBe("W");
    expect(actuatorUnits("W")).toEqual({ level: "W", rate: "W/s" });
    expect(inputUnitOf(tf, "y: plate temperature [°C]")).toBeNull();
    expect(actuatorUnits(null)).toEqual({ level: "u", rate: "u/s" });
  });
});
