import { describe, expect, it } from "vitest";
import { gridDesign } from "../../src/batch/grid-design.js";
import { latinHypercube, latinHypercubeUnit } from "../../src/batch/latin-hypercube.js";
import type { ParameterSpace } from "../../src/batch/parameter-space.js";
import { seededRandomDesign } from "../../src/batch/random-design.js";
import { createSeededRandom } from "../../src/batch/seeded-random.js";
import { gridCandidates } from "../../src/sweeps/grid-candidates.js";

const SPACE: ParameterSpace = [
  { name: "kp", min: 0.1, max: 10, scale: "log" },
  { name: "ki", min: 0, max: 2 },
  { name: "kd", min: 0.5, max: 1.5 },
];

/** The stratum index ⌊n·w⌋ of every point along axis j must be a permutation of 0…n−1. */
function strataOf(unit: Float64Array, n: number, d: number, j: number): number[] {
  return Array.from({ length: n }, (_, i) => Math.floor(unit[i * d + j] * n)).sort((a, b) => a - b);
}

describe("latinHypercubeUnit", () => {
  // McKay, Beckman & Conover (1979), §2: each of the n equal-probability strata of every input
  // holds exactly one of the n sample points.
  it("latinHypercubeUnit(n, d) puts exactly one sample in each of the n strata of every dimension", () => {
    for (const [n, d, seed] of [
      [1, 1, 1],
      [7, 3, 2],
      [50, 4, 3],
      [997, 6, 4],
    ] as const) {
      const unit = latinHypercubeUnit(n, d, createSeededRandom(seed));
      expect(unit.length).toBe(n * d);
      for (let j = 0; j < d; j++) expect(strataOf(unit, n, d, j)).toEqual(Array.from({ length: n }, (_, k) => k));
      for (const w of unit) expect(w >= 0 && w < 1).toBe(true);
    }
  });

  it("latinHypercube(space, n, seed) keeps one sample per stratum on linear and log axes alike", () => {
    // On a log axis the strata are equal in ln v (McKay et al. 1979 with the input ln v).
    const n = 64;
    const design = latinHypercube(SPACE, n, 11);
    const d = SPACE.length;
    const unit = new Float64Array(n * d);
    for (let i = 0; i < n; i++) {
      unit[i * d] = Math.log(design[i * d] / 0.1) / Math.log(100);
      unit[i * d + 1] = design[i * d + 1] / 2;
      unit[i * d + 2] = design[i * d + 2] - 0.5;
    }
    for (let j = 0; j < d; j++) {
      expect(strataOf(unit, n, d, j)).toEqual(Array.from({ length: n }, (_, k) => k));
    }
  });

  it("latinHypercube is reproducible per seed and differs between seeds", () => {
    const a = latinHypercube(SPACE, 100, 42);
    const b = latinHypercube(SPACE, 100, 42);
    const c = latinHypercube(SPACE, 100, 43);
    expect(Buffer.from(a.buffer).equals(Buffer.from(b.buffer))).toBe(true);
    expect(Buffer.from(a.buffer).equals(Buffer.from(c.buffer))).toBe(false);
  });

  it("latinHypercube rejects a bad count naming it", () => {
    expect(() => latinHypercube(SPACE, 0, 1)).toThrow(/count/);
    expect(() => latinHypercube([{ name: "kp", min: 0, max: 1, scale: "log" }], 5, 1)).toThrow(/space\[0\]\.min/);
  });
});

describe("createSeededRandom", () => {
  it("createSeededRandom(seed) gives the same sequence for the same seed and another for another seed", () => {
    const a = createSeededRandom(2026);
    const b = createSeededRandom(2026);
    const c = createSeededRandom(2027);
    const sa = Array.from({ length: 1000 }, a);
    expect(Array.from({ length: 1000 }, b)).toEqual(sa);
    expect(Array.from({ length: 1000 }, c)).not.toEqual(sa);
  });

  it("createSeededRandom draws uniform numbers in [0, 1): mean 1/2, variance 1/12", () => {
    // U[0,1) has mean 1/2 and variance 1/12 (common practice); with N = 200 000 draws the standard
    // error of the mean is √(1/12/N) ≈ 6.5e-4, so 5e-3 is a loose bound (~8σ).
    const random = createSeededRandom(7);
    const n = 200_000;
    let sum = 0;
    let sumSq = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const u = random();
      if (!(u >= 0 && u < 1)) outside++;
      sum += u;
      sumSq += u * u;
    }
    const mean = sum / n;
    expect(outside).toBe(0);
    expect(Math.abs(mean - 0.5)).toBeLessThan(5e-3);
    expect(Math.abs(sumSq / n - mean * mean - 1 / 12)).toBeLessThan(5e-3);
  });

  it("seededRandomDesign(space, n, seed) is reproducible per seed and stays inside the bounds", () => {
    const a = seededRandomDesign(SPACE, 500, 5);
    expect(Buffer.from(a.buffer).equals(Buffer.from(seededRandomDesign(SPACE, 500, 5).buffer))).toBe(true);
    expect(Buffer.from(a.buffer).equals(Buffer.from(seededRandomDesign(SPACE, 500, 6).buffer))).toBe(false);
    for (let i = 0; i < 500; i++) {
      SPACE.forEach((axis, j) => {
        const v = a[i * 3 + j];
        expect(v >= axis.min && v <= axis.max).toBe(true);
      });
    }
  });
});

describe("gridDesign", () => {
  it("gridDesign lists candidates in the same order and values as gridCandidates (kp slowest, kd fastest)", () => {
    const ranges = { kp: { min: 0.5, max: 2, count: 4 }, ki: { min: 0, max: 1, count: 3 }, kd: { min: 0, max: 0.6, count: 2 } };
    const pids = gridCandidates(ranges, { mode: "fixed", tf: 0.1 });
    const space: ParameterSpace = (["kp", "ki", "kd"] as const).map((name) => ({ name, min: ranges[name].min, max: ranges[name].max }));
    const grid = gridDesign(space, [4, 3, 2]);
    expect(grid.length).toBe(pids.length * 3);
    pids.forEach((pid, i) => {
      expect(grid[i * 3]).toBeCloseTo(pid.kp, 14);
      expect(grid[i * 3 + 1]).toBeCloseTo(pid.ki, 14);
      expect(grid[i * 3 + 2]).toBeCloseTo(pid.kd, 14);
    });
  });

  it("gridDesign on a log axis spaces values geometrically: v_j = min·(max/min)^(j/(c−1))", () => {
    // Closed form of an even spread in ln v.
    const grid = gridDesign([{ name: "kp", min: 0.01, max: 100, scale: "log" }], [5]);
    [0.01, 0.1, 1, 10, 100].forEach((v, j) => expect(grid[j]).toBeCloseTo(v, 12 - Math.max(0, Math.log10(v))));
    expect(grid[0]).toBe(0.01);
    expect(grid[4]).toBe(100);
  });

  it("gridDesign with a count of 1 gives min, and rejects a bad count naming it", () => {
    expect(Array.from(gridDesign([{ name: "kp", min: 2, max: 3 }], [1]))).toEqual([2]);
    expect(() => gridDesign(SPACE, [2, 0, 2])).toThrow(/counts\[1\]/);
    expect(() => gridDesign(SPACE, [2, 2])).toThrow(/counts/);
  });
});
