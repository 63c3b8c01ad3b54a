import { evaluate } from "mathjs";
import { describe, expect, it } from "vitest";
import { compileExpression } from "./compile-expression.js";
import { ExpressionError } from "./expression-error.js";
import { DeclaredNameError } from "./declared-name-error.js";

// Reference values: hand computation (closed form, stated before each
// check) and, on random inputs, the independent evaluator of mathjs 15.2.0
// (`evaluate`, J. de Jong et al., mathjs.org), which shares only the parser
// with the compiler: the numbers come from mathjs's own interpreter.

const TANK = { states: ["h"], parameters: ["a", "b", "A"] } as const;
const x1 = (v: number) => Float64Array.of(v);
const none = new Float64Array(0);

function closeTo(actual: number, expected: number, rtol = 1e-12, atol = 1e-14): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(atol + rtol * Math.abs(expected));
}

describe("compileExpression computes the typed formula", () => {
  it("compileExpression('(-a*sqrt(h) + b*u)/A') matches the hand value", () => {
    const f = compileExpression("(-a*sqrt(h) + b*u)/A", TANK);
    // h = 4, a = 0.5, b = 2, A = 10, u = 1: (−0.5·2 + 2·1)/10 = 0.1
    closeTo(f(x1(4), Float64Array.of(0.5, 2, 10), 1, 0), 0.1);
    // h = 2.25, a = 1.2, b = 0.3, A = 4, u = 5: (−1.2·1.5 + 1.5)/4 = −0.075
    closeTo(f(x1(2.25), Float64Array.of(1.2, 0.3, 4), 5, 0), -0.075);
  });

  it("compileExpression follows mathjs precedence: ^ right-associative, 2^3^2 = 2^9 = 512", () => {
    expect(compileExpression("2^3^2", { states: [], parameters: [] })(none, none, 0, 0)).toBe(512);
    expect(compileExpression("(2^3)^2", { states: [], parameters: [] })(none, none, 0, 0)).toBe(64);
  });

  it("compileExpression reads -2^2 as -(2^2) = -4, as mathjs does (unary minus binds looser than ^)", () => {
    expect(compileExpression("-2^2", { states: [], parameters: [] })(none, none, 0, 0)).toBe(-4);
    expect(compileExpression("(-2)^2", { states: [], parameters: [] })(none, none, 0, 0)).toBe(4);
    // 2^-2 = 1/4 (mathjs allows a unary minus in the exponent)
    expect(compileExpression("2^-2", { states: [], parameters: [] })(none, none, 0, 0)).toBe(0.25);
  });

  it("compileExpression gives * and / precedence over + and -, left to right", () => {
    const f = compileExpression("1 + 2*3 - 8/4/2 - 1 - 1", { states: [], parameters: [] });
    // 1 + 6 − ((8/4)/2) − 1 − 1 = 1 + 6 − 1 − 1 − 1 = 4
    expect(f(none, none, 0, 0)).toBe(4);
  });

  it("compileExpression evaluates every whitelisted function like Math.*", () => {
    const names = { states: ["x", "y"], parameters: [] };
    const x = Float64Array.of(0.7, -1.9);
    const cases: Array<[string, number]> = [
      ["sqrt(x)", Math.sqrt(0.7)],
      ["exp(y)", Math.exp(-1.9)],
      ["log(x)", Math.log(0.7)],
      ["sin(x) + cos(y)", Math.sin(0.7) + Math.cos(-1.9)],
      ["tan(x)*tanh(y)", Math.tan(0.7) * Math.tanh(-1.9)],
      ["abs(y) + sign(y)", 1.9 - 1],
      ["pow(x, y)", Math.pow(0.7, -1.9)],
      ["x^y", Math.pow(0.7, -1.9)],
      ["min(x, y, 0)", -1.9],
      ["max(x, y, 0)", 0.7],
    ];
    for (const [text, expected] of cases) {
      expect(compileExpression(text, names)(x, none, 0, 0), text).toBe(expected);
    }
  });

  it("compileExpression reads the input, a renamed input and the declared time", () => {
    expect(compileExpression("2*u", { states: [], parameters: [] })(none, none, 3, 0)).toBe(6);
    expect(compileExpression("q - 1", { states: [], parameters: [], input: "q" })(none, none, 3, 0)).toBe(2);
    // sin(ω·t) with ω = 2, t = 0.25: sin(0.5)
    const f = compileExpression("sin(w*t)", { states: [], parameters: ["w"], time: "t" });
    expect(f(none, Float64Array.of(2), 0, 0.25)).toBe(Math.sin(0.5));
  });

  it("compileExpression keeps every decimal digit of a typed constant", () => {
    const f = compileExpression("0.1 + 1.2345678901234567e-300*0 + 6.02214076e23", { states: [], parameters: [] });
    expect(f(none, none, 0, 0)).toBe(0.1 + 6.02214076e23);
    expect(compileExpression("0.30000000000000004", { states: [], parameters: [] })(none, none, 0, 0)).toBe(0.1 + 0.2);
  });

  it("compileExpression('sqrt(h)') returns NaN for h < 0 (real arithmetic; the simulator reports non-finite states as divergence)", () => {
    const f = compileExpression("sqrt(h)", TANK);
    expect(Number.isNaN(f(x1(-1), Float64Array.of(0, 0, 1), 0, 0))).toBe(true);
    // mathjs itself would move to the complex plane: sqrt(-1) = i
    expect(typeof evaluate("sqrt(h)", { h: -1 })).toBe("object");
    // (−8)^(1/3) is NaN too (Math.pow of a negative base and non-integer exponent)
    expect(Number.isNaN(compileExpression("(-8)^(1/3)", { states: [], parameters: [] })(none, none, 0, 0))).toBe(true);
  });

  it("compileExpression produces a function whose body holds no user text, only slots, numbers and f_ functions", () => {
    const f = compileExpression("(-alpha*sqrt(level) + gain*u)/area", {
      states: ["level"],
      parameters: ["alpha", "gain", "area"],
    });
    const source = f.toString();
    expect(source).toContain("return ((((-p[0]) * f_sqrt(x[0])) + (p[1] * u)) / p[2]);");
    for (const name of ["alpha", "level", "gain", "area"]) expect(source).not.toContain(name);
  });

  it("compileExpression throws ExpressionError and DeclaredNameError for refused input", () => {
    expect(() => compileExpression("constructor", TANK)).toThrow(ExpressionError);
    expect(() => compileExpression("__proto__", TANK)).toThrow(/unknown name "__proto__" at column 1/);
    expect(() => compileExpression("h", { states: ["constructor"], parameters: [] })).toThrow(DeclaredNameError);
  });
});

