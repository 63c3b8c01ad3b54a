import { parse } from "mathjs/number";
import { ExpressionError } from "./expression-error.js";
import {
  EXPRESSION_FUNCTION_NAMES,
  EXPRESSION_FUNCTIONS,
  isExpressionFunctionName,
  type ExpressionFunctionName,
} from "./expression-functions.js";
import type { NameRole } from "./declared-name-error.js";
import type { NameScope } from "./name-scope.js";
import { TokenLocator, type LocatedToken } from "./token-locator.js";

/**
 * Parses a user-typed expression with mathjs `parse` and accepts only this
 * grammar (anything else throws an `ExpressionError` naming the token):
 *
 * ```text
 * expr    := expr ("+" | "-") expr | expr ("*" | "/") expr
 *          | expr "^" expr                  (right-associative: 2^3^2 = 2^9 = 512)
 *          | ("-" | "+") expr              (binds looser than ^: -2^2 = -(2^2) = -4)
 *          | "(" expr ")" | call | name | number
 * call    := fname "(" expr ("," expr)* ")"   with the arity of EXPRESSION_FUNCTIONS
 * fname   := sqrt | exp | log | sin | cos | tan | tanh | abs | min | max | sign | pow
 * name    := a declared state, parameter, input (default u) or time name
 * number  := a finite decimal (1, 0.5, .5, 2e-3) or 0x/0b/0o literal
 * ```
 *
 * Precedence and associativity are those of mathjs `parse` (from low to
 * high: `+ -`, `* /`, unary `- +`, `^`). Refused, among others: implicit
 * multiplication (`2h`, `2 h`, `(a)(b)`: write `2*h`), assignments
 * (`a = 1`), function definitions (`f(x) = x`), property access and indexing
 * (`x.constructor`, `a["b"]`), matrices, objects, strings, ranges,
 * conditionals, comparisons, other operators (`%`, `mod`, `!`, `'`, `.*` …),
 * constants such as `pi` or `e` that are not declared, several expressions
 * separated by `;` or a line break, and input beyond `EXPRESSION_LIMITS`.
 *
 * The result is Loopyard's own small tree (`CheckedNode`), holding only
 * numbers, slot indices, operator symbols and whitelisted function names;
 * no text from the user survives into it except as a parsed finite number.
 */
export function checkExpression(text: string, scope: NameScope): CheckedExpression {
  if (typeof text !== "string") {
    throw new ExpressionError("the expression must be text", { expression: String(text), token: "" });
  }
  if (text.length > EXPRESSION_LIMITS.maxLength) {
    throw new ExpressionError(
      `the expression is ${text.length} characters long; the limit is ${EXPRESSION_LIMITS.maxLength}`,
      { expression: text, token: text.slice(EXPRESSION_LIMITS.maxLength, EXPRESSION_LIMITS.maxLength + 10), index: EXPRESSION_LIMITS.maxLength },
    );
  }
  if (text.trim() === "") {
    throw new ExpressionError("the expression is empty; type a formula such as -a*h + b*u", {
      expression: text,
      token: "",
    });
  }
  const locator = new TokenLocator(text);
  const tooDeep = locator.firstDeeperThan(EXPRESSION_LIMITS.maxBracketDepth);
  if (tooDeep) {
    throw new ExpressionError(
      `brackets are nested more than ${EXPRESSION_LIMITS.maxBracketDepth} deep at "${tooDeep.text}" at column ${tooDeep.index + 1}`,
      { expression: text, token: tooDeep.text, index: tooDeep.index },
    );
  }
  let parsed: ParsedNode;
  try {
    parsed = parse(text) as unknown as ParsedNode;
  } catch (error) {
    throw syntaxError(text, locator, error);
  }
  const size = countNodes(parsed);
  if (size > EXPRESSION_LIMITS.maxNodes) {
    throw new ExpressionError(
      `the expression has more than ${EXPRESSION_LIMITS.maxNodes} parts (numbers, names, operators, calls); shorten it, e.g. with parameters`,
      { expression: text, token: "" },
    );
  }
  const checker = new Checker(text, scope, locator);
  const root = checker.walk(parsed, 1);
  return Object.freeze({ text, root, nodeCount: checker.nodeCount, depth: checker.maxDepth });
}

/** Size limits on a single expression. */
export const EXPRESSION_LIMITS = Object.freeze({
  /** Longest accepted text, in characters. */
  maxLength: 2000,
  /** Most parse-tree nodes (numbers, names, operators, calls, parentheses). */
  maxNodes: 1000,
  /** Deepest parse tree (a flat sum of n terms is n deep). */
  maxDepth: 512,
  /** Deepest nesting of brackets, checked before parsing. */
  maxBracketDepth: 32,
});

