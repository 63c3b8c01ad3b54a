import { checkExpression } from "./check-expression.js";
import { ExpressionError } from "./expression-error.js";
import type { ExpressionFunctionName } from "./expression-functions.js";
import { generateExpressionSource } from "./generate-source.js";
import { instantiateSource } from "./instantiate-source.js";
import { createNameScope, type ExpressionNames } from "./name-scope.js";

/**
 * A nonlinear plant written as text:
 *
 * ```text
 * dx_i/dt = derivatives[i](x, p, u, t)   for each state i (same order as states)
 * y       = output(x, p, u, t)
 * ```
 *
 * Each expression follows the grammar of `checkExpression`; the names of
 * `ExpressionNames` (states, parameters, input default `u`, optional time).
 */
export interface ExpressionSystemConfig extends ExpressionNames {
  /** One derivative expression per state, in the order of `states`. */
  readonly derivatives: readonly string[];
  /** The measured output. */
  readonly output: string;
}

/** The compiled right-hand side and output of an `ExpressionSystemConfig`. */
export interface CompiledSystem {
  /**
   * Writes dx/dt into `dx` (length ≥ number of states); allocates nothing.
   * All derivatives are computed before any is stored, so `dx` may even be
   * the same array as `x`.
   */
  readonly derivatives: (t: number, x: Float64Array, p: Float64Array, u: number, dx: Float64Array) => void;
  /** The output y at (t, x, u). */
  readonly output: (t: number, x: Float64Array, p: Float64Array, u: number) => number;
  /** Number of states (length of `x`). */
  readonly stateCount: number;
  /** Number of parameters (length of `p`). */
  readonly parameterCount: number;
}

/**
 * Compiles a nonlinear plant's derivative and output expressions. See
 * `compileExpression` for the method and its safety argument.
 *
 * ```ts
 * // Draining tank: A·dh/dt = −a·√h + b·u, y = h
 * const sys = compileSystem({ states: ["h"], parameters: ["a", "b", "A"],
 *   derivatives: ["(-a*sqrt(h) + b*u)/A"], output: "h" });
 * const dx = new Float64Array(1);
 * sys.derivatives(0, Float64Array.of(4), Float64Array.of(0.5, 2, 10), 1, dx); // dx[0] = 0.1
 * ```
 *
 * @throws RangeError when there are no states or the number of derivatives differs from it.
 * @throws DeclaredNameError when a declared name is unusable (its `field` is e.g. `states.1`).
 * @throws ExpressionError when an expression is refused (its `field` is `derivatives.<i>` or `output`).
 */
export function compileSystem(config: ExpressionSystemConfig): CompiledSystem {
  const { states, parameters, derivatives, output } = config;
  if (!Array.isArray(states) || states.length === 0) {
    throw new RangeError("states: declare at least one state");
  }
  if (!Array.isArray(derivatives) || derivatives.length !== states.length) {
    const given = Array.isArray(derivatives) ? derivatives.length : 0;
    throw new RangeError(
      `derivatives: expected one expression per state (${states.length}), got ${given}`,
    );
  }
  const scope = createNameScope(config);

  const generate = (text: string, field: string, used: Set<ExpressionFunctionName>): string => {
    try {
      return generateExpressionSource(checkExpression(text, scope).root, used);
    } catch (error) {
      throw error instanceof ExpressionError ? error.withField(field) : error;
    }
  };

  const derivativeUsed = new Set<ExpressionFunctionName>();
  const sources = derivatives.map((text, i) => generate(text, `derivatives.${i}`, derivativeUsed));
  const outputUsed = new Set<ExpressionFunctionName>();
  const outputSource = generate(output, "output", outputUsed);

  // Fixed templates around the generated expressions: d<i> are locals, dx[<i>] the caller's array.
  const derivativeStatements = [
    ...sources.map((source, i) => `const d${i} = ${source};`),
    ...sources.map((_, i) => `dx[${i}] = d${i};`),
  ].join("\n");

  return Object.freeze({
    derivatives: instantiateSource<CompiledSystem["derivatives"]>("t, x, p, u, dx", derivativeStatements, derivativeUsed),
    output: instantiateSource<CompiledSystem["output"]>("t, x, p, u", `return ${outputSource};`, outputUsed),
    stateCount: states.length,
    parameterCount: parameters.length,
  });
}
