import { describe, expect, it } from "vitest";
import { expm } from "../../src/linear-algebra/expm.js";
import { expectClose } from "../support/expect-close.js";

function expectMatrixClose(actual: Float64Array, expected: number[], atol: number, rtol: number): void {
  expect(actual.length).toBe(expected.length);
  expected.forEach((v, i) => expectClose(actual[i], v, atol, rtol));
}

describe("expm", () => {
  it("expm of a diagonal matrix exponentiates the diagonal", () => {
    // Closed form: e^diag(d) = diag(e^d). Norms span the Padé degrees 3 … 13 and the squaring branch.
    for (const d of [[1e-3, -2e-3], [0.2, -0.1], [1, -2, 0.5], [-50, 3]]) {
      const n = d.length;
      const a = new Float64Array(n * n);
      d.forEach((v, i) => (a[i * n + i] = v));
      const expected = new Array(n * n).fill(0);
      d.forEach((v, i) => (expected[i * n + i] = Math.exp(v)));
      expectMatrixClose(expm(a, n), expected, 1e-300, 1e-13);
    }
  });

  it("expm of a rotation generator is a rotation", () => {
    // Closed form: exp([[0, −θ], [θ, 0]]) = [[cos θ, −sin θ], [sin θ, cos θ]].
    for (const theta of [0.01, 0.5, 2, 10, 100]) {
      const r = expm(Float64Array.from([0, -theta, theta, 0]), 2);
      const c = Math.cos(theta);
      const s = Math.sin(theta);
      expectMatrixClose(r, [c, -s, s, c], 1e-13 * Math.max(1, theta), 0);
    }
  });

  it("expm of a nilpotent matrix is its finite series", () => {
    // Closed form: N³ = 0 ⇒ e^N = I + N + N²/2; N = [[0, a, b], [0, 0, c], [0, 0, 0]].
    const [a, b, c] = [3, -2, 7];
    const r = expm(Float64Array.from([0, a, b, 0, 0, c, 0, 0, 0]), 3);
    expectMatrixClose(r, [1, a, b + (a * c) / 2, 0, 1, c, 0, 0, 1], 1e-13, 1e-13);
  });

  it("expm of an upper-triangular 2×2 matches its closed form", () => {
    // Closed form: exp([[a, b], [0, c]]) = [[e^a, b(e^a − e^c)/(a − c)], [0, e^c]] (a ≠ c);
    // Moler & Van Loan 2003, §2.
    const [a, b, c] = [-1.5, 4, -0.25];
    const r = expm(Float64Array.from([a, b, 0, c]), 2);
    expectMatrixClose(r, [Math.exp(a), (b * (Math.exp(a) - Math.exp(c))) / (a - c), 0, Math.exp(c)], 1e-14, 1e-13);
  });

  it("expm rejects a non-square shape and non-finite entries", () => {
    expect(() => expm(new Float64Array(3), 2)).toThrow(RangeError);
    expect(() => expm(Float64Array.from([NaN]), 1)).toThrow(/finite/);
    expect(expm(new Float64Array(0), 0)).toHaveLength(0);
  });
});