/** A node of the checked tree. */
export type CheckedNode =
  | { readonly kind: "number"; readonly value: number }
  | { readonly kind: "name"; readonly role: NameRole; readonly slot: number }
  | { readonly kind: "unary"; readonly op: UnaryOperator; readonly arg: CheckedNode }
  | { readonly kind: "binary"; readonly op: BinaryOperator; readonly left: CheckedNode; readonly right: CheckedNode }
  | { readonly kind: "call"; readonly fn: ExpressionFunctionName; readonly args: readonly CheckedNode[] };

export type UnaryOperator = "-" | "+";
export type BinaryOperator = "+" | "-" | "*" | "/" | "^";

/** The result of `checkExpression`. */
export interface CheckedExpression {
  /** The text as typed. */
  readonly text: string;
  readonly root: CheckedNode;
  /** Parse-tree nodes visited (parentheses included). */
  readonly nodeCount: number;
  /** Depth of the parse tree. */
  readonly depth: number;
}

/** The parts of a mathjs node this checker reads (mathjs's own types are generic-heavy). */
interface ParsedNode {
  readonly type: string;
  readonly value?: unknown;
  readonly name?: string;
  readonly op?: string;
  readonly fn?: ParsedNode | string;
  readonly args?: readonly ParsedNode[];
  readonly params?: readonly string[];
  readonly implicit?: boolean;
  readonly content?: ParsedNode;
  readonly object?: ParsedNode;
  readonly index?: { readonly dimensions: readonly ParsedNode[]; readonly dotNotation: boolean };
  readonly optionalChaining?: boolean;
  readonly conditionals?: readonly string[];
  forEach(callback: (child: ParsedNode) => void): void;
}

/** Number of nodes of a parsed tree, counted without recursion. */
function countNodes(root: ParsedNode): number {
  let count = 0;
  const pending: ParsedNode[] = [root];
  for (let node = pending.pop(); node !== undefined; node = pending.pop()) {
    count += 1;
    if (count > EXPRESSION_LIMITS.maxNodes) break;
    node.forEach((child) => pending.push(child));
  }
  return count;
}

// Lookup tables are Maps: a user token such as "constructor" must never find an inherited property.
const UNARY: ReadonlyMap<string, { op: UnaryOperator; fn: string }> = new Map([
  ["-", { op: "-", fn: "unaryMinus" }],
  ["+", { op: "+", fn: "unaryPlus" }],
]);

const BINARY: ReadonlyMap<string, { op: BinaryOperator; fn: string }> = new Map([
  ["+", { op: "+", fn: "add" }],
  ["-", { op: "-", fn: "subtract" }],
  ["*", { op: "*", fn: "multiply" }],
  ["/", { op: "/", fn: "divide" }],
  ["^", { op: "^", fn: "pow" }],
]);

/** Postfix operators of the syntax: their operand comes first in the text. */
const POSTFIX = new Set(["!", "'"]);

/** mathjs comparison function names → the symbol the user typed. */
const COMPARISON_SYMBOL: ReadonlyMap<string, string> = new Map([
  ["equal", "=="], ["unequal", "!="], ["smaller", "<"], ["larger", ">"], ["smallerEq", "<="], ["largerEq", ">="],
]);

/** Hints for well-known constants that are not part of the grammar. */
const CONSTANT_HINT: ReadonlyMap<string, string> = new Map([
  ["pi", " (write the number, e.g. 3.141592653589793, or declare a parameter)"],
  ["e", " (write exp(1) or the number 2.718281828459045, or declare a parameter)"],
]);

class Checker {
  nodeCount = 0;
  maxDepth = 0;

  constructor(
    private readonly text: string,
    private readonly scope: NameScope,
    private readonly locator: TokenLocator,
  ) {}

