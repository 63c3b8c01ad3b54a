import { describe, expect, it } from "vitest";
import type { ParameterSpace } from "../../src/batch/parameter-space.js";
import { seededRandomDesign } from "../../src/batch/random-design.js";
import { SOBOL_MAX_DIMENSION, sobolDesign, sobolDirections, sobolUnit } from "../../src/batch/sobol-design.js";
import { JOE_KUO_DIRECTION_ROWS } from "../../src/batch/sobol-direction-numbers.js";

/**
 * Centred L2 discrepancy, closed form of F. J. Hickernell, "A generalized discrepancy and
 * quadrature error bound", Math. Comp. 67(221), 299–322, 1998, eq. (5.1c):
 *
 *   CD² = (13/12)^d − (2/n) Σ_i Π_j (1 + ½|z_ij| − ½ z_ij²)
 *         + (1/n²) Σ_i Σ_k Π_j (1 + ½|z_ij| + ½|z_kj| − ½|x_ij − x_kj|),   z = x − ½.
 */
function centredL2Discrepancy(x: Float64Array, n: number, d: number): number {
  let s1 = 0;
  for (let i = 0; i < n; i++) {
    let p = 1;
    for (let j = 0; j < d; j++) {
      const z = Math.abs(x[i * d + j] - 0.5);
      p *= 1 + 0.5 * z - 0.5 * z * z;
    }
    s1 += p;
  }
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      let p = 1;
      for (let j = 0; j < d; j++) {
        const a = x[i * d + j];
        const b = x[k * d + j];
        p *= 1 + 0.5 * Math.abs(a - 0.5) + 0.5 * Math.abs(b - 0.5) - 0.5 * Math.abs(a - b);
      }
      s2 += p;
    }
  }
  return Math.sqrt((13 / 12) ** d - (2 / n) * s1 + s2 / (n * n));
}

/** Is x^s + a_1 x^(s−1) + … + 1 primitive over GF(2)? Its root x must have order exactly 2^s − 1. */
function isPrimitive(s: number, a: number): boolean {
  // Polynomial as a bit mask: bit s and bit 0 set, bits s−1 … 1 from a.
  const poly = (1 << s) | (a << 1) | 1;
  const order = (1 << s) - 1;
  const mulX = (r: number) => {
    const t = r << 1;
    return t & (1 << s) ? t ^ poly : t;
  };
  // x^e mod p for e = 1…order: x^order must be 1 and no smaller power.
  let r = 1;
  for (let e = 1; e <= order; e++) {
    r = mulX(r);
    if (r === 1) return e === order;
  }
  return false;
}

describe("sobolDirections and the direction table", () => {
  it("every row is a primitive polynomial over GF(2), all distinct, with odd initial m_k < 2^k (Sobol 1967; Joe & Kuo 2008)", () => {
    // The defining conditions of a valid Sobol direction table, checked by exhaustive powers of x.
    expect(SOBOL_MAX_DIMENSION).toBeGreaterThanOrEqual(21);
    const seen = new Set<string>();
    JOE_KUO_DIRECTION_ROWS.forEach(({ s, a, m }) => {
      expect(isPrimitive(s, a)).toBe(true);
      expect(a).toBeLessThan(2 ** (s - 1));
      seen.add(`${s}:${a}`);
      expect(m.length).toBe(s);
      m.forEach((mk, k) => {
        expect(mk % 2).toBe(1);
        expect(mk).toBeLessThan(2 ** (k + 1));
      });
    });
    expect(seen.size).toBe(JOE_KUO_DIRECTION_ROWS.length);
  });

  it("sobolDirections(j) gives odd m_k < 2^k for all 32 bits, so each V_k has its top set bit at k", () => {
    // V_k = m_k·2^(32−k) with m_k odd ⇔ the lowest set bit of V_k is bit 32−k (Sobol 1967).
    for (let j = 0; j < SOBOL_MAX_DIMENSION; j++) {
      const v = sobolDirections(j);
      v.forEach((vk, k) => {
        expect(vk).toBeGreaterThan(0);
        expect(vk % 2 ** (32 - (k + 1))).toBe(0);
        expect((vk / 2 ** (32 - (k + 1))) % 2).toBe(1);
      });
    }
  });
});

