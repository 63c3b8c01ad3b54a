import { describe, expect, it } from "vitest";
import { plantPoles } from "../../src/plants/plant-poles.js";
import { expectClose } from "../support/expect-close.js";

describe("plantPoles", () => {
  it("plantPoles of 1/((8s + 1)(2s + 1)) are −1/8 and −1/2", () => {
    // Closed form: the roots of the factored denominator; the dead time adds no pole.
    const poles = plantPoles({ kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 1 });
    expectClose(poles[0].re, -0.5, 1e-14);
    expectClose(poles[1].re, -0.125, 1e-14);
  });

  it("plantPoles rejects an improper plant naming plant.num", () => {
    expect(() => plantPoles({ kind: "transfer-function", num: [1, 0, 0], den: [1, 1], delay: 0 })).toThrow(/plant\.num/);
    expect(() => plantPoles({ kind: "transfer-function", num: [1], den: [1, 1], delay: -1 })).toThrow(/plant\.delay/);
  });
});
