import { describe, expect, it } from "vitest";
import { polynomialAdd } from "../../src/linear-algebra/polynomial-add.js";
import { polynomialEvaluate } from "../../src/linear-algebra/polynomial-evaluate.js";
import { polynomialMultiply } from "../../src/linear-algebra/polynomial-multiply.js";

describe("polynomial arithmetic", () => {
  it("polynomialMultiply expands (s + 1)(s + 2) to s² + 3s + 2", () => {
    // Closed form by hand expansion.
    expect(polynomialMultiply([1, 1], [1, 2])).toEqual([1, 3, 2]);
    expect(polynomialMultiply([2], [1, 0, -1])).toEqual([2, 0, -2]);
    expect(polynomialMultiply([], [1, 2])).toEqual([]);
  });

  it("polynomialAdd aligns at the constant term", () => {
    // (s² + 0s + 0) + (2s + 3) = s² + 2s + 3.
    expect(polynomialAdd([1, 0, 0], [2, 3])).toEqual([1, 2, 3]);
    expect(polynomialAdd([4], [1, -4])).toEqual([1, 0]);
  });

  it("polynomialEvaluate follows Horner's scheme", () => {
    // 2s³ − 3s + 1 at s = 2: 16 − 6 + 1 = 11.
    expect(polynomialEvaluate([2, 0, -3, 1], 2)).toBe(11);
    expect(polynomialEvaluate([], 3)).toBe(0);
  });
});