  walk(node: ParsedNode, depth: number): CheckedNode {
    this.nodeCount += 1;
    this.maxDepth = Math.max(this.maxDepth, depth);
    if (depth > EXPRESSION_LIMITS.maxDepth) {
      return this.fail(this.firstToken(node), (at) => `the expression is nested more than ${EXPRESSION_LIMITS.maxDepth} levels deep${at}`);
    }
    switch (node.type) {
      case "ConstantNode":
        return this.constant(node);
      case "SymbolNode":
        return this.symbol(node);
      case "ParenthesisNode": {
        this.locator.consume("(");
        const inner = this.walk(node.content as ParsedNode, depth + 1);
        this.locator.consume(")");
        return inner;
      }
      case "OperatorNode":
        return this.operator(node, depth);
      case "FunctionNode":
        return this.call(node, depth);
      case "AccessorNode": {
        // Report the leftmost access of a chain such as h.x.y first.
        if (node.object?.type === "AccessorNode") return this.walk(node.object, depth + 1);
        const dot = node.index?.dotNotation === true;
        const marker = dot ? (node.optionalChaining ? "?." : ".") : "[";
        const token = this.locator.next(marker);
        const shown = dot ? `${marker}${String(node.index?.dimensions[0]?.value)}` : "[";
        return this.fail(token, (at) => `property access "${shown}" is not allowed${at}; use the declared names only`, shown);
      }
      case "AssignmentNode":
        return this.fail(this.locator.next("="), (at) => `assignment "="${at} is not allowed; type only the right-hand side, e.g. -a*h + b*u`);
      case "FunctionAssignmentNode": {
        const signature = `${node.name ?? ""}(${(node.params ?? []).join(", ")}) =`;
        return this.fail(this.locator.next("="), (at) => `function definition "${signature}"${at} is not allowed; type only an expression`, "=");
      }
      case "ArrayNode":
        return this.fail(this.locator.next("["), (at) => `matrix "["${at} is not allowed; expressions work on single numbers`);
      case "ObjectNode":
        return this.fail(this.locator.next("{"), (at) => `object "{"${at} is not allowed; expressions work on single numbers`);
      case "RangeNode":
        return this.fail(this.locator.next(":"), (at) => `range ":"${at} is not allowed; expressions work on single numbers`);
      case "ConditionalNode":
        return this.fail(this.locator.next("?"), (at) => `conditional "?"${at} is not allowed; use min, max, abs or sign for piecewise terms`);
      case "RelationalNode": {
        const symbol = COMPARISON_SYMBOL.get(node.conditionals?.[0] ?? "") ?? "<";
        return this.fail(this.locator.next(symbol), (at) => `comparison "${symbol}"${at} is not allowed; use min, max, abs or sign for piecewise terms`, symbol);
      }
      case "BlockNode": {
        const separator = this.locator.next(";") ?? this.locator.next("\n");
        return this.fail(separator, (at) => `only one expression is allowed; remove the separator${at}`, separator?.key === "\n" ? "line break" : ";");
      }
      default:
        return this.fail(undefined, () => `this construct (${node.type}) is not allowed`, "");
    }
  }

  private constant(node: ParsedNode): CheckedNode {
    const value = node.value;
    if (typeof value === "number") {
      const token = this.locator.nextNumber();
      if (!Number.isFinite(value)) {
        return this.fail(token, (at) => `number "${token?.text ?? String(value)}"${at} is too large to be a finite number`);
      }
      this.locator.consumeNumber();
      return Object.freeze({ kind: "number", value });
    }
    if (typeof value === "string") {
      return this.fail(this.locator.nextString(), (at) => `text ${JSON.stringify(value)}${at} is not allowed; expressions work on numbers only`);
    }
    const shown = String(value);
    return this.fail(this.locator.next(shown), (at) => `"${shown}"${at} is not a number`, shown);
  }

  private symbol(node: ParsedNode): CheckedNode {
    const name = node.name ?? "";
    const binding = this.scope.bindings.get(name);
    if (binding === undefined) {
      const token = this.locator.next(name);
      if (isExpressionFunctionName(name)) {
        return this.fail(token, (at) => `function "${name}"${at} must be called with parentheses, e.g. ${name}(h)`, name);
      }
      return this.fail(
        token,
        (at) => `unknown name "${name}"${at}${CONSTANT_HINT.get(name) ?? ""}; declared names are ${this.scope.declared.join(", ")}`,
        name,
      );
    }
    this.locator.consume(name);
    return Object.freeze({ kind: "name", role: binding.role, slot: binding.slot });
  }

  private operator(node: ParsedNode, depth: number): CheckedNode {
    const op = node.op ?? "";
    const args = node.args ?? [];
    if (node.implicit === true && args.length === 2) {
      this.walk(args[0], depth + 1);
      const token = this.firstToken(args[1]);
      return this.fail(
        token,
        (at) => `missing "*" before "${token?.text ?? ""}"${at}; write every multiplication with "*", e.g. 2*h`,
        token?.text ?? "",
      );
    }
    const unary = UNARY.get(op);
    if (args.length === 1 && unary !== undefined && node.fn === unary.fn) {
      this.locator.consume(op);
      return Object.freeze({ kind: "unary", op: unary.op, arg: this.walk(args[0], depth + 1) });
    }
    const binary = BINARY.get(op);
    if (args.length === 2 && binary !== undefined && node.fn === binary.fn) {
      const left = this.walk(args[0], depth + 1);
      this.locator.consume(op);
      const right = this.walk(args[1], depth + 1);
      return Object.freeze({ kind: "binary", op: binary.op, left, right });
    }
    if (args.length === 2 || (args.length === 1 && POSTFIX.has(op))) this.walk(args[0], depth + 1);
    return this.fail(this.locator.next(op), (at) => `operator "${op}"${at} is not allowed; use + - * / ^ and the functions ${EXPRESSION_FUNCTION_NAMES.join(", ")}`, op);
  }

