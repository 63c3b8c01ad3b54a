import { describe, expect, it } from "vitest";
import { plantInputSchema, sweepInputSchema } from "@loopyard/core";
import { FORM_LEVEL, apiIssues, fieldErrors } from "../../src/forms/field-errors.js";

const PLANT_FIELDS = ["name", "unitsNote", "model.num", "model.den", "model.delay"];

describe("fieldErrors", () => {
  it("fieldErrors puts a zod issue of the shared plant schema next to the field it names", () => {
    const result = plantInputSchema.safeParse({
      name: "Ember test",
      unitsNote: "",
      model: { kind: "transfer-function", num: [1], den: [0, 1], delay: 0 },
    });
    expect(result.success).toBe(false);
    if (!result.success) {
      const errors = fieldErrors(result.error.issues, PLANT_FIELDS);
      expect(errors["model.den"]).toBe("the leading denominator coefficient must be non-zero");
      expect(Object.keys(errors)).toEqual(["model.den"]);
    }
  });

  it("fieldErrors maps a deeper path to the longest field that is its prefix", () => {
    expect(fieldErrors([{ path: ["model", "num", 2], message: "bad" }], PLANT_FIELDS)).toEqual({ "model.num": "bad" });
  });

  it("fieldErrors keeps the first message per field and sends unclaimed problems to the form level", () => {
    const errors = fieldErrors(
      [
        { path: "name", message: "first" },
        { path: "name", message: "second" },
        { path: "owner", message: "unknown field" },
      ],
      PLANT_FIELDS,
    );
    expect(errors.name).toBe("first");
    expect(errors[FORM_LEVEL]).toBe("owner: unknown field");
  });

  it("fieldErrors shows the sweep schema's candidate cap on the ranges field", () => {
    const result = sweepInputSchema.safeParse({
      name: "too big",
      plantRevisionId: "00000000-0000-4000-8000-000000000000",
      // 100 × 100 × 101 = 1,010,000 candidates: over the cap of every schema version (5000, then 1,000,000).
      ranges: { kp: { min: 0.1, max: 1, count: 100 }, ki: { min: 0, max: 1, count: 100 }, kd: { min: 0, max: 1, count: 101 } },
      scenario: { horizon: 10, dt: 0.01 },
    });
    expect(result.success).toBe(false);
    if (!result.success) {
      const errors = fieldErrors(result.error.issues, ["name", "ranges", "ranges.kp.count"]);
      expect(errors.ranges).toMatch(/1,?010,?000 candidates/);
    }
  });
});

describe("apiIssues", () => {
  it("apiIssues turns a 400 with one field into one issue and drops the repeated field prefix", () => {
    expect(apiIssues({ field: "model.den", message: "model.den: the leading denominator coefficient must be non-zero" })).toEqual([
      { path: "model.den", message: "the leading denominator coefficient must be non-zero" },
    ]);
  });

  it("apiIssues prefers the full issue list when the server sends one", () => {
    const issues = apiIssues({
      field: "name",
      message: "name: give the plant a name",
      issues: [
        { field: "name", message: "give the plant a name" },
        { field: "model.delay", message: "dead time must be ≥ 0 s" },
      ],
    });
    expect(issues.map((i) => i.path)).toEqual(["name", "model.delay"]);
  });

  it("apiIssues gives nothing for an error that names no field (e.g. a 403)", () => {
    expect(apiIssues({ message: "Creating plants needs the engineer role" })).toEqual([]);
  });
});
