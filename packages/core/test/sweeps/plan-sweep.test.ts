import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { planSweep } from "../../src/sweeps/plan-sweep.js";
import { evaluateSweepChunk } from "../../src/sweeps/evaluate-sweep-chunk.js";
import { SweepPlanError } from "../../src/sweeps/sweep-plan-error.js";
import { sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import { sweepIssues } from "../../src/sweeps/sweep-issue.js";
import type { Plant } from "../../src/plants/plant.js";

const REVISION = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";
const SECOND = "6a1d7c1f-9b5f-4c54-8e5d-2a2a3c1b0d22";
// 1/(s + 1)³: under P control χ = s³ + 3s² + 3s + 1 + kp is Hurwitz iff 9 > 1 + kp, kp < 8 (Routh–Hurwitz, closed form).
const threeLags: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
const twoLags: Plant = { kind: "transfer-function", num: [1], den: [1, 2, 1], delay: 0 };

const pSweep = sweepInputSchema.parse({
  name: "p",
  plantRevisionId: REVISION,
  structure: "p",
  ranges: { kp: { min: 2, max: 12, count: 3 } },
  scenario: { horizon: 30, dt: 0.01 },
  criteria: ["iae", "effort"],
});

describe("planSweep", () => {
  it("planSweep gives the structure, names, budget and index → controller ⇄ parameters once", () => {
    const plan = planSweep(pSweep, [threeLags]);
    expect(plan.structure).toEqual({ kind: "p", tunable: ["kp"], fixed: {} });
    expect(plan.parameters).toEqual(["kp"]);
    expect(plan.budget).toBe(3);
    expect(plan.d).toBe(1);
    expect(plan.space).toEqual([{ name: "kp", min: 2, max: 12, scale: "linear" }]);
    // Grid of count 3 from 2 to 12: 2, 7, 12 (evenly spaced, closed form).
    expect(plan.controllerAt(1)).toEqual({ kind: "p", kp: 7 });
    expect(plan.parametersOf(plan.controllerAt(2))).toEqual([12]);
    expect(plan.controllerFromParameters([7])).toEqual(plan.controllerAt(1));
    expect(() => plan.controllerAt(3)).toThrow(RangeError);
  });

  it("planSweep of a first-format PID sweep stores kp, ki, kd and the derived tf = kd/(10·kp) (the version-1 rule), and rebuilds the vector from them", () => {
    const plan = planSweep(
      sweepInputSchema.parse({
        name: "v1",
        plantRevisionId: REVISION,
        ranges: { kp: { min: 2, max: 2, count: 1 }, ki: { min: 0.5, max: 0.5, count: 1 }, kd: { min: 0, max: 1, count: 2 } },
        scenario: { horizon: 10, dt: 0.01 },
      }),
      [threeLags],
    );
    expect(plan.parameters).toEqual(["kp", "ki", "kd", "tf"]);
    expect(plan.evaluation).toEqual({ poles: false });
    const params = plan.parametersOf(plan.controllerAt(1));
    expect(params.slice(0, 3)).toEqual([2, 0.5, 1]);
    // tf = kd/(n·kp) = 1/(10·2) (DEFAULT_DERIVATIVE_FILTER).
    expect(params[3]).toBeCloseTo(1 / 20, 15);
    expect(Array.from(plan.tunableOf(params))).toEqual([2, 0.5, 1]);
  });

  it("planSweep of a state-feedback sweep stores the gains k[i] then n, with criterion options passed to evaluation", () => {
    // 1/(s² + 3s + 2) has two states in its controllable canonical realisation.
    const twoStates: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 };
    const plan = planSweep(
      sweepInputSchema.parse({
        name: "sf",
        plantRevisionId: REVISION,
        structure: "state-feedback",
        ranges: { "k[0]": { min: -1, max: 1, count: 2 }, "k[1]": { min: 0, max: 2, count: 2 } },
        fixed: { n: 3 },
        scenario: { horizon: 10, dt: 0.01 },
        criterionOptions: { q: 2 },
      }),
      [twoStates],
    );
    expect(plan.evaluation).toEqual({ poles: false, criterion: { q: 2 } });
    expect(plan.parametersOf(plan.controllerAt(3))).toEqual([1, 2, 3]);
  });

  it("planSweep refuses state feedback whose gains are not one per plant state, naming ranges", () => {
    const sf = sweepInputSchema.parse({
      name: "sf",
      plantRevisionId: REVISION,
      structure: "state-feedback",
      ranges: { "k[0]": { min: 0, max: 1, count: 2 }, "k[1]": { min: 0, max: 1, count: 2 } },
      fixed: { n: 1 },
      scenario: { horizon: 30, dt: 0.01 },
    });
    let caught: unknown;
    try {
      planSweep(sf, [threeLags]);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(SweepPlanError);
    expect((caught as SweepPlanError).field).toBe("ranges");
    expect((caught as SweepPlanError).reason).toMatch(/needs 3 gains/);
  });

  it("planSweep refuses variant overrides on a linear plant, naming the variant's parameters", () => {
    const family = sweepInputSchema.parse({
      ...pSweep,
      family: { variants: [{ plantRevisionId: REVISION }, { plantRevisionId: SECOND, parameters: { a: 1 } }] },
    });
    expect(() => planSweep(family, [threeLags, twoLags])).toThrow(/^family\.variants\.1\.parameters: variant parameters apply to nonlinear plants only/);
    expect(() => planSweep(family, [threeLags])).toThrow(SweepPlanError);
  });
});

describe("evaluateSweepChunk", () => {
  it("evaluateSweepChunk rows equal evaluateCandidate, with the unstable one's reason as a value", () => {
    const plan = planSweep(pSweep, [threeLags]);
    const { rows } = evaluateSweepChunk(plan, { start: 0, end: 3 });
    expect(rows.map((r) => [r.index, r.params[0], r.status])).toEqual([
      [0, 2, "stable"],
      [1, 7, "stable"],
      [2, 12, "unstable"],
    ]);
    const direct = evaluateCandidate(threeLags, { kind: "p", kp: 7 }, plan.scenario, ["iae", "effort"], { poles: false });
    expect(rows[1]?.scores?.[0]).toBe(direct.scores?.iae);
    expect(rows[1]?.scores?.[1]).toBe(direct.scores?.effort);
    expect(rows[1]?.reason).toBeNull();
    expect(rows[2]?.reason).toBe("the closed loop is unstable");
    expect(rows[2]?.scores).toBeNull();
  });

  it("evaluateSweepChunk reports a rejected controller as invalid with the rejection's sentence, on vectors numbered from first", () => {
    const plan = planSweep(pSweep, [threeLags]);
    const { rows } = evaluateSweepChunk(plan, { vectors: Float64Array.of(Number.NaN, 3), first: 10 });
    expect(rows[0]).toMatchObject({ index: 10, status: "invalid", scores: null });
    expect(rows[0]?.reason).toMatch(/^the controller was rejected: controller\.kp must be a finite number/);
    expect(rows[1]).toMatchObject({ index: 11, status: "stable", reason: null });
  });

  it("evaluateSweepChunk names the variant of a family where the candidate fails", () => {
    const family = sweepInputSchema.parse({
      ...pSweep,
      family: { variants: [{ plantRevisionId: REVISION, label: "two lags" }, { plantRevisionId: SECOND, label: "three lags" }] },
    });
    // Two lags 1/(s + 1)² stay stable for every kp > 0 (χ = s² + 2s + 1 + kp, Routh–Hurwitz); three lags not at kp = 12.
    const plan = planSweep(family, [twoLags, threeLags]);
    const { rows } = evaluateSweepChunk(plan, { start: 2, end: 3 });
    expect(rows[0]?.status).toBe("unstable");
    expect(rows[0]?.reason).toBe("the closed loop is unstable on three lags");
    expect(rows[0]?.variantScores?.length).toBe(4);
  });
});

describe("sizes are checked before anything is allocated", () => {
  for (const name of ["k[999999999]", "k[1000000]", "k[10]"]) {
    it(`sweepInputSchema refuses a state-feedback range on ${name} at once with a sentence`, () => {
      // Before the bound, the schema built the name list k[0] … k[999999999] while validating and ran out of memory.
      const result = sweepInputSchema.safeParse({
        name: "huge",
        plantRevisionId: REVISION,
        structure: "state-feedback",
        ranges: { [name]: { min: 0, max: 1, count: 2 } },
        fixed: { n: 1 },
        scenario: { horizon: 30, dt: 0.01 },
      });
      expect(result.success).toBe(false);
      const issue = sweepIssues(result.error!)[0];
      expect(issue?.field).toBe(`ranges.${name}`);
      expect(issue?.sentence).toBe(`ranges.${name}: state feedback takes at most 10 gains k[0]…k[9], one per plant state; "${name}" is beyond them`);
    });
  }

  it("sweepInputSchema refuses more than MAX_SWEEP_PARAMETERS range names", () => {
    const ranges = Object.fromEntries(Array.from({ length: 17 }, (_, i) => [`x${i}`, { min: 0, max: 1, count: 1 }]));
    const result = sweepInputSchema.safeParse({ name: "wide", plantRevisionId: REVISION, structure: "p", ranges, scenario: { horizon: 30, dt: 0.01 } });
    expect(result.success).toBe(false);
    expect(sweepIssues(result.error!).map((i) => i.sentence)).toContain("ranges: give at most 16 ranges");
  });
});
