import { describe, expect, it } from "vitest";
import { blankEntry, entryProblems, formVariantCount, readFamilyForm, type FamilyFormValues } from "../../../src/features/families/family-form-values.js";
import { spreadSummary } from "../../../src/features/families/spread-summary.js";

const REVISION = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";

function form(patch: Partial<FamilyFormValues["entries"][number]> = {}): FamilyFormValues {
  return { name: "Bench line", description: "", note: "", entries: [{ ...blankEntry("plant", REVISION, "bench"), ...patch }] };
}

describe("readFamilyForm", () => {
  it("readFamilyForm reads a grid spread into the family input the server takes", () => {
    const values = form({
      spreadOn: true,
      spread: { rows: [{ name: "c", min: "360", max: "440", count: "3" }, { name: "h", min: "1.6", max: "2.4", count: "2" }], design: "grid", count: "6", seed: "1" },
    });
    const read = readFamilyForm(values);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.input.definition.entries[0]).toEqual({
      plantRevisionId: REVISION,
      label: "bench",
      spread: { ranges: { c: { min: 360, max: 440, count: 3 }, h: { min: 1.6, max: 2.4, count: 2 } }, design: { kind: "grid" } },
    });
    // 3 × 2 grid (closed form of a full factorial design).
    expect(formVariantCount(values)).toBe(6);
  });

  it("readFamilyForm puts each problem at its entry's field: bad overrides, a range with max < min, more than 20 variants", () => {
    const bad = readFamilyForm(form({ parameters: "Ta = warm" }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(entryProblems(bad.errors, 0)[0]).toMatch(/^parameters: /);
    const reversed = readFamilyForm(form({ spreadOn: true, spread: { rows: [{ name: "c", min: "440", max: "360", count: "2" }], design: "grid", count: "6", seed: "1" } }));
    expect(reversed.ok).toBe(false);
    if (!reversed.ok) expect(entryProblems(reversed.errors, 0)).toEqual(["spread.ranges.c.max: max must be ≥ min"]);
    const big = form({ spreadOn: true, spread: { rows: [{ name: "c", min: "1", max: "2", count: "5" }, { name: "h", min: "1", max: "2", count: "5" }], design: "grid", count: "6", seed: "1" } });
    expect(formVariantCount(big)).toBe(25);
    const refused = readFamilyForm(big);
    if (!refused.ok) expect(refused.errors["definition.entries"]).toContain("25 variants");
    expect(refused.ok).toBe(false);
  });
});

describe("spreadSummary", () => {
  it("spreadSummary states the design, the ranges in the order variants vary, and the seed", () => {
    expect(spreadSummary({ ranges: { h: { min: 1.6, max: 2.4, count: 2 }, c: { min: 360, max: 440, count: 3 } }, design: { kind: "grid" } })).toBe("grid: c 360…440 × 3, h 1.6…2.4 × 2");
    expect(spreadSummary({ ranges: { c: { min: 360, max: 440, count: 1 } }, design: { kind: "latin-hypercube", count: 6, seed: 2026 } })).toBe("Latin hypercube of 6 (seed 2026): c 360…440");
  });
});
