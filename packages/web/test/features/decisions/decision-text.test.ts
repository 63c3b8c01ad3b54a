import { describe, expect, it } from "vitest";
import { decisionProposalSchema } from "@loopyard/core";
import {
  defaultProposalTitle,
  eventSentence,
  familyOptions,
  formatParameters,
  joinWords,
  regretText,
  scoreText,
  sheetHref,
  sourcePath,
} from "../../../src/features/decisions/decision-text.js";

const SWEEP = "0f6c1a52-3b8e-4d0e-9a57-2c1e6b7d9f10";
const COMPARISON = "7a1d2c3b-4e5f-4a6b-8c7d-9e0f1a2b3c4d";

describe("sourcePath", () => {
  it("sourcePath(base, sweep-candidate) opens the sweep with the candidate chosen (?candidate=N, read by the front panel)", () => {
    expect(sourcePath("/w/halvard", { kind: "sweep-candidate", sweepId: SWEEP, candidateIndex: 63 })).toBe(`/w/halvard/sweeps/${SWEEP}?candidate=63`);
  });
  it("sourcePath(base, baseline) opens the sweep the baseline was scored beside; a pick opens its comparison", () => {
    expect(sourcePath("/w/h", { kind: "baseline", sweepId: SWEEP, rule: "simc", variant: "pi" })).toBe(`/w/h/sweeps/${SWEEP}`);
    expect(sourcePath("/w/h", { kind: "comparison-pick", comparisonId: COMPARISON, contender: "iae" })).toBe(`/w/h/comparisons/${COMPARISON}`);
  });
});

describe("formatParameters and scoreText", () => {
  it("formatParameters lists name = value in the record's order with 4 significant digits (format-number.ts)", () => {
    expect(formatParameters({ kp: 1.23456, ki: 0.35, kd: 0 })).toBe("kp = 1.235 · ki = 0.35 · kd = 0");
    expect(formatParameters({})).toBe("");
  });
  it("scoreText turns the record's JSON scores into cells: numbers formatted, inf as ∞, null (not applicable) as —", () => {
    const format = (v: number) => v.toFixed(2);
    expect(scoreText(0.5, format)).toBe("0.50");
    expect(scoreText("inf", format)).toBe("∞");
    expect(scoreText("-inf", format)).toBe("−∞");
    expect(scoreText(null, format)).toBe("—");
  });
});

describe("eventSentence and joinWords", () => {
  it("eventSentence names each audit-trail entry; an approval that replaced an earlier decision says so", () => {
    expect(eventSentence({ kind: "proposed" })).toBe("proposed it");
    expect(eventSentence({ kind: "returned" })).toBe("returned it");
    expect(eventSentence({ kind: "approved" })).toBe("approved it");
    expect(eventSentence({ kind: "approved", supersedes: COMPARISON })).toBe("approved it, superseding the family's earlier decision");
    expect(eventSentence({ kind: "withdrawn" })).toBe("withdrew it");
  });
  it("eventSentence of a revision lists what changed", () => {
    expect(eventSentence({ kind: "revised", revised: { title: "New", rationale: true } })).toBe("revised the title and the rationale and proposed it again");
    expect(eventSentence({ kind: "revised", revised: {} })).toBe("proposed it again");
  });
  it("joinWords joins with commas and a final 'and' (English list, common practice)", () => {
    expect(joinWords([])).toBe("");
    expect(joinWords(["a"])).toBe("a");
    expect(joinWords(["a", "b"])).toBe("a and b");
    expect(joinWords(["a", "b", "c"])).toBe("a, b and c");
  });
});

describe("defaultProposalTitle", () => {
  it("defaultProposalTitle stays within the title limit the API's schema sets, ending in … when cut", () => {
    const long = defaultProposalTitle("Candidate #12", `“${"Ember ".repeat(40)}”`);
    expect(long.length).toBe(120);
    expect(long.endsWith("…")).toBe(true);
    // The server's own schema accepts it as a title (decisionProposalSchema, core).
    const parsed = decisionProposalSchema.safeParse({ title: long, rationale: "why", source: { kind: "sweep-candidate", sweepId: SWEEP, candidateIndex: 12 } });
    expect(parsed.success).toBe(true);
    expect(defaultProposalTitle("Candidate #3", "“Ember 200 grid”")).toBe("Candidate #3 from “Ember 200 grid”");
  });
});

describe("familyOptions", () => {
  it("familyOptions lists each family once, in the order first seen", () => {
    const rows = [
      { family: { key: "a", name: "Ember line" } },
      { family: { key: "b", name: "Ember 600" } },
      { family: { key: "a", name: "Ember line" } },
    ];
    expect(familyOptions(rows)).toEqual([
      { key: "a", name: "Ember line" },
      { key: "b", name: "Ember 600" },
    ]);
  });
});

describe("sheetHref", () => {
  it("sheetHref builds the sheet address with the sample time in seconds, the method and the optional fixed-point format", () => {
    expect(sheetHref("/api/x", "0.001", "tustin", "")).toBe("/api/x/sheet?sampleTime=0.001&method=tustin");
    expect(sheetHref("/api/x", " 1e-3 ", "backward-euler", "q15")).toBe("/api/x/sheet?sampleTime=0.001&method=backward-euler&format=q15");
  });
  it("sheetHref refuses a sample time that is not a number above 0 (the server's sheet query refuses it too)", () => {
    for (const bad of ["", "0", "-0.01", "fast", "Infinity"]) expect(sheetHref("/api/x", bad, "tustin", "")).toBeNull();
  });
});

describe("regretText", () => {
  it("regretText: 0 is the column's best; whole per cent from 100 % up, two significant digits below (format-number.ts)", () => {
    expect(regretText(0)).toBe("best");
    expect(regretText(180.4)).toBe("+180 %");
    expect(regretText(1353.2)).toBe("+1353 %");
    expect(regretText(43.2)).toBe("+43 %");
    expect(regretText(6.71)).toBe("+6.7 %");
    expect(regretText("inf")).toBe("+∞ %");
    expect(regretText(null)).toBe("—");
  });
});
