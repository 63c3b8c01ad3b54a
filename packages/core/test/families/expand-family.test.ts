import { describe, expect, it } from "vitest";
import { expandFamily, familyVariantCount } from "../../src/families/expand-family.js";
import { familyDefinitionSchema } from "../../src/families/family-definition.js";
import { familyOfSweep } from "../../src/families/family-of-sweep.js";
import { planSweep } from "../../src/sweeps/plan-sweep.js";
import { sweepFamilySchema, sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import type { Plant } from "../../src/plants/plant.js";
import { expectClose } from "../support/expect-close.js";

const LINEAR = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";
const HEATER = "6a1d7c1f-9b5f-4c54-8e5d-2a2a3c1b0d22";

// A radiating plate: m·c·T' = u − h·(T − Ta), the ambient Ta and the mass m as parameters.
const heater: Plant = {
  kind: "nonlinear",
  states: ["T"],
  parameters: { m: 2, c: 900, h: 4, Ta: 20 },
  derivatives: ["(u - h*(T - Ta))/(m*c)"],
  output: "T",
  initial: [20],
};
const lag: Plant = { kind: "transfer-function", num: [1], den: [5, 1], delay: 0 };

describe("expandFamily", () => {
  it("expandFamily on a grid of 3 × 2 values gives 6 variants, the first name (sorted) slowest", () => {
    const definition = familyDefinitionSchema.parse({
      entries: [
        {
          plantRevisionId: HEATER,
          label: "Ember 800",
          parameters: { h: 4 },
          spread: { ranges: { m: { min: 1.8, max: 2.2, count: 3 }, Ta: { min: 15, max: 25, count: 2 } }, design: { kind: "grid" } },
        },
      ],
    });
    const family = expandFamily(definition);
    // n·m = 3·2 (closed form of a full factorial grid); "Ta" < "m" in code-unit order, so Ta varies slowest.
    expect(family.variants).toHaveLength(6);
    expect(familyVariantCount(definition)).toBe(6);
    const pairs = family.variants.map((v) => [v.parameters?.Ta, v.parameters?.m]);
    const expected = [
      [15, 1.8],
      [15, 2.0],
      [15, 2.2],
      [25, 1.8],
      [25, 2.0],
      [25, 2.2],
    ];
    pairs.forEach(([ta, m], i) => {
      expectClose(ta as number, expected[i]![0]!, 1e-12);
      expectClose(m as number, expected[i]![1]!, 1e-12, 1e-12);
    });
    // The fixed value is held on every variant (common practice: a spread varies only its ranges).
    expect(family.variants.every((v) => v.parameters?.h === 4 && v.plantRevisionId === HEATER)).toBe(true);
    expect(family.variants[0]?.label).toBe("Ember 800 · Ta 15, m 1.8");
  });

  it("expandFamily keeps entries in order, a plain entry as one variant, and its result parses as a sweep family", () => {
    const definition = familyDefinitionSchema.parse({
      entries: [
        { plantRevisionId: LINEAR, label: "Ember 200" },
        { plantRevisionId: HEATER, spread: { ranges: { m: { min: 1, max: 3, count: 2 } } } },
      ],
    });
    const family = expandFamily(definition, "Ember line");
    expect(family.name).toBe("Ember line");
    expect(family.variants.map((v) => v.label)).toEqual(["Ember 200", "spread · m 1", "spread · m 3"]);
    expect(family.variants[0]?.parameters).toBeUndefined();
    expect(sweepFamilySchema.parse(family)).toEqual(family);
  });

  it("expandFamily with a seeded sample gives the same variants for the same seed and others for another", () => {
    const spec = (seed: number) =>
      familyDefinitionSchema.parse({
        entries: [{ plantRevisionId: HEATER, spread: { ranges: { m: { min: 1.8, max: 2.2 }, Ta: { min: 15, max: 25 } }, design: { kind: "latin-hypercube", count: 5, seed } } }],
      });
    const a = expandFamily(spec(7));
    const b = expandFamily(spec(7));
    const c = expandFamily(spec(8));
    expect(a.variants).toHaveLength(5);
    expect(b).toEqual(a);
    expect(c).not.toEqual(a);
    // A Latin hypercube puts exactly one draw in each of the n equal strata of every axis (McKay, Beckman & Conover 1979).
    const strata = a.variants.map((v) => Math.floor(((v.parameters!.m! - 1.8) / 0.4) * 5)).sort();
    expect(strata).toEqual([0, 1, 2, 3, 4]);
    for (const v of a.variants) {
      expect(v.parameters!.Ta).toBeGreaterThanOrEqual(15);
      expect(v.parameters!.Ta).toBeLessThanOrEqual(25);
    }
  });

  it("a saved family revision plans as the very family a sweep lists by hand (the sweep contract)", () => {
    const definition = familyDefinitionSchema.parse({
      entries: [
        { plantRevisionId: LINEAR, label: "Ember 200" },
        { plantRevisionId: HEATER, label: "Ember 800", spread: { ranges: { m: { min: 1.5, max: 2.5, count: 3 } } } },
      ],
    });
    const family = expandFamily(definition);
    const base = { name: "s", plantRevisionId: LINEAR, structure: "p", ranges: { kp: { min: 1, max: 2, count: 2 } }, scenario: { horizon: 20, dt: 0.05 } };
    const byHand = sweepInputSchema.parse({ ...base, family: { variants: family.variants.map((v) => ({ ...v })) } });
    const plan = planSweep(byHand, [lag, heater, heater, heater]);
    expect(plan.family).toHaveLength(4);
    const masses = plan.family.slice(1).map((p) => (p.kind === "nonlinear" ? p.parameters.m : NaN));
    expect(masses).toEqual([1.5, 2, 2.5]);
  });

  it("familyDefinitionSchema refuses a family beyond 20 variants and a parameter both fixed and spread, naming the field", () => {
    const big = familyDefinitionSchema.safeParse({
      entries: [{ plantRevisionId: HEATER, spread: { ranges: { m: { min: 1, max: 2, count: 5 }, Ta: { min: 10, max: 30, count: 5 } } } }],
    });
    expect(big.success).toBe(false);
    expect(big.error?.issues[0]?.path).toEqual(["entries"]);
    expect(big.error?.issues[0]?.message).toContain("25 variants");
    const twice = familyDefinitionSchema.safeParse({
      entries: [{ plantRevisionId: HEATER, parameters: { m: 2 }, spread: { ranges: { m: { min: 1, max: 2, count: 2 } } } }],
    });
    expect(twice.error?.issues[0]?.path).toEqual(["entries", 0, "spread", "ranges", "m"]);
  });
});

describe("familyOfSweep", () => {
  it("familyOfSweep keys a library family on the family, whatever its revision, and an ad-hoc one on its variant set", () => {
    const source = { familyId: "7b2e8d2a-ac6f-4d65-9f6e-3b3b4d2c1e33", familyRevisionId: LINEAR, number: 2 };
    const saved = familyOfSweep({ family: { name: "Ember line", source, variants: [{ plantRevisionId: LINEAR }] } });
    const older = familyOfSweep({ family: { name: "Ember line", source: { ...source, number: 1, familyRevisionId: HEATER }, variants: [] } });
    expect(saved.key).toBe(`family:${source.familyId}`);
    expect(older.key).toBe(saved.key);
    expect(saved.name).toBe("Ember line");
    const a = familyOfSweep({ family: { variants: [{ plantRevisionId: LINEAR }, { plantRevisionId: HEATER, parameters: { m: 2, Ta: 20 } }] } });
    const b = familyOfSweep({ family: { variants: [{ plantRevisionId: HEATER, parameters: { Ta: 20, m: 2 } }, { plantRevisionId: LINEAR }] } });
    expect(a.key).toBe(b.key);
    expect(a.source).toBeNull();
    expect(familyOfSweep({ plantRevisionId: LINEAR }).key).toBe(`variants:${LINEAR}[]`);
  });
});
