import { describe, expect, it } from "vitest";
import { assertValidStructure, controllerFromVector, structureParameterNames } from "../../src/batch/structure.js";

describe("controllerFromVector", () => {
  it("controllerFromVector maps tunable values in order and derives tf = kd/(n·kp) from a ratio filter", () => {
    // Ideal-form filter Td/N with Td = kd/kp (Åström & Hägglund 2006, §3.3): tf = kd/(N·kp).
    const structure = { kind: "pid" as const, tunable: ["kd", "kp"], fixed: { ki: 0.3 }, filter: { mode: "ratio" as const, n: 10 } };
    assertValidStructure(structure);
    const c = controllerFromVector(structure, Float64Array.of(9, 9, 0.8, 2), 2);
    expect(c).toEqual({ kind: "pid", kp: 2, ki: 0.3, kd: 0.8, tf: expect.closeTo(0.04, 15) });
    expect(controllerFromVector(structure, [0, 2])).toMatchObject({ kd: 0, tf: 0 });
    expect(Number.isNaN((controllerFromVector(structure, [1, 0]) as { tf: number }).tf)).toBe(true);
  });

  it("controllerFromVector builds state feedback from k[0]…k[m−1] and n", () => {
    const structure = { kind: "state-feedback" as const, tunable: ["k[1]", "k[0]"], fixed: { n: 3 } };
    expect(structureParameterNames(structure)).toEqual(["k[0]", "k[1]", "n"]);
    assertValidStructure(structure, 2);
    expect(controllerFromVector(structure, [5, 4])).toEqual({ kind: "state-feedback", k: [4, 5], n: 3 });
  });

  it("assertValidStructure names the bad field", () => {
    expect(() => assertValidStructure({ kind: "pi", tunable: ["kp", "kd"], fixed: { ki: 1 } })).toThrow(/structure\.tunable\[1\]/);
    expect(() => assertValidStructure({ kind: "pi", tunable: ["kp"], fixed: {} })).toThrow(/structure\.fixed\.ki/);
    expect(() => assertValidStructure({ kind: "pi", tunable: ["kp"], fixed: { kp: 1, ki: 1 } })).toThrow(/structure\.fixed\.kp/);
    expect(() => assertValidStructure({ kind: "p", tunable: ["kp"], fixed: {}, filter: { mode: "ratio", n: 10 } })).toThrow(/structure\.filter/);
    expect(() => assertValidStructure({ kind: "state-feedback", tunable: ["k[0]"], fixed: { n: 1 } }, 3)).toThrow(/3 gains/);
  });
});
