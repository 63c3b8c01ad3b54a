import { describe, expect, it } from "vitest";
import { diffFamilyRevisions, diffPlantRevisions } from "../../src/revisions/revision-diff.js";
import type { Plant } from "../../src/plants/plant.js";

const HEATER = "6a1d7c1f-9b5f-4c54-8e5d-2a2a3c1b0d22";
const LINEAR = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";
const rev = (model: Plant, name = "Ember 200", unitsNote = "") => ({ name, unitsNote, model });

// Every expectation below is worked out by hand from the two revisions (closed form: the diff is the set of differing leaves).
describe("diffPlantRevisions", () => {
  it("diffPlantRevisions names each changed coefficient, the dead time and the limits, and nothing else", () => {
    const a = rev({ kind: "transfer-function", num: [2], den: [5, 1], delay: 0.5, actuator: { min: 0, max: 10 } });
    const b = rev({ kind: "transfer-function", num: [2], den: [5, -1], delay: 0.8, actuator: { min: 0, max: 12, rate: 3 } });
    expect(diffPlantRevisions(a, b)).toEqual([
      { field: "model.actuator.max", group: "limits", change: "changed", before: 10, after: 12 },
      { field: "model.actuator.rate", group: "limits", change: "added", after: 3 },
      { field: "model.delay", group: "coefficients", change: "changed", before: 0.5, after: 0.8 },
      { field: "model.den.1", group: "coefficients", change: "changed", before: 1, after: -1 },
    ]);
    expect(diffPlantRevisions(a, a)).toEqual([]);
  });

  it("diffPlantRevisions compares a coefficient vector of another length, and a resized matrix, as a whole", () => {
    const a = rev({ kind: "transfer-function", num: [1], den: [5, 1], delay: 0 });
    const b = rev({ kind: "transfer-function", num: [1], den: [1, 6, 1], delay: 0 });
    expect(diffPlantRevisions(a, b)).toEqual([{ field: "model.den", group: "coefficients", change: "changed", before: [5, 1], after: [1, 6, 1] }]);
    const s1 = rev({ kind: "state-space", A: [[-1, 0], [0, -2]], B: [[1], [0]], C: [[1, 0]], D: [[0]] });
    const s2 = rev({ kind: "state-space", A: [[-1, 0.5], [0, -2]], B: [[1], [0]], C: [[1, 0]], D: [[0]] });
    const s3 = rev({ kind: "state-space", A: [[-1]], B: [[1]], C: [[1]], D: [[0]] });
    expect(diffPlantRevisions(s1, s2)).toEqual([{ field: "model.A.0.1", group: "matrices", change: "changed", before: 0, after: 0.5 }]);
    expect(diffPlantRevisions(s1, s3).map((c) => c.field)).toEqual(["model.A", "model.B", "model.C"]);
  });

  it("diffPlantRevisions lists expressions and parameters of a nonlinear plant, and a change of kind as the whole model", () => {
    const n1: Plant = { kind: "nonlinear", states: ["T"], parameters: { m: 2, Ta: 20 }, derivatives: ["(u - 4*(T - Ta))/(m*900)"], output: "T", initial: [20] };
    const n2: Plant = { ...n1, parameters: { m: 2.1, Ta: 20, eps: 0.9 }, derivatives: ["(u - 4*(T - Ta) - eps*1e-8*T^4)/(m*900)"] };
    expect(diffPlantRevisions(rev(n1, "Ember 800"), rev(n2, "Ember 800", "u: W"))).toEqual([
      { field: "unitsNote", group: "description", change: "changed", before: "", after: "u: W" },
      { field: "model.derivatives.0", group: "expressions", change: "changed", before: n1.derivatives[0], after: n2.derivatives[0] },
      { field: "model.parameters.eps", group: "parameters", change: "added", after: 0.9 },
      { field: "model.parameters.m", group: "parameters", change: "changed", before: 2, after: 2.1 },
    ]);
    const tf: Plant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    expect(diffPlantRevisions(rev(n1), rev(tf))).toEqual([{ field: "model", group: "coefficients", change: "changed", before: n1, after: tf }]);
  });
});

describe("diffFamilyRevisions", () => {
  it("diffFamilyRevisions lists variants added, removed and with changed parameter values, and the spread that changed", () => {
    const a = {
      name: "Ember line",
      description: "",
      definition: {
        entries: [
          { plantRevisionId: LINEAR, label: "Ember 200" },
          { plantRevisionId: HEATER, label: "Ember 800", parameters: { m: 2 } },
        ],
      },
    };
    const b = {
      name: "Ember line",
      description: "with spread",
      definition: {
        entries: [
          { plantRevisionId: HEATER, label: "Ember 800", parameters: { m: 2.2 } },
          { plantRevisionId: HEATER, label: "hot room", spread: { ranges: { Ta: { min: 30, max: 40, count: 2 } }, design: { kind: "grid" as const } } },
        ],
      },
    };
    const changes = diffFamilyRevisions(a, b);
    expect(changes.map((c) => [c.field, c.change])).toEqual([
      ["description", "changed"],
      ["variants.Ember 200", "removed"],
      ["variants.Ember 800.parameters.m", "changed"],
      ["variants.hot room · Ta 30", "added"],
      ["variants.hot room · Ta 40", "added"],
      ["entries.1.spread", "added"],
    ]);
    expect(changes.every((c) => c.group === (c.field === "description" ? "description" : "variants"))).toBe(true);
    expect(diffFamilyRevisions(b, b)).toEqual([]);
  });
});
