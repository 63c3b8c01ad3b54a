import { checkExpression } from "./check-expression.js";
import type { ExpressionFunctionName } from "./expression-functions.js";
import { generateExpressionSource } from "./generate-source.js";
import { instantiateSource } from "./instantiate-source.js";
import { createNameScope, type ExpressionNames } from "./name-scope.js";

/**
 * A compiled expression: `x` holds the states in declaration order, `p` the
 * parameters in declaration order, `u` the input, `t` the time (read only
 * when a time name was declared). Real-valued: `sqrt`, `log` and `^` of
 * out-of-domain arguments give NaN (as `Math.*` does) rather than a complex
 * number; division by zero gives ±Infinity or NaN. Callers that integrate
 * such functions treat a non-finite value as divergence.
 */
export type CompiledExpression = (x: Float64Array, p: Float64Array, u: number, t: number) => number;

/**
 * Compiles one user-typed expression, e.g. `(-a*sqrt(h) + b*u)/A`, into a
 * fast JavaScript function without ever evaluating the text.
 *
 * Steps: the declared names are checked (`createNameScope`); the text is
 * parsed by mathjs `parse` and accepted only if it fits the grammar of
 * `checkExpression`; JavaScript is generated from the checked tree
 * (`generateExpressionSource`) and instantiated (`instantiateSource`).
 *
 * ```ts
 * const f = compileExpression("(-a*sqrt(h) + b*u)/A", { states: ["h"], parameters: ["a", "b", "A"] });
 * f(Float64Array.of(4), Float64Array.of(0.5, 2, 10), 1, 0); // (-0.5·2 + 2·1)/10 = 0.1
 * ```
 *
 * @throws DeclaredNameError when a declared name is unusable.
 * @throws ExpressionError when the text is refused; the message names the token and column.
 */
export function compileExpression(text: string, names: ExpressionNames): CompiledExpression {
  const scope = createNameScope(names);
  const checked = checkExpression(text, scope);
  const used = new Set<ExpressionFunctionName>();
  const source = generateExpressionSource(checked.root, used);
  return instantiateSource<CompiledExpression>("x, p, u, t", `return ${source};`, used);
}
