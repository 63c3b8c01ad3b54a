import { describe, expect, it } from "vitest";
import { studentTQuantile } from "../../src/identification/student-t-quantile.js";
import { expectClose } from "../support/expect-close.js";

describe("studentTQuantile", () => {
  it("studentTQuantile(0.975, ν) matches the published table", () => {
    // M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, Table 26.10
    // (percentage points of the t distribution, Q = 0.025 one-sided), printed to 3 decimals.
    const table: [number, number][] = [[1, 12.706], [2, 4.303], [5, 2.571], [10, 2.228], [30, 2.042], [120, 1.98]];
    for (const [nu, t] of table) expectClose(studentTQuantile(0.975, nu), t, 5e-4);
  });

  it("studentTQuantile has the closed forms of ν = 1 and ν = 2", () => {
    // ν = 1 (Cauchy): t_p = tan(π(p − ½)); ν = 2: t_p = (2p − 1)·√(2/(4p(1 − p))) (A&S 1964, 26.7.3–26.7.4).
    for (const p of [0.6, 0.9, 0.975, 0.995]) {
      expectClose(studentTQuantile(p, 1), Math.tan(Math.PI * (p - 0.5)), 0, 1e-9);
      expectClose(studentTQuantile(p, 2), (2 * p - 1) * Math.sqrt(2 / (4 * p * (1 - p))), 0, 1e-9);
    }
  });

  it("studentTQuantile tends to the normal quantile 1.959964 as ν grows and is odd in p − ½", () => {
    // Normal 97.5 % point 1.959963985 (A&S 1964, Table 26.1).
    expectClose(studentTQuantile(0.975, 1e7), 1.959963985, 1e-6);
    expect(studentTQuantile(0.025, 7)).toBe(-studentTQuantile(0.975, 7));
    expect(() => studentTQuantile(1, 3)).toThrow(RangeError);
  });
});
