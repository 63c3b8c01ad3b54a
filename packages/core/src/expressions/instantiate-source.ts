import { EXPRESSION_FUNCTIONS, type ExpressionFunctionName } from "./expression-functions.js";

/**
 * The argument lists a compiled function may have. A closed union: no
 * caller can put other text into the function header.
 */
export type CompiledSignature = "x, p, u, t" | "t, x, p, u" | "t, x, p, u, dx";

/**
 * Builds a function with `new Function` from generated statements.
 *
 * Why this is safe: `statements` is produced by `generateExpressionSource`
 * (and the fixed templates of `compileExpression`/`compileSystem`) from a
 * tree that `checkExpression` built out of whitelisted nodes only; user text
 * never reaches it — names became slot indices, numbers were re-printed from
 * their parsed values, and each generated expression was re-scanned against
 * the output grammar. The functions are captured once from a frozen,
 * prototype-free table of `Math.*` references and bound to `const`s named
 * `f_<name>`; the compiled code has no way to reach anything else (it runs
 * in strict mode, with no `this`, and reads only its arguments).
 */
export function instantiateSource<F>(
  signature: CompiledSignature,
  statements: string,
  used: ReadonlySet<ExpressionFunctionName>,
): F {
  const bindings = [...used]
    .sort()
    .map((name) => `const f_${name} = F.${name};`)
    .join("\n");
  const factory = new Function(
    "F",
    `"use strict";\n${bindings}\nreturn function compiled(${signature}) {\n${statements}\n};`,
  ) as (table: typeof IMPLEMENTATIONS) => F;
  return factory(IMPLEMENTATIONS);
}

/** name → Math.* implementation; frozen and without a prototype. */
const IMPLEMENTATIONS: Readonly<Record<ExpressionFunctionName, (...args: number[]) => number>> =
  Object.freeze(
    Object.assign(
      Object.create(null) as Record<ExpressionFunctionName, (...args: number[]) => number>,
      Object.fromEntries(
        (Object.keys(EXPRESSION_FUNCTIONS) as ExpressionFunctionName[]).map((name) => [
          name,
          EXPRESSION_FUNCTIONS[name].impl,
        ]),
      ),
    ),
  );