describe("compileExpression agrees with mathjs evaluate on random expressions", () => {
  // Random trees over the declared names, printed with explicit parentheses
  // where needed and random extra ones. Domains are kept real (sqrt and log
  // of positive arguments, ^ of a positive base or an integer exponent), so
  // mathjs stays on real numbers; other paths are covered above.
  const names = { states: ["h", "v"], parameters: ["a", "b", "c"], time: "t" } as const;

  it("compileExpression(text)(x, p, u, t) equals mathjs evaluate(text, scope) within 1e-12 relative on 400 expressions × 5 inputs", () => {
    const random = mulberry32(20260211);
    let compared = 0;
    for (let n = 0; n < 400; n += 1) {
      const text = randomExpression(random, 4);
      const f = compileExpression(text, names);
      for (let k = 0; k < 5; k += 1) {
        const scope = {
          h: uniform(random, -3, 3), v: uniform(random, -3, 3),
          a: uniform(random, -2, 2), b: uniform(random, 0.1, 2), c: uniform(random, -5, 5),
          u: uniform(random, -1, 1), t: uniform(random, 0, 10),
        };
        const expected: unknown = evaluate(text, { ...scope });
        expect(typeof expected, text).toBe("number");
        const actual = f(Float64Array.of(scope.h, scope.v), Float64Array.of(scope.a, scope.b, scope.c), scope.u, scope.t);
        if (!Number.isFinite(expected as number)) {
          expect(actual, text).toBe(expected);
        } else {
          closeTo(actual, expected as number, 1e-12, 1e-12);
        }
        compared += 1;
      }
    }
    expect(compared).toBe(2000);
  });
});

const LEAVES = ["h", "v", "a", "b", "c", "u", "t", "2", "0.5", "3.25", "1e-3", "7"];

function randomExpression(random: () => number, depth: number): string {
  if (depth === 0 || random() < 0.2) return pick(random, LEAVES);
  const sub = () => randomExpression(random, depth - 1);
  const wrap = (s: string) => (random() < 0.2 ? `(${s})` : s);
  switch (Math.floor(random() * 12)) {
    case 0: return wrap(`${sub()} + ${sub()}`);
    case 1: return `(${sub()} - ${sub()})`;
    case 2: return `(${sub()}) * ${wrap(sub())}`;
    case 3: return `(${sub()}) / (${sub()})`;
    case 4: return `-(${sub()})`;
    case 5: return `(abs(${sub()}) + 0.5)^(${sub()})`;
    case 6: return `(${sub()})^${pick(random, ["2", "3", "-1", "0"])}`;
    case 7: return `sqrt(abs(${sub()}))`;
    case 8: return `log(abs(${sub()}) + 1)`;
    case 9: return `${pick(random, ["sin", "cos", "tanh", "sign", "abs"])}(${sub()})`;
    case 10: return `${pick(random, ["min", "max"])}(${sub()}, ${sub()})`;
    default: return `exp(-abs(${sub()}))*${pick(random, LEAVES)} - ${pick(random, LEAVES)}^2`;
  }
}

function pick<T>(random: () => number, items: readonly T[]): T {
  return items[Math.floor(random() * items.length)];
}

function uniform(random: () => number, low: number, high: number): number {
  return low + (high - low) * random();
}

/** Seeded PRNG (T. Ettinger, "Mulberry32", 2017; common practice for reproducible tests). */
function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}
