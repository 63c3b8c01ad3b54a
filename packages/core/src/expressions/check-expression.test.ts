import { describe, expect, it } from "vitest";
import { checkExpression, EXPRESSION_LIMITS } from "./check-expression.js";
import { ExpressionError } from "./expression-error.js";
import { createNameScope } from "./name-scope.js";

// Expected behaviour is Loopyard's whitelist (check-expression.ts). Parse
// structure (precedence, what counts as an assignment or an accessor) is
// that of mathjs 15 `parse`, documented at mathjs.org/docs/expressions/syntax.html.

const scope = createNameScope({ states: ["h", "x"], parameters: ["a", "b", "A"] });

function refusal(text: string): ExpressionError {
  try {
    checkExpression(text, scope);
  } catch (error) {
    expect(error).toBeInstanceOf(ExpressionError);
    return error as ExpressionError;
  }
  throw new Error(`expected ${JSON.stringify(text)} to be refused`);
}

describe("checkExpression accepts the whitelist", () => {
  it("checkExpression builds a tree of names, numbers, operators and calls", () => {
    const checked = checkExpression("(-a*sqrt(h) + b*u)/A", scope);
    expect(checked.root).toEqual({
      kind: "binary",
      op: "/",
      left: {
        kind: "binary",
        op: "+",
        left: {
          kind: "binary",
          op: "*",
          left: { kind: "unary", op: "-", arg: { kind: "name", role: "parameter", slot: 0 } },
          right: { kind: "call", fn: "sqrt", args: [{ kind: "name", role: "state", slot: 0 }] },
        },
        right: {
          kind: "binary",
          op: "*",
          left: { kind: "name", role: "parameter", slot: 1 },
          right: { kind: "name", role: "input", slot: 0 },
        },
      },
      right: { kind: "name", role: "parameter", slot: 2 },
    });
  });

  it("checkExpression makes ^ right-associative and bind tighter than unary minus (mathjs precedence)", () => {
    expect(checkExpression("2^3^2", scope).root).toEqual({
      kind: "binary",
      op: "^",
      left: { kind: "number", value: 2 },
      right: { kind: "binary", op: "^", left: { kind: "number", value: 3 }, right: { kind: "number", value: 2 } },
    });
    expect(checkExpression("-2^2", scope).root).toEqual({
      kind: "unary",
      op: "-",
      arg: { kind: "binary", op: "^", left: { kind: "number", value: 2 }, right: { kind: "number", value: 2 } },
    });
  });

  it.each(["+h", "h^-2", "1e-3*h", ".5*h", "0x10*h", "min(h, x, a)", "max(h, 0)", "pow(h, 2)", "sign(x)*abs(x)", "tanh(h) + tan(h) + sin(h) + cos(h) + exp(h) + log(h)", "h # a comment"])(
    "checkExpression accepts %j",
    (text) => {
      expect(() => checkExpression(text, scope)).not.toThrow();
    },
  );

  it("checkExpression accepts the time name only when it is declared", () => {
    expect(refusal("t*h").message).toContain('unknown name "t" at column 1');
    const timed = createNameScope({ states: ["h"], parameters: [], time: "t" });
    expect(checkExpression("t*h", timed).root).toMatchObject({ left: { kind: "name", role: "time" } });
  });
});

