/** The kind of name a user declares for an expression. */
export type NameRole = "state" | "parameter" | "input" | "time";

/**
 * The error thrown when a declared state, parameter, input or time name is
 * not usable: not an identifier, too long, declared twice, a function name,
 * an operator word of the expression syntax, or a reserved word.
 */
export class DeclaredNameError extends Error {
  /** The refused name exactly as declared. */
  readonly identifier: string;
  /** What the name was declared as. */
  readonly role: NameRole;
  /** Dotted path of the declaration, e.g. `states.1`, `parameters.0`, `input`, `time`. */
  readonly field: string;

  constructor(message: string, details: { identifier: string; role: NameRole; field: string }) {
    super(message);
    this.name = "DeclaredNameError";
    this.identifier = details.identifier;
    this.role = details.role;
    this.field = details.field;
  }
}

/** Whether `value` is a `DeclaredNameError`. */
export function isDeclaredNameError(value: unknown): value is DeclaredNameError {
  return value instanceof DeclaredNameError;
}
