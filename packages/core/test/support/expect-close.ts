import { expect } from "vitest";

/** Asserts |actual − expected| ≤ atol + rtol·|expected| (the scipy/numpy `allclose` rule). */
export function expectClose(actual: number, expected: number, atol: number, rtol = 0): void {
  const bound = atol + rtol * Math.abs(expected);
  const error = Math.abs(actual - expected);
  if (!(error <= bound)) {
    expect.fail(`expected ${actual} to be within ${bound.toExponential(2)} of ${expected} (error ${error.toExponential(2)})`);
  }
}
