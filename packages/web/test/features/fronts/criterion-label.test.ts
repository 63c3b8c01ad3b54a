import { describe, expect, it } from "vitest";
import { criterionAxisTitle, frontSenseNote } from "../../../src/features/fronts/criterion-label.js";

describe("criterion labels on fronts", () => {
  it("criterionAxisTitle marks larger-is-better criteria and leaves the others as label [unit]", () => {
    // Common practice: a larger phase margin is the more robust loop (Åström & Hägglund 2006, §4.2).
    expect(criterionAxisTitle("phaseMargin")).toMatch(/larger is better$/);
    expect(criterionAxisTitle("ise")).not.toMatch(/better/);
  });

  it("frontSenseNote says which way is better per axis", () => {
    expect(frontSenseNote("ise", "effort")).toBe("smaller is better on both axes");
    expect(frontSenseNote("ise", "phaseMargin")).toBe("ISE: smaller is better; Phase margin: larger is better");
  });
});
