import { describe, expect, it } from "vitest";
import { sweepInputSchema, type SweepVariantDto } from "@loopyard/core";
import { formFromSweep, performancePreset } from "../../../src/features/sweeps/sweep-prefill.js";
import { formFieldOf, sweepFormResolver, toSweepInput } from "../../../src/features/sweeps/sweep-form-values.js";

const REV_A = "00000000-0000-4000-8000-00000000000a";
const REV_B = "00000000-0000-4000-8000-00000000000b";
const variant = (revisionId: string, label: string): SweepVariantDto => ({ label, plantId: `plant-${label}`, revisionId, revisionNumber: 1, plantName: label });

describe("formFromSweep", () => {
  it("formFromSweep then toSweepInput gives back the stored definition (round trip of a family sweep with a Latin hypercube)", () => {
    const definition = sweepInputSchema.parse({
      name: "Ember family",
      plantRevisionId: REV_A,
      family: { variants: [{ plantRevisionId: REV_A, label: "200" }, { plantRevisionId: REV_B, label: "400" }] },
      structure: "pid",
      ranges: { kp: { min: 0.5, max: 5, count: 5, scale: "log" }, ki: { min: 0.05, max: 1, count: 5 }, kd: { min: 0, max: 4, count: 3 } },
      design: { kind: "latin-hypercube", count: 300, seed: 7 },
      aggregate: { kind: "percentile", p: 90 },
      scenario: { horizon: 60, dt: 0.05, setpoint: 1 },
      criteria: ["ise", "effort"],
    });
    const form = formFromSweep({ name: "Ember family", definition, family: [variant(REV_A, "200"), variant(REV_B, "400")] });
    expect(form.name).toBe("Ember family (again)");
    // The stored label is the plant's own name, so it keeps following the plant (labelTyped false).
    expect(form.variants).toEqual([{ plantId: "plant-400", plantRevisionId: REV_B, label: "400", labelTyped: false, parameters: "" }]);
    const again = sweepInputSchema.parse(toSweepInput(form, { stateNames: [] }));
    expect({ ...again, name: definition.name }).toEqual(definition);
  });

  it("sweepFormResolver puts an override that is not name = value on its variant's field", async () => {
    const definition = sweepInputSchema.parse({
      name: "one",
      plantRevisionId: REV_A,
      ranges: { kp: { min: 0.5, max: 5, count: 2 }, ki: { min: 0.05, max: 1, count: 2 }, kd: { min: 0, max: 0, count: 1 } },
      scenario: { horizon: 60, dt: 0.05 },
    });
    const form = formFromSweep({ name: "one", definition, family: [variant(REV_A, "a")] });
    form.variants = [{ plantId: "p", plantRevisionId: REV_B, label: "b", labelTyped: true, parameters: "gain 2" }];
    const result = await sweepFormResolver(form, { stateNames: [] }, { fields: {}, shouldUseNativeValidation: false });
    expect(JSON.stringify(result.errors)).toContain("is not of the form name = value");
  });

  it("formFieldOf maps the family's variants onto the form: the first to the plant fields, the others to their rows", () => {
    expect(formFieldOf("family.variants.0.label")).toBe("firstVariant.label");
    expect(formFieldOf("family.variants.0.plantRevisionId")).toBe("plantRevisionId");
    expect(formFieldOf("family.variants.2.plantRevisionId")).toBe("variants.1.plantRevisionId");
    expect(formFieldOf(["family", "variants", 1, "parameters", "k"])).toBe("variants.0.parameters");
  });
});

describe("performancePreset", () => {
  it("performancePreset recovers M, ωB and A from the stored num/den of the preset and refuses other weights", () => {
    // W = (s/M + ωB)/(s + ωB·A) with M = 2, ωB = 0.3, A = 1e-4 ⇒ num = [0.5, 0.3], den = [1, 3e-5] (closed form).
    const preset = performancePreset({ num: [0.5, 0.3], den: [1, 3e-5] });
    expect(preset?.M).toBeCloseTo(2, 12);
    expect(preset?.omegaB).toBeCloseTo(0.3, 12);
    expect(preset?.A).toBeCloseTo(1e-4, 12);
    expect(performancePreset({ num: [1], den: [1, 1] })).toBeNull();
    expect(performancePreset(undefined)).toBeNull();
  });
});