describe("sobolUnit", () => {
  it("dimension 1 is the van der Corput sequence in base 2 in Gray-code order: 0, ½, ¾, ¼, ⅜, ⅞, ⅝, ⅛", () => {
    // Closed form: point i is the bit reversal of the Gray code i ⊕ ⌊i/2⌋ (Antonov & Saleev 1979).
    const x = sobolUnit(8, 1);
    expect(Array.from(x)).toEqual([0, 0.5, 0.75, 0.25, 0.375, 0.875, 0.625, 0.125]);
    const n = 1024;
    const y = sobolUnit(n, 1);
    for (let i = 0; i < n; i++) {
      const g = i ^ (i >> 1);
      let radical = 0;
      for (let b = 0; b < 10; b++) if (g & (1 << b)) radical += 2 ** -(b + 1);
      expect(y[i]).toBe(radical);
    }
  });

  it("the first two dimensions form a (0, m, 2)-net: every elementary interval 2^−a × 2^−(m−a) holds one point (m = 4…10)", () => {
    // Sobol 1967; Niederreiter 1992, §4.1: dims 1–2 of the Sobol sequence are a (0, 2)-sequence.
    for (const scramble of [undefined, { seed: 17 }]) {
      for (let m = 4; m <= 10; m++) {
        const n = 2 ** m;
        // A block starting at a multiple of 2^m (here the second block) is a net too.
        const x = sobolUnit(n, 2, { skip: n, scramble });
        for (let a = 0; a <= m; a++) {
          const counts = new Int32Array(n);
          for (let i = 0; i < n; i++) {
            const bx = Math.floor(x[2 * i] * 2 ** a);
            const by = Math.floor(x[2 * i + 1] * 2 ** (m - a));
            counts[bx * 2 ** (m - a) + by]++;
          }
          expect(Math.min(...counts)).toBe(1);
          expect(Math.max(...counts)).toBe(1);
        }
      }
    }
  });

  it("each one-dimensional projection of the first 2^m points puts one point in each of the 2^m bins, in every dimension", () => {
    // Each coordinate of a Sobol sequence is a (0, 1)-sequence in base 2 (Sobol 1967), shifted or not.
    const d = SOBOL_MAX_DIMENSION;
    for (const scramble of [undefined, { seed: 3 }]) {
      for (const m of [1, 5, 9, 12]) {
        const n = 2 ** m;
        const x = sobolUnit(n, d, { scramble });
        for (let j = 0; j < d; j++) {
          const bins = new Int32Array(n);
          for (let i = 0; i < n; i++) bins[Math.floor(x[i * d + j] * n)]++;
          expect(bins.every((c) => c === 1)).toBe(true);
        }
      }
    }
  });

  it("skip continues the sequence: points skip… equal the tail of a longer run", () => {
    const full = sobolUnit(300, 7);
    const tail = sobolUnit(123, 7, { skip: 177 });
    expect(Array.from(tail)).toEqual(Array.from(full.subarray(177 * 7)));
  });

  it("has a lower centred L2 discrepancy than seeded random points for n = 256, d = 5 (Hickernell 1998)", () => {
    const n = 256;
    const d = 5;
    const unit: ParameterSpace = Array.from({ length: d }, (_, j) => ({ name: `x${j}`, min: 0, max: 1 }));
    const sobol = centredL2Discrepancy(sobolUnit(n, d), n, d);
    const shifted = centredL2Discrepancy(sobolUnit(n, d, { scramble: { seed: 9 } }), n, d);
    for (const seed of [1, 2, 3, 4, 5]) {
      const random = centredL2Discrepancy(seededRandomDesign(unit, n, seed), n, d);
      expect(sobol).toBeLessThan(random / 2);
      expect(shifted).toBeLessThan(random / 2);
    }
  });

  it("rejects bad arguments naming them", () => {
    expect(() => sobolUnit(0, 2)).toThrow(/count/);
    expect(() => sobolUnit(4, SOBOL_MAX_DIMENSION + 1)).toThrow(/d must/);
    expect(() => sobolUnit(4, 2, { skip: -1 })).toThrow(/skip/);
    expect(() => sobolUnit(4, 2, { scramble: { seed: NaN } })).toThrow(/scramble\.seed/);
  });
});

describe("sobolDesign", () => {
  const SPACE: ParameterSpace = [
    { name: "kp", min: 0.1, max: 10, scale: "log" },
    { name: "ki", min: 0, max: 2 },
  ];

  it("sobolDesign maps unit points by axisValue: log axes evenly in ln v, linear axes evenly in v", () => {
    const unit = sobolUnit(64, 2);
    const design = sobolDesign(SPACE, 64);
    for (let i = 0; i < 64; i++) {
      // Closed form: v = min·(max/min)^w on the log axis, v = min + w·(max − min) on the linear one.
      expect(design[2 * i]).toBeCloseTo(0.1 * 100 ** unit[2 * i], 12);
      expect(design[2 * i + 1]).toBeCloseTo(2 * unit[2 * i + 1], 14);
    }
  });

  it("sobolDesign is deterministic per options, and the shift changes it per seed", () => {
    const a = sobolDesign(SPACE, 100, { scramble: { seed: 1 } });
    expect(Array.from(sobolDesign(SPACE, 100, { scramble: { seed: 1 } }))).toEqual(Array.from(a));
    expect(Array.from(sobolDesign(SPACE, 100, { scramble: { seed: 2 } }))).not.toEqual(Array.from(a));
    expect(() => sobolDesign(SPACE, 0)).toThrow(/count/);
  });
});
