import { describe, expect, it } from "vitest";
import type { PlantRevisionDto } from "@loopyard/core";
import { EMPTY_PLANT_FORM, plantFormFromRevision, readPlantForm, type PlantFormValues } from "../../../src/features/plants/plant-form-values.js";

const form = (num: string, den: string, delay = "0", name = "Ember test"): PlantFormValues => ({
  ...EMPTY_PLANT_FORM,
  name,
  model: { ...EMPTY_PLANT_FORM.model, num, den, delay },
});

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

  it("readPlantForm reads state-space matrices typed as rows and puts the schema's shape rule on B", () => {
    // x' = [0 1; −2 −3] x + [0; 1] u, y = [1 0] x: the companion form of 1/(s² + 3s + 2) (closed form).
    const base = { ...EMPTY_PLANT_FORM.model, kind: "state-space" as const, A: "0 1\n-2, -3", B: "0\n1", C: "1 0", D: "0" };
    const read = readPlantForm({ ...EMPTY_PLANT_FORM, name: "Ember ss", model: base });
    expect(read).toEqual({
      ok: true,
      input: { name: "Ember ss", unitsNote: "", model: { kind: "state-space", A: [[0, 1], [-2, -3]], B: [[0], [1]], C: [[1, 0]], D: [[0]] } },
    });
    const wrong = readPlantForm({ ...EMPTY_PLANT_FORM, name: "Ember ss", model: { ...base, B: "0 1" } });
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) expect(wrong.errors["model.B"]).toMatch(/2×1/);
  });

  it("readPlantForm reads a nonlinear tank with its parameters, one derivative and initial value per state, and actuator limits", () => {
    const model = {
      ...EMPTY_PLANT_FORM.model,
      kind: "nonlinear" as const,
      states: "h",
      parameters: "a = 0.5\nb = 1\nA = 2",
      derivatives: ["(-a*sqrt(h) + b*u)/A"],
      output: "h",
      initial: ["1"],
      operatingInput: "0.5",
      actuator: { min: "0", max: "2", rate: "" },
    };
    const read = readPlantForm({ ...EMPTY_PLANT_FORM, name: "Tank", model });
    expect(read).toEqual({
      ok: true,
      input: {
        name: "Tank",
        unitsNote: "",
        model: {
          kind: "nonlinear",
          states: ["h"],
          parameters: { a: 0.5, b: 1, A: 2 },
          derivatives: ["(-a*sqrt(h) + b*u)/A"],
          output: "h",
          initial: [1],
          operatingInput: 0.5,
          actuator: { min: 0, max: 2 },
        },
      },
    });
  });

  it("readPlantForm names a missing initial value and an empty derivative at their own fields", () => {
    const model = { ...EMPTY_PLANT_FORM.model, kind: "nonlinear" as const, states: "x1 x2", derivatives: ["x2", ""], output: "x1", initial: ["0", ""] };
    const read = readPlantForm({ ...EMPTY_PLANT_FORM, name: "Two states", model });
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.errors["model.initial.1"]).toMatch(/x2/);
    const filled = readPlantForm({ ...EMPTY_PLANT_FORM, name: "Two states", model: { ...model, initial: ["0", "0"] } });
    expect(filled.ok).toBe(false);
    if (!filled.ok) expect(Object.keys(filled.errors)).toEqual(["model.derivatives.1"]);
  });

  it("readPlantForm refuses an actuator max below min at the max field (shared schema)", () => {
    const read = readPlantForm({ ...form("1", "1 1"), model: { ...form("1", "1 1").model, actuator: { min: "1", max: "0", rate: "" } } });
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.errors["model.actuator.max"]).toMatch(/exceed/);
  });

  it("plantFormFromRevision writes each kind back as the text readPlantForm reads (round trip)", () => {
    const models = [
      { kind: "transfer-function" as const, num: [1.5], den: [80, 24, 1], delay: 1 },
      { kind: "state-space" as const, A: [[0, 1], [-2, -3]], B: [[0], [1]], C: [[1, 0]], D: [[0]], actuator: { rate: 0.5 } },
      { kind: "nonlinear" as const, states: ["h"], parameters: { a: 0.5 }, derivatives: ["-a*sqrt(h) + u"], output: "h", initial: [1], operatingInput: 0.5 },
    ];
    for (const model of models) {
      const revision = { name: "R", unitsNote: "", model } as unknown as PlantRevisionDto;
      const read = readPlantForm(plantFormFromRevision(revision));
      expect(read).toEqual({ ok: true, input: { name: "R", unitsNote: "", model } });
    }
  });
});
