import { describe, expect, it } from "vitest";
import { evaluateSweepChunk } from "../../src/sweeps/evaluate-sweep-chunk.js";
import { planSweep } from "../../src/sweeps/plan-sweep.js";
import { sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import type { Plant } from "../../src/plants/plant.js";
import { plantModelSchema } from "../../src/plants/plant.js";
import { plantPoles } from "../../src/plants/plant-poles.js";
import { suggestHorizon } from "../../src/plants/suggest-horizon.js";
import { stepTestSettingsSchema } from "../../src/identification/step-test-settings.js";

const REVISION = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";
// An FOPDT 0.8·e^(−3.7s)/(12s + 1) as fitted from a step test, and the same transfer function typed by hand.
const tf: Plant = { kind: "transfer-function", num: [0.8], den: [12, 1], delay: 3.7 };
const identified: Plant = {
  kind: "identified",
  num: [0.8],
  den: [12, 1],
  delay: 3.7,
  identification: {
    stepTestId: REVISION,
    fileName: "ember-step.csv",
    settings: stepTestSettingsSchema.parse({ columns: { time: 1, input: 2, output: 3 } }),
    columns: { time: { index: 1, name: "time" }, input: { index: 2, name: "power" }, output: { index: 3, name: "temperature" } },
    fit: { model: "fopdt", parameters: { k: 0.8, tau: 12, theta: 3.7 }, intervals: { k: [0.79, 0.81], tau: [11.8, 12.2], theta: [3.6, 3.8] }, r2: 0.999, sse: 1, dof: 300, samples: 304, stepTime: 10, stepSize: 15, u0: 20, y0: 50 },
  },
};

describe("identified plants", () => {
  it("plantModelSchema accepts an identified plant and refuses its transfer function's faults at the same field", () => {
    expect(plantModelSchema.safeParse(identified).success).toBe(true);
    const bad = plantModelSchema.safeParse({ ...identified, den: [0, 1] });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["den"]);
  });

  it("an identified plant has its transfer function's pole and horizon", () => {
    // Pole of 1/(12s + 1): s = −1/12 (closed form).
    expect(plantPoles(identified)[0].re).toBeCloseTo(-1 / 12, 12);
    expect(suggestHorizon(identified)).toBe(suggestHorizon(tf));
  });

  it("a sweep on an identified plant scores every candidate exactly as on its transfer function (the sweep contract)", () => {
    const definition = sweepInputSchema.parse({
      name: "pi on the fitted heater",
      plantRevisionId: REVISION,
      structure: "pi",
      ranges: { kp: { min: 0.5, max: 2, count: 3 }, ki: { min: 0.02, max: 0.1, count: 3 } },
      scenario: { horizon: 120, dt: 0.05 },
      criteria: ["iae", "effort", "ms"],
    });
    const onIdentified = evaluateSweepChunk(planSweep(definition, [identified]), { start: 0, end: 9 });
    const onTf = evaluateSweepChunk(planSweep(definition, [tf]), { start: 0, end: 9 });
    expect(onIdentified.rows.map((r) => r.status)).toEqual(onTf.rows.map((r) => r.status));
    expect(onIdentified.rows.map((r) => r.scores)).toEqual(onTf.rows.map((r) => r.scores));
    expect(onIdentified.rows.some((r) => r.status === "stable")).toBe(true);
  });

  it("a family mixing an identified plant and a typed transfer function is planned and evaluated", () => {
    const definition = sweepInputSchema.parse({
      name: "family",
      plantRevisionId: REVISION,
      family: { variants: [{ plantRevisionId: REVISION }, { plantRevisionId: "6a1d7c1f-9b5f-4c54-8e5d-2a2a3c1b0d22" }] },
      structure: "pi",
      ranges: { kp: { min: 0.5, max: 1, count: 2 }, ki: { min: 0.02, max: 0.05, count: 2 } },
      scenario: { horizon: 120, dt: 0.05 },
      criteria: ["iae"],
    });
    const chunk = evaluateSweepChunk(planSweep(definition, [identified, { ...tf, num: [1] }]), { start: 0, end: 4 });
    expect(chunk.rows.length).toBe(4);
    expect(chunk.rows.every((r) => r.status === "stable")).toBe(true);
  });
});
