import { describe, expect, it } from "vitest";
import { STRUCTURE_PARAMETERS } from "../../src/batch/structure.js";
import { controllerSchema, type Controller } from "../../src/controllers/controller.js";
import { assertValidController } from "../../src/controllers/controller-realization.js";
import { CONTROLLER_PARAMETERS, type FixedParameterKind } from "../../src/controllers/controller-parameters.js";
import { parameterSign } from "../../src/sweeps/sweep-input.js";

// The parameter table is the one statement of each kind's parameters (common practice: one source
// of truth); these checks hold the readers to it.
const KINDS = Object.keys(CONTROLLER_PARAMETERS) as FixedParameterKind[];

/** A valid controller of the kind: every table parameter 1 (tf > 0 and tLag > 0 keep the cross-field rules). */
function unitController(kind: FixedParameterKind): Record<string, unknown> {
  return { kind, ...Object.fromEntries(CONTROLLER_PARAMETERS[kind].map((p) => [p.name, 1])) };
}

describe("CONTROLLER_PARAMETERS", () => {
  it("STRUCTURE_PARAMETERS lists exactly the table's names in the table's order", () => {
    for (const kind of KINDS) expect(STRUCTURE_PARAMETERS[kind]).toEqual(CONTROLLER_PARAMETERS[kind].map((p) => p.name));
  });

  it("controllerSchema and assertValidController accept the unit controller of every kind and refuse it without any one table parameter", () => {
    for (const kind of KINDS) {
      const valid = unitController(kind);
      expect(controllerSchema.safeParse(valid).success).toBe(true);
      expect(() => assertValidController(valid as unknown as Controller)).not.toThrow();
      for (const p of CONTROLLER_PARAMETERS[kind]) {
        const { [p.name]: _dropped, ...without } = valid;
        const parsed = controllerSchema.safeParse(without);
        expect(parsed.success, `${kind} without ${p.name}`).toBe(false);
        expect(parsed.error?.issues[0]?.path).toEqual([p.name]);
        expect(() => assertValidController(without as unknown as Controller)).toThrow(new RegExp(`^controller\\.${p.name} must be a finite number`));
      }
    }
  });

  it("a negative value is refused by both checks exactly where the table's sign says so", () => {
    for (const kind of KINDS) {
      for (const p of CONTROLLER_PARAMETERS[kind]) {
        const negative = { ...unitController(kind), [p.name]: -1 };
        const schemaOk = controllerSchema.safeParse(negative).success;
        let assertOk = true;
        try {
          assertValidController(negative as unknown as Controller);
        } catch {
          assertOk = false;
        }
        expect(schemaOk, `${kind}.${p.name} in controllerSchema`).toBe(p.sign === "any");
        expect(assertOk, `${kind}.${p.name} in assertValidController`).toBe(p.sign === "any");
      }
    }
  });

  it("parameterSign reads the sweep sign from the table (gains ≥ 0 in sweeps, lead–lag times > 0, state gains free)", () => {
    expect(parameterSign("pid", "kp")).toBe("non-negative");
    expect(parameterSign("pid", "tf")).toBe("non-negative");
    expect(parameterSign("lead-lag", "tLead")).toBe("positive");
    expect(parameterSign("state-feedback", "k[3]")).toBe("any");
    expect(parameterSign("state-feedback", "n")).toBe("any");
    expect(parameterSign("pi", "sampleTime")).toBe("positive");
  });
});
