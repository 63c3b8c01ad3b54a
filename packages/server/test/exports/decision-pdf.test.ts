import { designCurves, decisionRecordSchema, recordDesign, DEPLOYMENT_CAUTION } from "@loopyard/core";
import type { DecisionRecord } from "@loopyard/core";
import { describe, expect, it } from "vitest";
import { renderDecisionPdf } from "../../src/exports/decision-pdf.js";
import { pdfDrawingCounts, pdfText } from "./pdf-text-check.js";

const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;

/** A decision record of the Ember family: a 2-DOF PID on two transfer-function plates. */
function emberRecord(): DecisionRecord {
  return decisionRecordSchema.parse({
    format: "loopyard.decision-record",
    version: 1,
    id: uuid(1),
    title: "Ember line PID, tuned by ITAE",
    rationale: "ITAE's pick keeps Ms below 1.6 on every plate and settles the 800 plate fastest.",
    state: "approved",
    workspace: { slug: "halvard", name: "Halvard Thermoworks — Ember line" },
    source: { kind: "sweep-candidate", sweepId: uuid(2), candidateIndex: 17 },
    sourceLabel: "candidate 17 of sweep “Ember PID grid”",
    sweep: { id: uuid(2), name: "Ember PID grid" },
    comparison: null,
    family: {
      key: "fam",
      name: "Ember heaters",
      variants: [
        { label: "Ember 400", plantId: uuid(3), plantName: "Ember 400 plate", revisionId: uuid(4), revisionNumber: 2, revisionName: "Ember 400 plate", unitsNote: "", model: { kind: "transfer-function", num: [1], den: [6, 5, 1], delay: 0.2 } },
        { label: "Ember 800", plantId: uuid(5), plantName: "Ember 800 plate", revisionId: uuid(6), revisionNumber: 1, revisionName: "Ember 800 plate", unitsNote: "", model: { kind: "transfer-function", num: [1.4], den: [12, 7, 1], delay: 0.3 } },
      ],
    },
    structure: {
      kind: "pid2dof",
      parameters: { kp: 2.2, ki: 0.6, kd: 1.1, tf: 0.12, b: 0.7, c: 0 },
      tuned: ["kp", "ki", "kd"],
      controller: { kind: "pid2dof", kp: 2.2, ki: 0.6, kd: 1.1, tf: 0.12, b: 0.7, c: 0 },
    },
    scenario: { kind: "setpoint-step", horizon: 30, dt: 0.01 },
    evaluation: { aggregate: { kind: "worst" } },
    criteria: ["itae", "overshoot", "ms"],
    scores: {
      variants: [
        { label: "Ember 400", status: "stable", scores: [3.1, 4.2, 1.41] },
        { label: "Ember 800", status: "stable", scores: [5.7, 6.9, 1.55] },
      ],
      aggregate: [5.7, 6.9, 1.55],
    },
    proposedBy: { id: "u1", name: "Priya Raman", email: "priya@halvard.example" },
    proposedAt: "2026-12-05T21:00:00.000Z",
    approvedBy: { id: "u2", name: "Tomas Lind", email: "tomas@halvard.example" },
    approvedAt: "2026-12-05T22:00:00.000Z",
    supersededBy: null,
    supersededAt: null,
    exportedAt: "2026-12-05T22:30:00.000Z",
    caution: DEPLOYMENT_CAUTION,
  });
}

describe("renderDecisionPdf", () => {
  it("renderDecisionPdf writes a PDF that names the parameters, the variants, the scores and the caution", async () => {
    const record = emberRecord();
    const pdf = await renderDecisionPdf(record, designCurves(recordDesign(record)));
    // A PDF file starts with its header and ends with the end-of-file marker (ISO 32000-1, §7.5.2 and §7.5.5).
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pdf.subarray(-6).toString("latin1")).toMatch(/%%EOF\s*$/);
    const text = pdfText(pdf);
    if (process.env.LOOPYARD_PDF_OUT) (await import("node:fs")).writeFileSync(process.env.LOOPYARD_PDF_OUT, pdf);
    for (const words of ["Ember line PID, tuned by ITAE", "kp [–]", "ki [1/s]", "kd [s]", "tf [s]", "b [–]", "2.2", "0.6", "1.1", "0.12", "Ember 400", "Ember 800", "ITAE", "Overshoot", "Ms", "Tomas Lind", "Rationale", "Audit summary"]) {
      expect(text, words).toContain(words);
    }
    // The caution is printed in full (once as its section, and in every page's footer).
    expect(text.replace(/\s+/g, " ")).toContain("commission this controller on the real machine");
    expect(text).toContain("Halvard Thermoworks — Ember line");
  });

  it("renderDecisionPdf draws the step responses and |S| as vector paths, not images", async () => {
    const record = emberRecord();
    const curves = designCurves(recordDesign(record));
    // Both variants have a trace and a sensitivity curve.
    for (const c of curves) {
      expect(c.step.t.length).toBeGreaterThan(100);
      expect(c.sensitivity.omega.length).toBeGreaterThan(20);
    }
    const counts = pdfDrawingCounts(await renderDecisionPdf(record, curves));
    expect(counts.images).toBe(0);
    // Every curve point after the first is one lineTo: two variants × (y and r, |S|) at ≥ 100 points each.
    const points = curves.reduce((n, c) => n + c.step.t.length + c.sensitivity.omega.length, 0);
    expect(counts.lineTo).toBeGreaterThan(points * 0.9);
  });
});
