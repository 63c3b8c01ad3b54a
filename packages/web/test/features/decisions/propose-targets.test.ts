import { describe, expect, it } from "vitest";
import { decisionSourceSchema } from "@loopyard/core";
import { baselineTarget, candidateTarget, initialCandidate, pickTarget } from "../../../src/features/decisions/propose-targets.js";

const sweep = { id: "0f6c1a52-3b8e-4d0e-9a57-2c1e6b7d9f10", name: "Ember 600 — PI load rejection" };
const comparison = { id: "7a1d2c3b-4e5f-4a6b-8c7d-9e0f1a2b3c4d", name: "Ember line — which criterion?" };

describe("proposal targets", () => {
  it("candidateTarget, baselineTarget and pickTarget give sources the API's own schema accepts (decisionSourceSchema, core)", () => {
    const candidate = candidateTarget(sweep, 63);
    const baseline = baselineTarget(sweep, { rule: "simc", variant: "pi", label: "SIMC PI" });
    const pick = pickTarget(comparison, "J(r=0.1)", "J(r=0.1)");
    for (const target of [candidate, baseline!, pick]) expect(decisionSourceSchema.safeParse(target.source).success).toBe(true);
    expect(candidate.source).toEqual({ kind: "sweep-candidate", sweepId: sweep.id, candidateIndex: 63 });
    expect(candidate.title).toBe("Candidate #63 from “Ember 600 — PI load rejection”");
    expect(pick.what).toBe("J(r=0.1)'s pick in “Ember line — which criterion?”");
  });

  it("baselineTarget is null for a rule or variant a proposal cannot name", () => {
    expect(baselineTarget(sweep, { rule: "cohen-coon", variant: "pi", label: "?" })).toBeNull();
    expect(baselineTarget(sweep, { rule: "simc", variant: "pd", label: "?" })).toBeNull();
  });

  it("initialCandidate reads ?candidate= as a whole number below the sweep's total, else none", () => {
    expect(initialCandidate("63", 64)).toBe(63);
    expect(initialCandidate("0", 1)).toBe(0);
    expect(initialCandidate("64", 64)).toBeNull();
    expect(initialCandidate("-1", 64)).toBeNull();
    expect(initialCandidate("1.5", 64)).toBeNull();
    expect(initialCandidate("", 64)).toBeNull();
    expect(initialCandidate(null, 64)).toBeNull();
  });
});
