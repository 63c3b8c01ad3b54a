/**
 * Property-based fuzzing of the expression compiler (fast-check): whatever text arrives — arbitrary
 * Unicode, JavaScript injection attempts, tokens of the grammar in any order — compileExpression
 * either refuses it with its own error (ExpressionError, DeclaredNameError) or returns a function
 * that yields a number; no text runs code of its own (a sentinel on globalThis stays unset), and
 * every call stays within a time budget. Common practice (property-based testing after Claessen &
 * Hughes, "QuickCheck", ICFP 2000); the budget is ours.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { compileExpression, isDeclaredNameError, isExpressionError } from "../../src/index.js";

const NAMES = { states: ["T", "h"], parameters: ["k", "tau"], time: "t" };
/** Longest a compile plus one evaluation may take [ms] (a slow machine; typical calls take microseconds). */
const BUDGET_MS = 2_000;
const SENTINEL = "__loopyardFuzzRan";

/** Pieces a hostile or careless user might type, glued together at random. */
const TOKENS = [
  "T", "h", "k", "tau", "t", "u", "x", "p", "1", "0", "1e308", "-1e-308", "NaN", "Infinity", "pi", "e",
  "+", "-", "*", "/", "^", "(", ")", ",", ".", "[", "]", "{", "}", ";", "=", "=>", "!", "?", ":", "'", '"', "`",
  "sin", "cos", "exp", "log", "sqrt", "abs", "min", "max", "tanh", "pow",
  "constructor", "__proto__", "prototype", "globalThis", "process", "require", "import", "eval", "Function", "this",
  `globalThis.${SENTINEL}=1`, `(()=>{globalThis.${SENTINEL}=1})()`, "${1}", "\\u0041", "\u0000", "\ud800", "\u202e",
];

const tokenText = fc.array(fc.constantFrom(...TOKENS), { minLength: 1, maxLength: 40 }).map((parts) => parts.join(" "));
const anyText = fc.oneof(fc.string({ unit: "binary", maxLength: 200 }), fc.string({ unit: "grapheme", maxLength: 200 }), tokenText);

function expectOwnRefusalOrNumber(text: string): void {
  const started = performance.now();
  let compiled: ((x: Float64Array, p: Float64Array, u: number, t: number) => number) | null = null;
  try {
    compiled = compileExpression(text, NAMES);
  } catch (error) {
    expect(isExpressionError(error) || isDeclaredNameError(error), `${text} threw ${String(error)}`).toBe(true);
  }
  if (compiled) expect(typeof compiled(Float64Array.of(1, 2), Float64Array.of(0.5, 3), 0.25, 1)).toBe("number");
  expect(performance.now() - started).toBeLessThan(BUDGET_MS);
  expect((globalThis as Record<string, unknown>)[SENTINEL]).toBeUndefined();
}

describe("compileExpression under fuzzing", () => {
  it("compileExpression(text) refuses with its own error or yields a number, never runs injected code (2,000 texts)", () => {
    fc.assert(fc.property(anyText, expectOwnRefusalOrNumber), { numRuns: 2_000, seed: 11 });
  });

  it("compileExpression(text) handles deep nesting and long sums within the budget", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5_000 }), fc.constantFrom("(", "-", "sin("), (depth, opener) => {
        const closer = opener === "-" ? "" : ")";
        expectOwnRefusalOrNumber(`${opener.repeat(depth)}T${closer.repeat(depth)}`);
        expectOwnRefusalOrNumber(Array.from({ length: depth }, () => "T").join("+"));
      }),
      { numRuns: 60, seed: 12 },
    );
  });
});
