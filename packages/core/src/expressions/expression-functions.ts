/**
 * The functions an expression may call, with their arity and the
 * JavaScript implementation the compiled code uses. All are real-valued:
 * where a complex-number library would return a complex result
 * (`sqrt(-1)`, `log(-1)`, `(-8)^(1/3)`), the compiled function returns NaN,
 * as `Math.*` does. The simulator treats a non-finite state as divergence.
 *
 * | name  | arity | meaning                          | implementation |
 * |-------|-------|----------------------------------|----------------|
 * | sqrt  | 1     | square root                      | Math.sqrt      |
 * | exp   | 1     | e^x                              | Math.exp       |
 * | log   | 1     | natural logarithm                | Math.log       |
 * | sin   | 1     | sine, x in radians               | Math.sin       |
 * | cos   | 1     | cosine, x in radians             | Math.cos       |
 * | tan   | 1     | tangent, x in radians            | Math.tan       |
 * | tanh  | 1     | hyperbolic tangent               | Math.tanh      |
 * | abs   | 1     | absolute value                   | Math.abs       |
 * | sign  | 1     | −1, 0 or 1                       | Math.sign      |
 * | pow   | 2     | pow(x, y) = x^y                  | Math.pow       |
 * | min   | ≥ 2   | smallest argument                | Math.min       |
 * | max   | ≥ 2   | largest argument                 | Math.max       |
 */
export interface ExpressionFunction {
  /** Fewest arguments accepted. */
  readonly minArgs: number;
  /** Most arguments accepted (`Infinity` for variadic). */
  readonly maxArgs: number;
  /** The implementation captured by compiled code (never looked up by a user-typed name). */
  readonly impl: (...args: number[]) => number;
}

/** Upper bound on the arguments of `min`/`max`, so a call cannot grow without limit. */
const MAX_VARIADIC_ARGS = 32;

/** The whitelisted functions, frozen. Keys are the only names a call may use. */
export const EXPRESSION_FUNCTIONS: Readonly<Record<ExpressionFunctionName, ExpressionFunction>> =
  Object.freeze({
    sqrt: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.sqrt }),
    exp: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.exp }),
    log: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.log }),
    sin: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.sin }),
    cos: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.cos }),
    tan: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.tan }),
    tanh: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.tanh }),
    abs: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.abs }),
    sign: Object.freeze({ minArgs: 1, maxArgs: 1, impl: Math.sign }),
    pow: Object.freeze({ minArgs: 2, maxArgs: 2, impl: Math.pow }),
    min: Object.freeze({ minArgs: 2, maxArgs: MAX_VARIADIC_ARGS, impl: Math.min }),
    max: Object.freeze({ minArgs: 2, maxArgs: MAX_VARIADIC_ARGS, impl: Math.max }),
  });

/** Names of the whitelisted functions. */
export type ExpressionFunctionName =
  | "sqrt"
  | "exp"
  | "log"
  | "sin"
  | "cos"
  | "tan"
  | "tanh"
  | "abs"
  | "sign"
  | "pow"
  | "min"
  | "max";

/** The whitelisted function names, in table order. */
export const EXPRESSION_FUNCTION_NAMES: readonly ExpressionFunctionName[] = Object.freeze(
  Object.keys(EXPRESSION_FUNCTIONS) as ExpressionFunctionName[],
);

/** Whether `name` is a whitelisted function (own keys only; `constructor` is not). */
export function isExpressionFunctionName(name: string): name is ExpressionFunctionName {
  return Object.hasOwn(EXPRESSION_FUNCTIONS, name);
}