describe("checkExpression refuses everything else, naming the token", () => {
  it.each<[string, string, string, number | undefined]>([
    // [text, message fragment, token, index]
    ["constructor", 'unknown name "constructor" at column 1', "constructor", 0],
    ["__proto__", 'unknown name "__proto__" at column 1', "__proto__", 0],
    ["h + constructor", 'unknown name "constructor" at column 5', "constructor", 4],
    ["x.constructor", 'property access ".constructor" is not allowed at column 2', ".constructor", 1],
    ["h.__proto__", 'property access ".__proto__" is not allowed at column 2', ".__proto__", 1],
    ['a["b"]', 'property access "[" is not allowed at column 2', "[", 1],
    ["h.x.y", 'property access ".x" is not allowed at column 2', ".x", 1],
    ["f(x) = x", 'function definition "f(x) =" at column 6 is not allowed', "=", 5],
    ["a = 1", 'assignment "=" at column 3 is not allowed', "=", 2],
    ["[1,2]", 'matrix "[" at column 1 is not allowed', "[", 0],
    ['"s"', 'text "s" at column 1 is not allowed', '"s"', 0],
    ["h + 's'", 'text "s" at column 5 is not allowed', "'s'", 4],
    ["a ? b : A", 'conditional "?" at column 3 is not allowed', "?", 2],
    ["a < b < A", 'comparison "<" at column 3 is not allowed', "<", 2],
    ["a < b", 'operator "<" at column 3 is not allowed', "<", 2],
    ["1:3", 'range ":" at column 2 is not allowed', ":", 1],
    ["{a: 1}", 'object "{" at column 1 is not allowed', "{", 0],
    ["h % 2", 'operator "%" at column 3 is not allowed', "%", 2],
    ["h mod 2", 'operator "mod" at column 3 is not allowed', "mod", 2],
    ["h!", 'operator "!" at column 2 is not allowed', "!", 1],
    ["h'", "operator \"'\" at column 2 is not allowed", "'", 1],
    ["h .* x", 'operator ".*" at column 3 is not allowed', ".*", 2],
    ["(-a*sqrt(h) + k*u)/A", 'unknown name "k" at column 15; declared names are h, x, a, b, A, u', "k", 14],
    ["pi*h", 'unknown name "pi" at column 1 (write the number', "pi", 0],
    ["foo(h)", 'unknown function "foo" at column 1; available functions are sqrt, exp, log', "foo", 0],
    ["h + eval(h)", 'unknown function "eval" at column 5', "eval", 4],
    ["a(h)", '"a" at column 1 is a parameter, not a function', "a", 0],
    ["sqrt", 'function "sqrt" at column 1 must be called with parentheses', "sqrt", 0],
    ["sqrt(h, a)", 'function "sqrt" at column 1 takes 1 argument, not 2', "sqrt", 0],
    ["h + pow(h)", 'function "pow" at column 5 takes 2 arguments, not 1', "pow", 4],
    ["min(h)", 'function "min" at column 1 takes 2 to 32 arguments, not 1', "min", 0],
    ["2h", 'missing "*" before "h" at column 2', "h", 1],
    ["a + 2 x", 'missing "*" before "x" at column 7', "x", 6],
    ["(a)(b)", 'missing "*" before "(" at column 4', "(", 3],
    ["1/2h", 'missing "*" before "h" at column 4', "h", 3],
    ["1e999*h", 'number "1e999" at column 1 is too large', "1e999", 0],
    ["true", '"true" at column 1 is not a number', "true", 0],
    ["h; a", "only one expression is allowed; remove the separator at column 2", ";", 1],
    ["h\na", "only one expression is allowed; remove the separator at column 2", "line break", 1],
    ["a @ b", 'syntax error at column 3: unexpected "@"', "@", 2],
    ["a +", "syntax error at the end: unexpected end of expression", "", 3],
    ["", "the expression is empty", "", undefined],
  ])("checkExpression(%j) is refused: %s", (text, fragment, token, index) => {
    const error = refusal(text);
    expect(error.message).toContain(fragment);
    expect(error.token).toBe(token);
    expect(error.index).toBe(index);
    expect(error.expression).toBe(text);
  });

  it("checkExpression refuses text longer than the limit before parsing it", () => {
    const text = "h+".repeat(1000) + "h"; // 2001 characters
    const error = refusal(text);
    expect(error.message).toBe(`the expression is 2001 characters long; the limit is ${EXPRESSION_LIMITS.maxLength}`);
    expect(error.index).toBe(2000);
  });

  it("checkExpression refuses brackets nested deeper than the limit before parsing (mathjs would overflow the stack)", () => {
    const text = "(".repeat(40) + "h" + ")".repeat(40);
    const error = refusal(text);
    expect(error.message).toBe('brackets are nested more than 32 deep at "(" at column 33');
    expect(error.index).toBe(32);
    expect(() => checkExpression("(".repeat(32) + "h" + ")".repeat(32), scope)).not.toThrow();
  });

  it("checkExpression refuses more parse-tree nodes than the limit", () => {
    const text = Array.from({ length: 501 }, () => "h").join("+"); // 1001 nodes, 1001 characters
    expect(refusal(text).message).toContain("more than 1000 parts");
  });

  it("checkExpression refuses a tree deeper than the limit", () => {
    const text = "-".repeat(600) + "h"; // 601 nested nodes; the 513th "-" (index 512) is one level too deep
    const error = refusal(text);
    expect(error.message).toBe("the expression is nested more than 512 levels deep at column 513");
    expect(error.index).toBe(512);
  });

  it("checkExpression reports the first refused construct in reading order", () => {
    expect(refusal("k + h % 2").token).toBe("k");
    expect(refusal("h % k").token).toBe("%");
  });

  it("checkExpression points at the right occurrence of a repeated name", () => {
    const error = refusal("sqrt(h) + sqrt(h, h)");
    expect(error.index).toBe(10);
  });
});
