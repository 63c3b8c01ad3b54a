import { describe, expect, it } from "vitest";
import { DeclaredNameError } from "./declared-name-error.js";
import { createNameScope } from "./name-scope.js";

// The rules under test are Loopyard's own (documented in name-scope.ts); the
// reserved-word list follows ECMA-262 2023 §13.1 "Identifiers" (from memory).

function refusal(call: () => unknown): DeclaredNameError {
  try {
    call();
  } catch (error) {
    expect(error).toBeInstanceOf(DeclaredNameError);
    return error as DeclaredNameError;
  }
  throw new Error("expected a DeclaredNameError");
}

describe("createNameScope", () => {
  it("createNameScope maps states to x slots, parameters to p slots, the input and time to their arguments", () => {
    const scope = createNameScope({ states: ["h", "T"], parameters: ["a", "b"], input: "q", time: "tau" });
    expect(scope.bindings.get("T")).toEqual({ role: "state", slot: 1 });
    expect(scope.bindings.get("b")).toEqual({ role: "parameter", slot: 1 });
    expect(scope.bindings.get("q")).toEqual({ role: "input", slot: 0 });
    expect(scope.bindings.get("tau")).toEqual({ role: "time", slot: 0 });
    expect(scope.declared).toEqual(["h", "T", "a", "b", "q", "tau"]);
  });

  it("createNameScope declares the input u by default and no time name", () => {
    const scope = createNameScope({ states: ["h"], parameters: [] });
    expect(scope.bindings.get("u")).toEqual({ role: "input", slot: 0 });
    expect(scope.bindings.has("t")).toBe(false);
  });

  it("createNameScope finds no inherited properties such as constructor or __proto__", () => {
    const scope = createNameScope({ states: ["h"], parameters: [] });
    expect(scope.bindings.get("constructor")).toBeUndefined();
    expect(scope.bindings.get("__proto__")).toBeUndefined();
  });

  it.each([
    ["2h", "is not a valid name"],
    ["h-1", "is not a valid name"],
    ["é", "is not a valid name"],
    ["", "is empty"],
    ["sqrt", "is the name of a function"],
    ["pow", "is the name of a function"],
    ["mod", "is an operator word"],
    ["in", "is an operator word"],
    ["constructor", "is a reserved word"],
    ["__proto__", "is a reserved word"],
    ["prototype", "is a reserved word"],
    ["return", "is a reserved word"],
    ["true", "is a reserved word"],
    ["NaN", "is a reserved word"],
  ])("createNameScope refuses the state name %j (%s)", (name, reason) => {
    const error = refusal(() => createNameScope({ states: ["x", name], parameters: [] }));
    expect(error.message).toContain(`state name "${name}" ${reason}`);
    expect(error.identifier).toBe(name);
    expect(error.role).toBe("state");
    expect(error.field).toBe("states.1");
  });

  it("createNameScope refuses a name longer than 64 characters", () => {
    const error = refusal(() => createNameScope({ states: [], parameters: ["k".repeat(65)] }));
    expect(error.message).toContain("longer than 64 characters");
    expect(error.field).toBe("parameters.0");
  });

  it("createNameScope refuses a parameter declared with a state's name, naming both roles", () => {
    const error = refusal(() => createNameScope({ states: ["h"], parameters: ["a", "h"] }));
    expect(error.message).toBe('parameter name "h" is already declared as a state; each name may be declared once');
    expect(error.field).toBe("parameters.1");
  });

  it("createNameScope refuses a state named like the default input u", () => {
    const error = refusal(() => createNameScope({ states: ["u"], parameters: [] }));
    expect(error.message).toBe('input name "u" is already declared as a state; each name may be declared once');
    expect(error.field).toBe("input");
  });

  it("createNameScope refuses a bad time name in the time field", () => {
    const error = refusal(() => createNameScope({ states: ["h"], parameters: [], time: "new" }));
    expect(error.field).toBe("time");
    expect(error.role).toBe("time");
  });
});
