import { Matrix, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import type { SisoStateSpace } from "../../src/linear-algebra/siso-state-space.js";
import { polynomialEvaluate } from "../../src/linear-algebra/polynomial-evaluate.js";
import { transferFunctionToStateSpace } from "../../src/plants/transfer-function-to-state-space.js";
import { expectClose } from "../support/expect-close.js";

/** C (sI − A)⁻¹ B + D at a real s, with an independent dense solve (ml-matrix LU). */
function evaluateStateSpace(ss: SisoStateSpace, s: number): number {
  if (ss.n === 0) return ss.d;
  const m = new Matrix(ss.n, ss.n);
  for (let i = 0; i < ss.n; i++) for (let j = 0; j < ss.n; j++) m.set(i, j, (i === j ? s : 0) - ss.a[i * ss.n + j]);
  const x = solve(m, Matrix.columnVector(Array.from(ss.b)));
  let y = ss.d;
  for (let i = 0; i < ss.n; i++) y += ss.c[i] * x.get(i, 0);
  return y;
}

describe("transferFunctionToStateSpace", () => {
  const cases: { num: number[]; den: number[] }[] = [
    { num: [1], den: [1, 1] },
    { num: [1, 3], den: [2, 3, 1] },
    { num: [2, 0, 1], den: [1, 1, 1] },
    { num: [1.2], den: [18, 45.5, 15.5, 1] },
    { num: [0, 0, 4], den: [0, 1, 2] },
  ];
  for (const tf of cases) {
    it(`transferFunctionToStateSpace(${JSON.stringify(tf)}) reproduces num/den at real points`, () => {
      // Definition: C(sI − A)⁻¹B + D = num(s)/den(s) for every s that is not a pole.
      const ss = transferFunctionToStateSpace(tf);
      for (const s of [0.3, 1.7, 5, -0.45]) {
        const expected = polynomialEvaluate(tf.num, s) / polynomialEvaluate(tf.den, s);
        expectClose(evaluateStateSpace(ss, s), expected, 1e-12, 1e-12);
      }
    });
  }

  it("transferFunctionToStateSpace puts D = b₀/a₀ when the degrees are equal", () => {
    // (2s² + 1)/(s² + s + 1) → D = lim_{s→∞} = 2 (controllable canonical form, Franklin et al. 2002 §7.4).
    expect(transferFunctionToStateSpace({ num: [2, 0, 1], den: [1, 1, 1] }).d).toBe(2);
    expect(transferFunctionToStateSpace({ num: [1], den: [1, 1] }).d).toBe(0);
  });

  it("transferFunctionToStateSpace gives a static gain for a constant denominator", () => {
    const ss = transferFunctionToStateSpace({ num: [3], den: [2] });
    expect(ss.n).toBe(0);
    expect(ss.d).toBe(1.5);
  });

  it("transferFunctionToStateSpace rejects an improper function naming num", () => {
    expect(() => transferFunctionToStateSpace({ num: [1, 0, 0], den: [1, 1] })).toThrow(/num/);
    expect(() => transferFunctionToStateSpace({ num: [1], den: [0, 0] })).toThrow(/den/);
  });
});
