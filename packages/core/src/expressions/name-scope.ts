import { DeclaredNameError, type NameRole } from "./declared-name-error.js";
import { isExpressionFunctionName } from "./expression-functions.js";

/**
 * The names an expression may use. States and parameters are mapped to
 * slots of the `x` and `p` arrays of the compiled function, in declaration
 * order; the input (default `u`) to its `u` argument; the time, only when a
 * time name is declared, to its `t` argument.
 *
 * A declared name must match `/^[A-Za-z_][A-Za-z0-9_]*$/`, be at most
 * `MAX_NAME_LENGTH` characters, be declared once, and not be a whitelisted
 * function name, an operator word of the expression syntax (`mod`, `and`,
 * `or`, `xor`, `not`, `to`, `in`), a literal of the syntax (`true`, `false`,
 * `null`, `undefined`, `NaN`, `Infinity`), a reserved word of JavaScript, or
 * one of `constructor`, `__proto__`, `prototype`. (User names never reach
 * the generated JavaScript — they become array slots — so the reserved-word
 * rule is defence in depth and keeps names portable.)
 */
export interface ExpressionNames {
  /** State names, in the order of the state vector `x`. */
  readonly states: readonly string[];
  /** Parameter names, in the order of the parameter vector `p`. */
  readonly parameters: readonly string[];
  /** Name of the plant input; `u` when omitted. */
  readonly input?: string;
  /** Name of the time variable; time cannot be used when omitted. */
  readonly time?: string;
}

/** Where a declared name lives in the compiled function's arguments. */
export interface NameBinding {
  readonly role: NameRole;
  /** Slot in `x` (states) or `p` (parameters); 0 for input and time. */
  readonly slot: number;
}

/** A checked set of declared names. */
export interface NameScope {
  /** Own-key lookup only (a `Map`), so `constructor` or `__proto__` are never found by accident. */
  readonly bindings: ReadonlyMap<string, NameBinding>;
  /** All declared names in order: states, parameters, input, time. */
  readonly declared: readonly string[];
}

/** The input name used when none is declared. */
export const DEFAULT_INPUT_NAME = "u";
/** Longest accepted declared name, in characters. */
export const MAX_NAME_LENGTH = 64;

const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** Words the expression syntax reads as operators (mathjs `parse`). */
const OPERATOR_WORDS = new Set(["mod", "and", "or", "xor", "not", "to", "in"]);

/** Literals of the expression syntax or of JavaScript. */
const LITERAL_WORDS = new Set(["true", "false", "null", "undefined", "NaN", "Infinity"]);

/** Reserved words of JavaScript (ECMAScript 2023, including strict-mode and contextual ones) and object-model names. */
const RESERVED_WORDS = new Set([
  "break", "case", "catch", "class", "const", "continue", "debugger", "default", "delete",
  "do", "else", "enum", "export", "extends", "finally", "for", "function", "if", "import",
  "instanceof", "new", "return", "super", "switch", "this", "throw", "try", "typeof", "var",
  "void", "while", "with", "yield", "let", "static", "implements", "interface", "package",
  "private", "protected", "public", "await", "async", "arguments", "eval",
  "constructor", "__proto__", "prototype",
]);

/**
 * Checks the declared names and maps each to its slot.
 *
 * @throws DeclaredNameError naming the refused name and its field.
 */
export function createNameScope(names: ExpressionNames): NameScope {
  const bindings = new Map<string, NameBinding>();
  const declared: string[] = [];
  const roleOf = new Map<string, NameRole>();

  const declare = (identifier: string, role: NameRole, field: string, slot: number): void => {
    assertUsableName(identifier, role, field);
    const previous = roleOf.get(identifier);
    if (previous !== undefined) {
      throw new DeclaredNameError(
        `${role} name "${identifier}" is already declared as ${article(previous)} ${previous}; each name may be declared once`,
        { identifier, role, field },
      );
    }
    roleOf.set(identifier, role);
    bindings.set(identifier, Object.freeze({ role, slot }));
    declared.push(identifier);
  };

  if (!Array.isArray(names.states)) throw new TypeError("states: expected an array of names");
  if (!Array.isArray(names.parameters)) throw new TypeError("parameters: expected an array of names");
  names.states.forEach((name, i) => declare(name, "state", `states.${i}`, i));
  names.parameters.forEach((name, i) => declare(name, "parameter", `parameters.${i}`, i));
  declare(names.input ?? DEFAULT_INPUT_NAME, "input", "input", 0);
  if (names.time !== undefined) declare(names.time, "time", "time", 0);

  return Object.freeze({ bindings, declared: Object.freeze(declared) });
}

function assertUsableName(identifier: unknown, role: NameRole, field: string): asserts identifier is string {
  const fail = (identifierText: string, why: string): never => {
    throw new DeclaredNameError(`${role} name "${identifierText}" ${why}`, {
      identifier: identifierText,
      role,
      field,
    });
  };
  if (typeof identifier !== "string") return fail(String(identifier), "is not a string");
  if (identifier.length === 0) return fail(identifier, "is empty; give every name at least one letter");
  if (identifier.length > MAX_NAME_LENGTH) {
    return fail(identifier.slice(0, 20) + "…", `is longer than ${MAX_NAME_LENGTH} characters`);
  }
  if (!IDENTIFIER.test(identifier)) {
    return fail(identifier, "is not a valid name; use letters A–Z, digits and _, starting with a letter or _");
  }
  if (isExpressionFunctionName(identifier)) {
    return fail(identifier, "is the name of a function; choose another name");
  }
  if (OPERATOR_WORDS.has(identifier)) {
    return fail(identifier, "is an operator word of the expression syntax; choose another name");
  }
  if (LITERAL_WORDS.has(identifier) || RESERVED_WORDS.has(identifier)) {
    return fail(identifier, "is a reserved word; choose another name");
  }
}

function article(role: NameRole): string {
  return role === "input" ? "an" : "a";
}
