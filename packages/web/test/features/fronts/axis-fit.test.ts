import { describe, expect, it } from "vitest";
import { quantileSeq } from "mathjs";
import { edgeMarks, edgeSymbol, EXTRA_REACH, farOutFences, FAR_OUT_IQR, fitAxis, fitFrontAxes, selectKth, selectQuantile } from "../../../src/features/fronts/axis-fit.js";
import { RANGE_PADDING } from "../../../src/features/fronts/reference-points.js";

/** A seeded linear congruential generator (Numerical Recipes constants), so the data is the same on every run. */
function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

const range = (n: number) => Array.from({ length: n }, (_, i) => i);

describe("selectKth and selectQuantile", () => {
  it("selectKth(a, k) returns the k-th smallest value with smaller ones before it and larger ones after (checked against a full sort), duplicates included", () => {
    const random = lcg(11);
    for (const n of [1, 2, 3, 10, 1001]) {
      for (const distinct of [true, false]) {
        const values = Array.from({ length: n }, () => (distinct ? random() : Math.floor(random() * 4)));
        const sorted = [...values].sort((p, q) => p - q);
        for (const k of [0, Math.floor(n / 3), n - 1]) {
          const a = Float64Array.from(values);
          expect(selectKth(a, k)).toBe(sorted[k]);
          for (let i = 0; i < k; i++) expect(a[i]).toBeLessThanOrEqual(a[k] as number);
          for (let i = k + 1; i < n; i++) expect(a[i]).toBeGreaterThanOrEqual(a[k] as number);
        }
      }
    }
  });

  it("selectQuantile(values, q) agrees with mathjs quantileSeq (Hyndman & Fan 1996, definition 7) on random data", () => {
    const random = lcg(7);
    for (const n of [1, 2, 5, 101, 1000]) {
      const values = Array.from({ length: n }, () => random() * 100 - 20);
      for (const q of [0, 0.05, 0.25, 0.5, 0.75, 0.95, 1]) {
        const reference = quantileSeq(values, q) as number;
        expect(Math.abs(selectQuantile(Float64Array.from(values), q) - reference)).toBeLessThanOrEqual(1e-12 + 1e-12 * Math.abs(reference));
      }
    }
  });

  it("selectQuantile and selectKth refuse empty values, q outside [0, 1] and k outside the array with a RangeError naming the parameter", () => {
    expect(() => selectQuantile(new Float64Array(0), 0.5)).toThrow(RangeError);
    expect(() => selectQuantile(Float64Array.from([1, 2]), 1.5)).toThrow(/q must lie in \[0, 1\]/);
    expect(() => selectKth(Float64Array.from([1, 2]), 2)).toThrow(/k must be a position/);
  });
});

describe("farOutFences", () => {
  it("farOutFences(0..100) are Q1 − 3·IQR and Q3 + 3·IQR (Tukey 1977, outer fences; closed form Q1 = 25, Q3 = 75)", () => {
    // Shuffled, so that the selection does real work.
    const values = range(101).map((i) => (i * 37) % 101);
    const fences = farOutFences(Float64Array.from(values));
    expect(FAR_OUT_IQR).toBe(3);
    expect(fences?.[0]).toBeCloseTo(25 - 3 * 50, 12);
    expect(fences?.[1]).toBeCloseTo(75 + 3 * 50, 12);
  });

  it("farOutFences falls back to the 5–95 % spread when the quartiles coincide, and is null when every value is alike", () => {
    // 90 values of 1, 5 of 0 and 5 of 2: Q1 = Q3 = 1; q05 = x[4.95] = 0.95 → 0·0.05 + 1·0.95, q95 = x[94.05] = 1.05 (definition 7).
    const coarse = Float64Array.from([...Array(5).fill(0), ...Array(90).fill(1), ...Array(5).fill(2)]);
    const fences = farOutFences(coarse);
    expect(fences?.[0]).toBeCloseTo(1 - 3 * 0.1, 12);
    expect(fences?.[1]).toBeCloseTo(1 + 3 * 0.1, 12);
    expect(farOutFences(Float64Array.from([3, 3, 3]))).toBeNull();
  });
});

