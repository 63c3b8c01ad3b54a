import { describe, expect, it } from "vitest";
import {
  decisionProposalSchema,
  decisionRecordSchema,
  isFrozenDecision,
  readDecisionRecord,
  SAFETY_CAUTION,
  type DecisionRecord,
} from "../../src/schemas/decision.js";

const ID = "3f1c1d0e-8a0b-4c0a-9d3e-1a2b3c4d5e6f";
const REV = "0c9a8b7d-6e5f-4a3b-9c2d-1e0f9a8b7c6d";

/** A hand-written record of a PI on one plant: every field of version 1. */
function sampleRecord(): DecisionRecord {
  return {
    format: "loopyard.decision-record",
    version: 1,
    id: ID,
    title: "Ember 200: PI",
    rationale: "Least IAE within Ms ≤ 1.6.",
    state: "approved",
    workspace: { slug: "halvard-thermal", name: "Halvard Thermoworks — Ember line" },
    source: { kind: "sweep-candidate", sweepId: ID, candidateIndex: 12 },
    sourceLabel: "candidate 12 of sweep “Ember 200 — PI grid”",
    sweep: { id: ID, name: "Ember 200 — PI grid" },
    comparison: null,
    family: {
      key: REV,
      name: null,
      variants: [
        { label: "Ember 200", plantId: ID, plantName: "Ember 200 plate", revisionId: REV, revisionNumber: 1, revisionName: "Ember 200 plate", unitsNote: "", model: { kind: "transfer-function", num: [2], den: [30, 1], delay: 0.5 } },
      ],
    },
    structure: { kind: "pi", parameters: { kp: 1.2, ki: 0.1 }, tuned: ["kp", "ki"], controller: { kind: "pi", kp: 1.2, ki: 0.1 } },
    scenario: { kind: "setpoint-step", horizon: 200, dt: 0.01 },
    evaluation: { aggregate: { kind: "worst" } },
    criteria: ["iae", "settlingTime", "overshoot"],
    scores: { variants: [{ label: "Ember 200", status: "stable", scores: [12.5, "inf", null] }], aggregate: [12.5, "inf", null] },
    proposedBy: { id: "u1", name: "Priya Raman", email: "priya@halvard.example" },
    proposedAt: "2026-12-05T21:00:00.000Z",
    approvedBy: { id: "u2", name: "Tomas Lind", email: "tomas@halvard.example" },
    approvedAt: "2026-12-05T22:00:00.000Z",
    supersededBy: null,
    supersededAt: null,
    exportedAt: "2026-12-05T22:30:00.000Z",
    caution: SAFETY_CAUTION,
  };
}

describe("decision record, version 1", () => {
  it("readDecisionRecord(record) round-trips a record through JSON unchanged", () => {
    const record = sampleRecord();
    const read = readDecisionRecord(JSON.parse(JSON.stringify(record)));
    expect(read).toEqual({ ok: true, record });
    expect(decisionRecordSchema.parse(record)).toEqual(record);
  });

  it("readDecisionRecord refuses a later version naming the field, before looking at anything else", () => {
    expect(readDecisionRecord({ format: "loopyard.decision-record", version: 2 })).toEqual({
      ok: false,
      issue: { field: "version", message: "version: this is version 2 of loopyard.decision-record; this Loopyard reads version 1 only" },
    });
    expect(readDecisionRecord({ ...sampleRecord(), format: "other" })).toMatchObject({ ok: false, issue: { field: "format" } });
    expect(readDecisionRecord([1])).toMatchObject({ ok: false, issue: { field: "" } });
  });

  it("readDecisionRecord names the first field that does not fit", () => {
    const record = sampleRecord() as unknown as Record<string, unknown>;
    expect(readDecisionRecord({ ...record, state: "decided" })).toMatchObject({ ok: false, issue: { field: "state" } });
    expect(readDecisionRecord({ ...record, extra: 1 })).toMatchObject({ ok: false });
    const badScore = sampleRecord();
    (badScore.scores.variants[0]!.scores as unknown[])[0] = "NaN";
    expect(readDecisionRecord(badScore)).toMatchObject({ ok: false, issue: { field: "scores.variants.0.scores.0" } });
  });
});

describe("proposal body", () => {
  it("trims and normalises the title to NFC, and names the field of a bad source", () => {
    const parsed = decisionProposalSchema.parse({ title: "  Cafe\u0301 PI ", rationale: "why", source: { kind: "baseline", sweepId: ID, rule: "amigo", variant: "pid" } });
    expect(parsed.title).toBe("Café PI");
    const bad = decisionProposalSchema.safeParse({ title: "t", rationale: "r", source: { kind: "sweep-candidate", sweepId: ID, candidateIndex: -1 } });
    expect(bad.success).toBe(false);
    if (!bad.success) expect(bad.error.issues[0]?.path).toEqual(["source", "candidateIndex"]);
    expect(decisionProposalSchema.safeParse({ title: "t", rationale: "r", source: { kind: "sweep-candidate", sweepId: ID, candidateIndex: 0 }, state: "approved" }).success).toBe(false);
  });

  it("isFrozenDecision: approved and superseded only", () => {
    expect(["proposed", "returned", "approved", "superseded", "withdrawn"].map((s) => isFrozenDecision(s as never))).toEqual([false, false, true, true, false]);
  });
});
