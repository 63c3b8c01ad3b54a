/**
 * The error thrown when a user-typed expression is refused by the
 * expression compiler: a syntax error, a construct outside the whitelist
 * (see `checkExpression`), an unknown name or function, a wrong number of
 * arguments, or input beyond the size limits.
 *
 * The message names the offending token and, when it is known, its column
 * (1-based), e.g. `unknown name "k" at column 7; declared names are h, a, u`.
 */
export class ExpressionError extends Error {
  /** The expression text exactly as the user typed it. */
  readonly expression: string;
  /** The offending token as it appears in the text (may be "" for an empty expression). */
  readonly token: string;
  /** 0-based character position of `token` in `expression`, when known. */
  readonly index: number | undefined;
  /**
   * Dotted path of the expression inside a larger specification, e.g.
   * `derivatives.1` or `output` (set by `compileSystem`), when known.
   */
  readonly field: string | undefined;

  constructor(
    message: string,
    details: { expression: string; token: string; index?: number; field?: string },
  ) {
    super(message);
    this.name = "ExpressionError";
    this.expression = details.expression;
    this.token = details.token;
    this.index = details.index;
    this.field = details.field;
  }

  /** The same error, tagged with its place in a larger specification. */
  withField(field: string): ExpressionError {
    return new ExpressionError(this.message, {
      expression: this.expression,
      token: this.token,
      index: this.index,
      field,
    });
  }
}

/** Whether `value` is an `ExpressionError`. */
export function isExpressionError(value: unknown): value is ExpressionError {
  return value instanceof ExpressionError;
}
