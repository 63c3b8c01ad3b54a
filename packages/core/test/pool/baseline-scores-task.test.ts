import { describe, expect, it } from "vitest";
import { runComputeTask } from "../../src/pool/compute-tasks.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import type { Plant } from "../../src/plants/plant.js";

/** G1 = e^(−s)/(10s + 1) and G2 = 1.3·e^(−s)/(10s + 1): a first-order family with dead time. */
const G1: Plant = { kind: "transfer-function", num: [1], den: [10, 1], delay: 1 };
const G2: Plant = { kind: "transfer-function", num: [1.3], den: [10, 1], delay: 1 };
const ID1 = "11111111-1111-4111-8111-111111111111";
const ID2 = "22222222-2222-4222-8222-222222222222";

const definition = sweepInputSchema.parse({
  name: "family",
  plantRevisionId: ID1,
  family: { variants: [{ plantRevisionId: ID1 }, { plantRevisionId: ID2 }] },
  structure: "pi",
  ranges: { kp: { min: 0.5, max: 2, count: 2 }, ki: { min: 0.1, max: 1, count: 2 } },
  scenario: { kind: "setpoint-step", horizon: 60, dt: 0.01 },
  criteria: ["iae", "ise", "overshoot"],
});

describe("baselineScores (compute task)", () => {
  it("designs SIMC PI on the first variant (closed form) and scores it on every variant, worst case over the family", () => {
    const outcome = runComputeTask({ task: "baselineScores", input: { definition, models: [G1, G2], rule: "simc", variant: "pi" }, budget: { evaluations: 1_000_000 } });
    expect(outcome.ok, JSON.stringify(outcome)).toBe(true);
    if (!outcome.ok) return;
    const { controller, variants, aggregate, criteria } = outcome.value;
    // Skogestad 2003, eq. (4) with τc = θ: Kc = τ/(K(τc + θ)) = 10/(1·2) = 5; Ti = min(τ, 4(τc + θ)) = min(10, 8) = 8 s, so ki = Kc/Ti = 0.625.
    expect(controller.kp).toBeCloseTo(5, 10);
    expect(controller.ki).toBeCloseTo(0.625, 10);
    expect(controller.kd).toBe(0);
    expect(criteria).toEqual(["iae", "ise", "overshoot"]);
    // Each variant's scores are evaluateCandidate's on that plant with the sweep's scenario (the same path as the sweep's candidates).
    [G1, G2].forEach((plant, f) => {
      const run = evaluateCandidate(plant, controller, definition.scenario as never, criteria, { poles: false });
      expect(variants[f]?.status).toBe(run.status);
      criteria.forEach((c, k) => expect(variants[f]?.scores?.[k]).toBeCloseTo(run.scores![c], 12));
    });
    // Worst case (Loopyard's aggregate, smaller is better): the largest value over the variants.
    criteria.forEach((_, k) => expect(aggregate?.[k]).toBe(Math.max(variants[0]!.scores![k]!, variants[1]!.scores![k]!)));
  });

  it("refuses a rule that has no such variant, naming source.rule", () => {
    const outcome = runComputeTask({ task: "baselineScores", input: { definition, models: [G1, G2], rule: "simc", variant: "p" }, budget: { evaluations: 1_000 } });
    expect(outcome).toMatchObject({ ok: false, kind: "refused", reason: "source.rule: there is no simc P baseline" });
  });
});
