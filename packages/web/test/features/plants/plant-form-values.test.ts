import { describe, expect, it } from "vitest";
import { EMPTY_PLANT_FORM, readPlantForm } from "../../../src/features/plants/plant-form-values.js";

const form = (num: string, den: string, delay = "0", name = "Ember test") => ({ ...EMPTY_PLANT_FORM, name, model: { num, den, delay } });

describe("readPlantForm", () => {
  it("readPlantForm turns typed text into the plant input the API takes", () => {
    const read = readPlantForm(form("1.5", "80, 24 1", "1"));
    expect(read).toEqual({
      ok: true,
      input: { name: "Ember test", unitsNote: "", model: { kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 } },
    });
  });

  it("readPlantForm names the bad token at the coefficient field and checks the name at the same time", () => {
    const read = readPlantForm(form("1", "4 1o", "0", ""));
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors["model.den"]).toContain("“1o”");
      expect(read.errors.name).toBe("give the plant a name");
    }
  });

  it("readPlantForm puts the shared schema's properness rule on the numerator field", () => {
    // deg num = 2 > deg den = 1: improper, refused by transferFunctionSchema.
    const read = readPlantForm(form("1 0 0", "1 1"));
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.errors["model.num"]).toMatch(/proper/);
  });

  it("readPlantForm refuses a negative or non-numeric dead time at the dead-time field", () => {
    for (const delay of ["-1", "one"]) {
      const read = readPlantForm(form("1", "1 1", delay));
      expect(read.ok).toBe(false);
      if (!read.ok) expect(Object.keys(read.errors)).toEqual(["model.delay"]);
    }
  });
});
