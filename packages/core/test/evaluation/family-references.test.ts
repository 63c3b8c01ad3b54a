import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { familyBoundCurve } from "../../src/evaluation/family-bound-curve.js";
import { scoreFamilyBaselines } from "../../src/evaluation/score-family-baselines.js";
import { boundCurve } from "../../src/optimal/bound-curve.js";
import type { Plant } from "../../src/plants/plant.js";
import { scoreBaselines } from "../../src/tuning/score-baselines.js";
import { expectClose } from "../support/expect-close.js";

const family: Plant[] = [
  { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 },
  { kind: "transfer-function", num: [1.5], den: [1, 2.2, 1.6, 0.4], delay: 0 },
  { kind: "transfer-function", num: [0.8], den: [2, 3, 1], delay: 0 },
];
const step = { kind: "setpoint-step" as const };
const pids = [
  [1, 0.4, 0.5],
  [2, 0.8, 1.5],
  [0.5, 0.2, 0.1],
  [3, 1, 3],
];

describe("familyBoundCurve", () => {
  it("worst case: at each ratio the largest variant bound, and no worst-case aggregate lies below its lines", () => {
    // Closed form: ISE_agg ≥ ISE_f, Effort_agg ≥ Effort_f ⇒ ISE_agg + ρ·Effort_agg ≥ max_f c_f(ρ).
    const combined = familyBoundCurve(family, step, { kind: "worst" });
    expect(combined.ok).toBe(true);
    if (!combined.ok) return;
    const singles = family.map((plant) => boundCurve(plant, step));
    for (const point of combined.points) {
      const costs = singles.map((c) => (c.ok ? c.points.find((p) => p.ratio === point.ratio)!.cost : NaN));
      expectClose(point.cost, Math.max(...costs), 1e-15);
      expectClose(point.ise + point.ratio * point.effort, point.cost, 1e-9);
    }
    for (const [kp, ki, kd] of pids) {
      const runs = family.map((plant) => evaluateCandidate(plant, { kind: "pid", kp, ki, kd, tf: 0.05 }, { kind: "setpoint-step", horizon: 1, dt: 0.01 }, ["ise", "effort"], { criterion: { horizon: "infinite" } }));
      if (!runs.every((r) => r.status === "stable")) continue;
      const ise = Math.max(...runs.map((r) => r.scores!.ise));
      const effort = Math.max(...runs.map((r) => r.scores!.effort));
      for (const p of combined.points) expect(ise + p.ratio * effort).toBeGreaterThanOrEqual(p.cost * (1 - 1e-9));
    }
    expect(combined.note).toMatch(/worst case over 3 variants/);
  });

  it("mean: the mean of the variants' points at the same ratio, on the mean line; the mean aggregate stays above it", () => {
    const combined = familyBoundCurve(family, step, { kind: "mean" });
    expect(combined.ok).toBe(true);
    if (!combined.ok) return;
    for (const point of combined.points) expectClose(point.ise + point.ratio * point.effort, point.cost, 1e-9);
    for (const [kp, ki, kd] of pids) {
      const runs = family.map((plant) => evaluateCandidate(plant, { kind: "pid", kp, ki, kd, tf: 0.05 }, { kind: "setpoint-step", horizon: 1, dt: 0.01 }, ["ise", "effort"], { criterion: { horizon: "infinite" } }));
      if (!runs.every((r) => r.status === "stable")) continue;
      const ise = runs.reduce((s, r) => s + r.scores!.ise, 0) / runs.length;
      const effort = runs.reduce((s, r) => s + r.scores!.effort, 0) / runs.length;
      for (const p of combined.points) expect(ise + p.ratio * effort).toBeGreaterThanOrEqual(p.cost * (1 - 1e-9));
    }
  });

  it("percentile: refused with a reason; a nonlinear variant is left out of the worst case and blocks the mean", () => {
    expect(familyBoundCurve(family, step, { kind: "percentile", p: 50 }).ok).toBe(false);
    const tank: Plant = { kind: "nonlinear", states: ["h"], parameters: {}, derivatives: ["-sqrt(h) + u"], output: "h", initial: [1], operatingInput: 1 };
    const worst = familyBoundCurve([...family, tank], step, { kind: "worst" });
    expect(worst.ok && worst.note.includes("left out")).toBe(true);
    expect(familyBoundCurve([...family, tank], step, { kind: "mean" }).ok).toBe(false);
  });
});

describe("scoreFamilyBaselines", () => {
  it("designs each rule on the first variant and aggregates its scores over every variant like a candidate's", () => {
    const scenario = { kind: "setpoint-step" as const, horizon: 40, dt: 0.01 };
    const criteria = ["iae", "overshoot"] as const;
    const scored = scoreFamilyBaselines(family, scenario, criteria, { kind: "worst" });
    const nominal = scoreBaselines(family[0], scenario, criteria);
    expect(scored.map((b) => b.label)).toEqual(nominal.map((b) => b.label));
    let checked = 0;
    for (const b of scored) {
      if (!b.ok || b.evaluation?.status !== "stable") continue;
      // Reference: the definition — the worst (largest) value of each criterion over the variants.
      const runs = family.map((plant) => evaluateCandidate(plant, b.controller, scenario, criteria));
      for (const id of criteria) expect(b.evaluation.scores![id]).toBe(Math.max(...runs.map((r) => r.scores![id])));
      checked++;
    }
    expect(checked).toBeGreaterThan(2);
  });
});
