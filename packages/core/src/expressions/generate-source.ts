import type { CheckedNode } from "./check-expression.js";
import { EXPRESSION_FUNCTION_NAMES, type ExpressionFunctionName } from "./expression-functions.js";

/**
 * Generates the JavaScript source of one expression from a checked tree.
 *
 * Output grammar (every composite is fully parenthesised, so JavaScript's
 * own precedence never matters; the tree's structure is the meaning):
 *
 * ```text
 * js := number | "(-" number ")" | "x[" slot "]" | "p[" slot "]" | "u" | "t"
 *     | "(" js " " ("+"|"-"|"*"|"/") " " js ")" | "(" ("-"|"+") js ")"
 *     | "f_" fname "(" js (", " js)* ")"          (a ^ b  →  f_pow(a, b))
 * ```
 *
 * Nothing here reads text typed by a user: numbers come from the parsed,
 * finite `value` and are printed by `formatNumber`; names are slot indices;
 * operators and function names come from closed unions. As defence in depth
 * the result is re-scanned by `assertGeneratedSource`, which throws if any
 * token outside the output grammar ever appears.
 *
 * @param used  collects the function names the source calls.
 */
export function generateExpressionSource(root: CheckedNode, used: Set<ExpressionFunctionName>): string {
  const source = emit(root, used);
  assertGeneratedSource(source);
  return source;
}

function emit(node: CheckedNode, used: Set<ExpressionFunctionName>): string {
  switch (node.kind) {
    case "number":
      return formatNumber(node.value);
    case "name":
      switch (node.role) {
        case "state":
          return `x[${slotIndex(node.slot)}]`;
        case "parameter":
          return `p[${slotIndex(node.slot)}]`;
        case "input":
          return "u";
        case "time":
          return "t";
      }
      throw new TypeError("generateExpressionSource: unknown name role");
    case "unary":
      return `(${node.op}${emit(node.arg, used)})`;
    case "binary":
      if (node.op === "^") {
        used.add("pow");
        return `f_pow(${emit(node.left, used)}, ${emit(node.right, used)})`;
      }
      return `(${emit(node.left, used)} ${node.op} ${emit(node.right, used)})`;
    case "call":
      used.add(node.fn);
      return `f_${node.fn}(${node.args.map((arg) => emit(arg, used)).join(", ")})`;
  }
}

/**
 * Prints a finite number as a JavaScript literal that reads back to exactly
 * the same double. `String(x)` gives the shortest round-tripping decimal
 * (ECMA-262, Number::toString); the result is checked against a literal
 * pattern and for the round trip. Negative values (and −0) are parenthesised.
 *
 * @throws RangeError for a non-finite value.
 */
export function formatNumber(value: number): string {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new RangeError(`formatNumber: expected a finite number, got ${String(value)}`);
  }
  const magnitude = Math.abs(value);
  const text = String(magnitude);
  if (!NUMBER_LITERAL.test(text) || Number(text) !== magnitude) {
    throw new RangeError(`formatNumber: cannot print ${text} as a plain literal`);
  }
  return value < 0 || Object.is(value, -0) ? `(-${text})` : text;
}

const NUMBER_LITERAL = /^\d+(?:\.\d+)?(?:e[+-]\d+)?$/;

/** The tokens of the output grammar; sticky, tried at each position. */
const GENERATED_TOKEN = new RegExp(
  [
    String.raw`\s+`,
    String.raw`[()+\-*/,]`,
    String.raw`[xp]\[\d+\]`,
    String.raw`[ut](?![\w$])`,
    String.raw`f_(?:${EXPRESSION_FUNCTION_NAMES.join("|")})(?![\w$])`,
    String.raw`\d+(?:\.\d+)?(?:e[+-]\d+)?(?![\w$.])`,
  ].join("|"),
  "y",
);

/**
 * Throws unless `source` consists only of tokens of the output grammar.
 *
 * @throws Error naming the first foreign character (a bug in this module, never a user error).
 */
export function assertGeneratedSource(source: string): void {
  let at = 0;
  let previous = "";
  while (at < source.length) {
    GENERATED_TOKEN.lastIndex = at;
    const match = GENERATED_TOKEN.exec(source);
    // "(" may only open a group or a call of an f_ function: never follow a value (no x[0](), no (…)(…)).
    const callsValue = match !== null && match[0] === "(" && VALUE_END.test(previous);
    if (match === null || match[0].length === 0 || callsValue) {
      throw new Error(`generated source holds a token outside the whitelist at ${at}: ${JSON.stringify(source.slice(at, at + 12))}`);
    }
    if (match[0].trim() !== "") previous = match[0];
    at += match[0].length;
  }
}

/** A token that ends a value: a slot, u, t, a number or a closing parenthesis. */
const VALUE_END = /^(?:[xp]\[\d+\]|[ut]|\d[\d.e+-]*|\))$/;

function slotIndex(slot: number): number {
  if (!Number.isInteger(slot) || slot < 0) throw new RangeError(`slot must be a non-negative integer, got ${slot}`);
  return slot;
}
