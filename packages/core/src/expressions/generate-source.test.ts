import { describe, expect, it } from "vitest";
import { assertGeneratedSource, formatNumber, generateExpressionSource } from "./generate-source.js";
import { checkExpression } from "./check-expression.js";
import { createNameScope } from "./name-scope.js";
import type { ExpressionFunctionName } from "./expression-functions.js";

// References: ECMA-262 2023 §6.1.6.1.20 Number::toString (shortest
// round-tripping decimal) for formatNumber; the output grammar is Loopyard's own.

describe("formatNumber", () => {
  it("formatNumber prints literals that read back to the same double", () => {
    const samples = [0, 1, 0.1, 1 / 3, 2 / 3, 1e-7, 1.5e21, 5e-324, Number.MAX_VALUE, Number.EPSILON, 123456789.125, 6.02214076e23];
    let state = 12345;
    for (let i = 0; i < 2000; i += 1) {
      state = (Math.imul(state, 1103515245) + 12345) >>> 0; // glibc LCG constants (common practice)
      const mantissa = state / 4294967296;
      samples.push(mantissa * 10 ** ((i % 600) - 300));
    }
    for (const value of samples) {
      const text = formatNumber(value);
      expect(Number(text), text).toBe(value);
      expect(text).toMatch(/^\d+(?:\.\d+)?(?:e[+-]\d+)?$/);
    }
  });

  it("formatNumber parenthesises negative values and -0", () => {
    expect(formatNumber(-2.5)).toBe("(-2.5)");
    expect(formatNumber(-0)).toBe("(-0)");
  });

  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])("formatNumber(%s) throws a RangeError", (value) => {
    expect(() => formatNumber(value)).toThrow(RangeError);
  });
});

describe("generateExpressionSource", () => {
  const scope = createNameScope({ states: ["h", "v"], parameters: ["k"], time: "t" });

  it("generateExpressionSource maps names to slots, ^ to f_pow, and parenthesises every composite", () => {
    const used = new Set<ExpressionFunctionName>();
    const source = generateExpressionSource(checkExpression("-k*v^2 + max(h, 0) - t/u", scope).root, used);
    // mathjs: unary minus binds tighter than * and looser than ^; + and - associate to the left.
    expect(source).toBe("((((-p[0]) * f_pow(x[1], 2)) + f_max(x[0], 0)) - (t / u))");
    expect([...used].sort()).toEqual(["max", "pow"]);
  });

  it("assertGeneratedSource accepts the output grammar and refuses anything else", () => {
    expect(() => assertGeneratedSource("(f_sqrt(x[0]) + (p[12] * 1.5e-7)) - (-u) / t")).not.toThrow();
    for (const foreign of ["this", "x.constructor", "f_eval(1)", "x[0]()", "(u)(t)", "2 (u)", "`a`", "'s'", "p[0] = 1", "u;t", "x[a]", "1..toString"]) {
      expect(() => assertGeneratedSource(foreign), foreign).toThrow(/outside the whitelist/);
    }
  });
});