describe("fitAxis", () => {
  it("fitAxis leaves one far-out candidate out of the range and marks the axis clipped (common practice: fit the bulk, flag outliers)", () => {
    // 0..99 and 10 000: Q1 = x[25] = 25, Q3 = x[75] = 75, fences [−125, 225]; the span is [0, 99].
    const cloud = [...range(100), 10_000];
    const fit = fitAxis(cloud, [0, 3, 5], false);
    expect(fit?.span).toEqual([0, 99]);
    expect(fit?.clipped).toBe(true);
    expect(fit?.range[0]).toBeCloseTo(-RANGE_PADDING * 99, 12);
    expect(fit?.range[1]).toBeCloseTo(99 + RANGE_PADDING * 99, 12);
  });

  it("fitAxis keeps the whole front, even a front point beyond the fences", () => {
    const fit = fitAxis([...range(100), 10_000], [0, 500], false);
    expect(fit?.span).toEqual([0, 500]);
    expect(fit?.clipped).toBe(true);
  });

  it("fitAxis without far-out values is the cloud's extent padded by RANGE_PADDING, not clipped (invariant)", () => {
    const random = lcg(3);
    const cloud = Array.from({ length: 500 }, () => 2 + random());
    const lo = Math.min(...cloud);
    const hi = Math.max(...cloud);
    const fit = fitAxis(cloud, [lo + 0.1], false);
    expect(fit?.clipped).toBe(false);
    expect(fit?.span).toEqual([lo, hi]);
    expect(fit?.range[1]).toBeCloseTo(hi + RANGE_PADDING * (hi - lo), 12);
  });

  it("fitAxis on a log axis works in log10 units and leaves out values ≤ 0", () => {
    // 10^0 … 10^3 in 100 log-even steps, one 10^9 and a 0 (a log axis cannot show it).
    const cloud = [...range(100).map((i) => 10 ** ((3 * i) / 99)), 1e9, 0];
    const fit = fitAxis(cloud, [1], true);
    expect(fit?.span[0]).toBeCloseTo(0, 12);
    expect(fit?.span[1]).toBeCloseTo(3, 12);
    expect(fit?.clipped).toBe(true);
    expect(fit?.range[1]).toBeCloseTo(3 + RANGE_PADDING * 3, 12);
  });

  it("fitAxis takes extra values (baselines) within EXTRA_REACH of the span into the range and leaves the farther ones out", () => {
    // Span [0, 100]; reach 0.25 · 100 = 25 beyond each end: 120 widens it, 130 and 10⁶ do not.
    expect(EXTRA_REACH).toBe(0.25);
    const fit = fitAxis(range(101), [10], false, [120, 130, 1e6]);
    expect(fit?.span).toEqual([0, 120]);
    expect(fit?.clipped).toBe(false);
  });

  it("fitAxis is null when there is nothing finite to fit", () => {
    expect(fitAxis([], [], false)).toBeNull();
    expect(fitAxis([0, -1], [], true)).toBeNull();
  });

  it("fitFrontAxes fits x and y apart", () => {
    const cloud = { xs: [...range(100), 10_000], ys: [...range(100), 50] };
    const fit = fitFrontAxes(cloud, [{ x: 1, y: 99 }], [], false);
    expect(fit.x?.clipped).toBe(true);
    expect(fit.y?.clipped).toBe(false);
  });
});

describe("edgeMarks", () => {
  it("edgeSymbol points the triangle where the point lies: sides and corners", () => {
    expect(edgeSymbol(1, 0)).toBe("triangle-right");
    expect(edgeSymbol(-1, 0)).toBe("triangle-left");
    expect(edgeSymbol(0, 1)).toBe("triangle-up");
    expect(edgeSymbol(0, -1)).toBe("triangle-down");
    expect(edgeSymbol(1, 1)).toBe("triangle-ne");
    expect(edgeSymbol(-1, -1)).toBe("triangle-sw");
  });

  it("edgeMarks moves each far-out candidate into the middle of the padding band it lies beyond and keeps its true values", () => {
    const xs = [...range(100), 10_000, 10_000];
    const ys = [...range(100), 50, 10_000];
    const indices = range(102);
    const cloud = { indices, xs, ys };
    const fit = fitFrontAxes(cloud, [{ x: 0, y: 0 }], [], false);
    const marks = edgeMarks(cloud, fit.x, fit.y, false);
    expect(marks.indices).toEqual([100, 101]);
    const xBand = ((fit.x?.range[1] as number) + 99) / 2;
    expect(marks.xs[0]).toBeCloseTo(xBand, 12);
    expect(marks.ys[0]).toBe(50);
    expect(marks.symbols).toEqual(["triangle-right", "triangle-ne"]);
    expect(marks.trueXs).toEqual([10_000, 10_000]);
    expect(marks.trueYs).toEqual([50, 10_000]);
  });

  it("edgeMarks on a log axis places the band in data units (10 to the band's log10 value)", () => {
    const cloud = { indices: range(101), xs: [...range(100).map((i) => 10 ** ((3 * i) / 99)), 1e9], ys: Array(101).fill(1).map((v, i) => v + i) };
    const fit = fitFrontAxes(cloud, [{ x: 1, y: 1 }], [], true);
    const marks = edgeMarks(cloud, fit.x, fit.y, true);
    expect(marks.indices).toEqual([100]);
    expect(Math.log10(marks.xs[0] as number)).toBeCloseTo(((fit.x?.range[1] as number) + 3) / 2, 12);
  });

  it("edgeMarks is empty when no axis is clipped", () => {
    const cloud = { indices: [0, 1], xs: [1, 2], ys: [1, 2] };
    const fit = fitFrontAxes(cloud, [], [], false);
    expect(edgeMarks(cloud, fit.x, fit.y, false).indices).toEqual([]);
  });
});

describe("fitAxis with everything", () => {
  it("fitAxis(…, everything) is the padded extent of the cloud, the front and every extra value, never clipped", () => {
    const fit = fitAxis([...range(100), 10_000], [5], false, [-50], true);
    expect(fit?.span).toEqual([-50, 10_000]);
    expect(fit?.clipped).toBe(false);
    expect(fit?.range[1]).toBeCloseTo(10_000 + RANGE_PADDING * 10_050, 9);
  });
});
