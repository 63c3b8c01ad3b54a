import { describe, expect, it } from "vitest";
import { ExpressionError } from "../../src/expressions/expression-error.js";
import { nonlinearPlantModel } from "../../src/plants/nonlinear-plant-model.js";
import { plantZeros } from "../../src/plants/plant-zeros.js";
import type { Plant } from "../../src/plants/plant.js";

describe("plantZeros", () => {
  it("plantZeros of (−2s + 1)/(s + 1)² is the right-half-plane zero s = 0.5", () => {
    // num(s) = −2s + 1 = 0 ⇔ s = 1/2 (closed form).
    const zeros = plantZeros({ kind: "transfer-function", num: [-2, 1], den: [1, 2, 1], delay: 0 });
    expect(zeros).toHaveLength(1);
    expect(zeros[0].re).toBeCloseTo(0.5, 12);
    expect(zeros[0].im).toBeCloseTo(0, 12);
  });

  it("plantZeros of a state-space plant are the roots of C·adj(sI − A)·B + D·det(sI − A)", () => {
    // A = diag(−1, −2), B = [1; 1], C = [1, −1], D = 0: G = 1/(s+1) − 1/(s+2) = 1/((s+1)(s+2)): no zero (closed form).
    expect(plantZeros({ kind: "state-space", A: [[-1, 0], [0, -2]], B: [[1], [1]], C: [[1, -1]], D: [[0]] })).toEqual([]);
    // C = [1, 1]: G = (2s + 3)/((s+1)(s+2)): zero at s = −1.5 (closed form).
    const zeros = plantZeros({ kind: "state-space", A: [[-1, 0], [0, -2]], B: [[1], [1]], C: [[1, 1]], D: [[0]] });
    expect(zeros[0].re).toBeCloseTo(-1.5, 10);
  });

  it("a constant numerator has no zeros", () => {
    expect(plantZeros({ kind: "transfer-function", num: [0, 3], den: [5, -1], delay: 1 })).toEqual([]);
  });
});

describe("nonlinearPlantModel at the operating point", () => {
  it("an expression that divides by zero at the operating point is refused at its field, not as a NaN coefficient", () => {
    // dh/dt = (u − h)/c, dT/dt = (h − T)/m with m = 0 … written as 1/(T − 20) at T = 20: 1/0 = ∞ there.
    const plant: Plant = {
      kind: "nonlinear",
      states: ["h", "T"],
      parameters: { c: 2 },
      derivatives: ["(u - h)/c", "(h - T)/(T - 20)"],
      output: "T",
      initial: [20, 20],
      operatingInput: 0,
    };
    let caught: unknown;
    try {
      nonlinearPlantModel(plant);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(ExpressionError);
    expect((caught as ExpressionError).field).toBe("derivatives.1");
    expect((caught as ExpressionError).message).toMatch(/^dT\/dt is not a number \(NaN\) at the operating point \(h = 20, T = 20, u = 0\)/);
  });
});
