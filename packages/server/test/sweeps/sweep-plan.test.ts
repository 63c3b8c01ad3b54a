import { describe, expect, it } from "vitest";
import { sweepInputSchema } from "@loopyard/core";
import { candidateParams, planController, plantStateCount, structureProblem, sweepPlan, tunableFromParams } from "../../src/sweeps/sweep-plan.js";

const REVISION = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";

describe("sweep plans", () => {
  it("sweepPlan of a first-format PID sweep stores kp, ki, kd and the derived tf = kd/(10·kp) (the version-1 rule)", () => {
    const plan = sweepPlan(
      sweepInputSchema.parse({
        name: "v1",
        plantRevisionId: REVISION,
        ranges: { kp: { min: 2, max: 2, count: 1 }, ki: { min: 0.5, max: 0.5, count: 1 }, kd: { min: 0, max: 1, count: 2 } },
        scenario: { horizon: 10, dt: 0.01 },
      }),
    );
    expect(plan.parameters).toEqual(["kp", "ki", "kd", "tf"]);
    expect(plan.evaluation).toEqual({ poles: false });
    const params = candidateParams(plan, planController(plan, 1));
    expect(params.slice(0, 3)).toEqual([2, 0.5, 1]);
    expect(params[3]).toBeCloseTo(1 / 20, 15);
    // A stored candidate rebuilds the same tunable vector from its params by name.
    expect(Array.from(tunableFromParams(plan, plan.parameters, params))).toEqual([2, 0.5, 1]);
  });

  it("sweepPlan of a state-feedback sweep stores the gains k[i] and n, and structureProblem checks the gain count against the plant", () => {
    const plan = sweepPlan(
      sweepInputSchema.parse({
        name: "sf",
        plantRevisionId: REVISION,
        structure: "state-feedback",
        ranges: { "k[0]": { min: -1, max: 1, count: 2 }, "k[1]": { min: 0, max: 2, count: 2 } },
        fixed: { n: 3 },
        scenario: { horizon: 10, dt: 0.01 },
        criterionOptions: { q: 2 },
      }),
    );
    expect(plan.evaluation).toEqual({ poles: false, criterion: { q: 2 } });
    expect(candidateParams(plan, planController(plan, 3))).toEqual([1, 2, 3]);
    // 1/(s² + 3s + 2) has two states in its controllable canonical realisation; 1/(s+1) has one.
    const twoStates = { kind: "transfer-function" as const, num: [1], den: [1, 3, 2], delay: 0 };
    expect(plantStateCount(twoStates)).toBe(2);
    expect(structureProblem(plan.structure, twoStates)).toBeNull();
    expect(structureProblem(plan.structure, { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 })).toMatch(/1 gains/);
  });
});
