import { describe, expect, it } from "vitest";
import { sweepDesignSchema } from "@loopyard/core";
import {
  DESIGN_ORDER,
  defaultDesign,
  designCandidateCount,
  formatOverrides,
  fromAggregate,
  fromDesign,
  parseOverrides,
  toAggregate,
  toDesign,
  toFamily,
} from "../../../src/features/sweeps/sweep-design-values.js";

describe("toDesign and fromDesign", () => {
  it("toDesign gives a design the shared sweepDesignSchema accepts, for every choice of the form", () => {
    for (const kind of DESIGN_ORDER) {
      const design = toDesign({ ...defaultDesign("ise"), kind });
      expect(sweepDesignSchema.safeParse(design).success).toBe(true);
    }
  });

  it("fromDesign(toDesign(v)) keeps the fields each design uses (round trip)", () => {
    const nm = { ...defaultDesign("iae"), kind: "nelder-mead" as const, starts: 5, iterations: 77, seed: 9 };
    expect(fromDesign(toDesign(nm), "ise")).toEqual(nm);
    const lhs = { ...defaultDesign("ise"), kind: "latin-hypercube" as const, count: 300, seed: 4 };
    expect(fromDesign(toDesign(lhs), "ise")).toEqual(lhs);
    expect(fromDesign(undefined, "ise").kind).toBe("grid");
  });

  it("designCandidateCount: the grid product, the design's count, starts × iterations, population × (generations + 1)", () => {
    const base = defaultDesign();
    expect(designCandidateCount({ ...base, kind: "grid" }, 75)).toBe(75);
    expect(designCandidateCount({ ...base, kind: "sobol", count: 4096 }, 75)).toBe(4096);
    // 8 starts × 200 iterations = 1600 (closed form)
    expect(designCandidateCount({ ...base, kind: "nelder-mead", starts: 8, iterations: 200 }, 75)).toBe(1600);
    // NSGA-II evaluates the initial population and 40 offspring generations: 60 × 41 = 2460, as core's sweepCandidateCount
    expect(designCandidateCount({ ...base, kind: "nsga2", population: 60, generations: 40 }, 75)).toBe(2460);
    expect(designCandidateCount({ ...base, kind: "random", count: Number.NaN }, 75)).toBeNull();
  });
});

describe("aggregates", () => {
  it("toAggregate sends p only for the percentile; fromAggregate defaults to the worst variant", () => {
    expect(toAggregate({ kind: "mean", p: 90 })).toEqual({ kind: "mean" });
    expect(toAggregate({ kind: "percentile", p: 75 })).toEqual({ kind: "percentile", p: 75 });
    expect(fromAggregate(undefined).kind).toBe("worst");
    expect(fromAggregate({ kind: "percentile", p: 50 })).toEqual({ kind: "percentile", p: 50 });
  });
});

describe("family", () => {
  it("parseOverrides reads name = value lists separated by lines, commas or semicolons", () => {
    expect(parseOverrides("a = 1\nb=2.5; c = -3e-2")).toEqual({ ok: true, values: { a: 1, b: 2.5, c: -0.03 } });
    expect(parseOverrides("")).toEqual({ ok: true, values: {} });
    expect(parseOverrides("a 1")).toMatchObject({ ok: false });
    expect(parseOverrides("a = x")).toMatchObject({ ok: false });
    expect(parseOverrides("a = 1, a = 2")).toMatchObject({ ok: false });
    expect(formatOverrides({ a: 1, b: 2.5 })).toBe("a = 1, b = 2.5");
  });

  it("toFamily leaves a plain one-plant sweep without a family and lists labelled variants first to last", () => {
    const rev = "00000000-0000-4000-8000-000000000001";
    expect(toFamily({ plantRevisionId: rev, label: "", parameters: "" }, [])).toBeUndefined();
    const family = toFamily({ plantRevisionId: rev, label: "200", parameters: "" }, [
      { plantId: "p", plantRevisionId: "00000000-0000-4000-8000-000000000002", label: " 400 ", labelTyped: true, parameters: "k = 2" },
    ]);
    expect(family).toEqual({
      variants: [
        { plantRevisionId: rev, label: "200" },
        { plantRevisionId: "00000000-0000-4000-8000-000000000002", label: "400", parameters: { k: 2 } },
      ],
    });
  });
});

describe("designSummary", () => {
  it("designSummary names the design and its numbers in a few words", async () => {
    const { designSummary } = await import("../../../src/features/sweeps/sweep-design-values.js");
    expect(designSummary(undefined)).toBe("Even grid");
    expect(designSummary({ kind: "latin-hypercube", count: 300, seed: 7 })).toBe("Latin hypercube, 300 candidates, seed 7");
    expect(designSummary({ kind: "search", method: "nsga2", population: 60, generations: 40, seed: 1 })).toContain("population 60 × 40 generations");
  });
});