  private call(node: ParsedNode, depth: number): CheckedNode {
    const fn = node.fn;
    if (typeof fn !== "object" || fn.type !== "SymbolNode") {
      if (typeof fn === "object" && fn.type === "AccessorNode") return this.walk(fn, depth + 1);
      return this.fail(this.locator.next("("), (at) => `only the functions ${EXPRESSION_FUNCTION_NAMES.join(", ")} can be called${at}`, "(");
    }
    const name = fn.name ?? "";
    const token = this.locator.next(name);
    if (!isExpressionFunctionName(name)) {
      const binding = this.scope.bindings.get(name);
      if (binding !== undefined) {
        return this.fail(token, (at) => `"${name}"${at} is a ${binding.role}, not a function; write "${name}*(…)" to multiply`, name);
      }
      return this.fail(token, (at) => `unknown function "${name}"${at}; available functions are ${EXPRESSION_FUNCTION_NAMES.join(", ")}`, name);
    }
    const { minArgs, maxArgs } = EXPRESSION_FUNCTIONS[name];
    const args = node.args ?? [];
    if (args.length < minArgs || args.length > maxArgs) {
      const expected = minArgs === maxArgs
        ? `${minArgs} argument${minArgs === 1 ? "" : "s"}`
        : `${minArgs} to ${maxArgs} arguments`;
      return this.fail(token, (at) => `function "${name}"${at} takes ${expected}, not ${args.length}`, name);
    }
    this.locator.consume(name);
    this.locator.consume("(");
    const checked = args.map((arg, i) => {
      if (i > 0) this.locator.consume(",");
      return this.walk(arg, depth + 1);
    });
    this.locator.consume(")");
    return Object.freeze({ kind: "call", fn: name, args: Object.freeze(checked) });
  }

  /** The first token of a subtree in the text, found from the tokens not yet accounted for. */
  private firstToken(node: ParsedNode): LocatedToken | undefined {
    switch (node.type) {
      case "ConstantNode":
        return typeof node.value === "number" ? this.locator.nextNumber() : typeof node.value === "string" ? this.locator.nextString() : this.locator.next(String(node.value));
      case "SymbolNode":
        return this.locator.next(node.name ?? "");
      case "ParenthesisNode":
        return this.locator.next("(");
      case "OperatorNode": {
        const args = node.args ?? [];
        if (args.length === 1 && !POSTFIX.has(node.op ?? "")) return this.locator.next(node.op ?? "");
        return args.length > 0 ? this.firstToken(args[0]) : undefined;
      }
      case "FunctionNode":
        return typeof node.fn === "object" ? this.firstToken(node.fn) : undefined;
      case "AccessorNode":
        return node.object ? this.firstToken(node.object) : undefined;
      case "ArrayNode":
        return this.locator.next("[");
      default:
        return undefined;
    }
  }

  /**
   * Throws an ExpressionError at `token`. `describe` receives " at column N"
   * (or "" when the position is unknown) to place inside its sentence.
   */
  private fail(token: LocatedToken | undefined, describe: (at: string) => string, tokenText?: string): never {
    const at = token ? ` at column ${token.index + 1}` : "";
    throw new ExpressionError(describe(at), {
      expression: this.text,
      token: tokenText ?? token?.text ?? "",
      index: token?.index,
    });
  }
}

/** Turns a mathjs parse failure into an ExpressionError at the reported character. */
function syntaxError(text: string, locator: TokenLocator, error: unknown): ExpressionError {
  const char = typeof error === "object" && error !== null ? (error as { char?: unknown }).char : undefined;
  const raw = error instanceof Error ? error.message : String(error);
  if (!(error instanceof SyntaxError) || typeof char !== "number") {
    return new ExpressionError(`the expression could not be read (${raw})`, { expression: text, token: "" });
  }
  const index = Math.max(0, Math.min(text.length, char - 1));
  const token = locator.tokens.find((t) => t.index >= index && t.index < index + 1);
  const detail = raw.replace(/\s*\(char \d+\)\s*$/, "");
  const shown = token?.text ?? text.slice(index, index + 1);
  const reason = /^syntax error in part/i.test(detail) || /^unexpected part/i.test(detail)
    ? `unexpected "${shown}"`
    : detail.charAt(0).toLowerCase() + detail.slice(1);
  const where = index >= text.length ? "at the end" : `at column ${index + 1}`;
  return new ExpressionError(`syntax error ${where}: ${reason}`, {
    expression: text,
    token: shown,
    index,
  });
}
