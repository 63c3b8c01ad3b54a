import { describe, expect, it } from "vitest";
import { polynomialMultiply } from "../../src/linear-algebra/polynomial-multiply.js";
import { isSchurStable } from "../../src/stability/schur-cohn.js";
import { seededRandom } from "../support/seeded-random.js";

/** The monic polynomial with the given real roots and complex pairs r·e^(±jφ), descending powers. */
function fromRoots(real: number[], pairs: [number, number][]): number[] {
  let p = [1];
  for (const z of real) p = polynomialMultiply(p, [1, -z]);
  for (const [r, phi] of pairs) p = polynomialMultiply(p, [1, -2 * r * Math.cos(phi), r * r]);
  return p;
}

describe("isSchurStable (Schur–Cohn / Jury)", () => {
  it("judges polynomials built from known roots: stable iff every |z| < 1 (definition)", () => {
    expect(isSchurStable(fromRoots([0.5, -0.9], [[0.95, 2]]))).toBe(true);
    expect(isSchurStable(fromRoots([0.5, -1.01], [[0.95, 2]]))).toBe(false);
    expect(isSchurStable(fromRoots([0.5, -0.9], [[1.02, 0.3]]))).toBe(false);
    expect(isSchurStable(fromRoots([1], []))).toBe(false); // a root on the circle is not stable
    expect(isSchurStable([3])).toBe(true); // degree 0: no roots
  });

  it("Jury's second-order conditions: z² + a₁z + a₀ is stable iff |a₀| < 1 and |a₁| < 1 + a₀ (Åström & Wittenmark 1997, §3.2)", () => {
    const random = seededRandom(9);
    for (let i = 0; i < 2000; i++) {
      const a1 = 4 * random() - 2;
      const a0 = 2.4 * random() - 1.2;
      const jury = Math.abs(a0) < 1 && Math.abs(a1) < 1 + a0;
      expect(isSchurStable([1, a1, a0])).toBe(jury);
    }
  });

  it("agrees with the root moduli of random polynomials of degree 2–12 (roots drawn, not solved for)", () => {
    const random = seededRandom(11);
    for (let trial = 0; trial < 300; trial++) {
      const real = Array.from({ length: Math.floor(random() * 5) }, () => 2.2 * random() - 1.1);
      const pairs = Array.from({ length: 1 + Math.floor(random() * 4) }, (): [number, number] => [1.15 * random(), Math.PI * random()]);
      const moduli = [...real.map(Math.abs), ...pairs.map(([r]) => r)];
      if (moduli.some((r) => Math.abs(r - 1) < 1e-3)) continue; // keep clear of the circle
      expect(isSchurStable(fromRoots(real, pairs))).toBe(moduli.every((r) => r < 1));
    }
  });
});
