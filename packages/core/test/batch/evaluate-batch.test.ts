import { describe, expect, it } from "vitest";
import { BATCH_STATUSES, STATUS_INVALID, STATUS_STABLE, STATUS_UNSTABLE } from "../../src/batch/batch-status.js";
import { evaluateBatch } from "../../src/batch/evaluate-batch.js";
import { latinHypercube } from "../../src/batch/latin-hypercube.js";
import { controllerFromVector, type Structure } from "../../src/batch/structure.js";
import type { CriterionId } from "../../src/criteria/criterion-id.js";
import type { Plant } from "../../src/plants/plant.js";
import type { Scenario } from "../../src/simulation/scenario.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";

// The family mixes the engine's paths: a delay-free rational loop (exact, scores in the recurrence),
// a dead-time loop (delay line, Nyquist verdict), a state-space plant and a nonlinear plant typed
// as expressions (a tank, Torricelli outflow).
const FAMILY: Plant[] = [
  { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 },
  { kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 },
  { kind: "state-space", A: [[0, 1], [-2, -3]], B: [[0], [1]], C: [[2, 0]], D: [[0]] },
  {
    kind: "nonlinear",
    states: ["h"],
    parameters: { a: 0.5 },
    derivatives: ["u - a*sqrt(abs(h))"],
    output: "h",
    initial: [1],
    operatingInput: 0.5,
  },
];
const STRUCTURE: Structure = { kind: "pid", tunable: ["kp", "ki", "kd"], fixed: {}, filter: { mode: "ratio", n: 10 } };
const SCENARIO: Scenario = { kind: "setpoint-step", horizon: 20, dt: 0.02 };
const CRITERIA: CriterionId[] = ["iae", "ise", "itae", "effort", "overshoot", "settlingTime"];

describe("evaluateBatch", () => {
  it("evaluateBatch equals evaluateCandidate candidate by candidate, variant by variant", () => {
    // Reference: evaluateCandidate itself (the batch is a loop over it writing typed arrays).
    const candidates = latinHypercube(
      [
        { name: "kp", min: 0.2, max: 8, scale: "log" },
        { name: "ki", min: 0, max: 2 },
        { name: "kd", min: 0, max: 3 },
      ],
      24,
      99,
    );
    const { status, scores } = evaluateBatch(FAMILY, STRUCTURE, candidates, SCENARIO, CRITERIA);
    const nf = FAMILY.length;
    const nc = CRITERIA.length;
    expect(status.length).toBe(24 * nf);
    expect(scores.length).toBe(24 * nf * nc);
    const seen = new Set<number>();
    for (let i = 0; i < 24; i++) {
      const controller = controllerFromVector(STRUCTURE, candidates, i * 3);
      for (let f = 0; f < nf; f++) {
        const expected = evaluateCandidate(FAMILY[f], controller, SCENARIO, CRITERIA, { poles: false });
        const row = i * nf + f;
        seen.add(status[row]);
        expect(BATCH_STATUSES[status[row]]).toBe(expected.status);
        for (let c = 0; c < nc; c++) {
          const got = scores[row * nc + c];
          const want = expected.scores === null ? NaN : expected.scores[CRITERIA[c]];
          // Same computation, so the same bits (NaN included).
          expect(Object.is(got, want)).toBe(true);
        }
      }
    }
    expect(seen.has(STATUS_STABLE)).toBe(true);
    expect(seen.has(STATUS_UNSTABLE)).toBe(true);
  });

  it("evaluateBatch marks a rejected controller invalid with NaN scores and carries on", () => {
    // kd ≠ 0 with kp = 0 has no ratio filter tf = kd/(n·kp): controllerFromVector gives tf = NaN.
    const candidates = Float64Array.of(0, 0.5, 1, 1, 0.5, 0);
    const out = { status: new Uint8Array(2), scores: new Float64Array(2 * 2) };
    evaluateBatch([FAMILY[0]], STRUCTURE, candidates, SCENARIO, ["iae", "ise"], { into: out });
    expect(Array.from(out.status)).toEqual([STATUS_INVALID, STATUS_STABLE]);
    expect(Number.isNaN(out.scores[0]) && Number.isNaN(out.scores[1])).toBe(true);
    expect(out.scores[2]).toBeGreaterThan(0);
  });

  it("evaluateBatch rejects bad arguments naming them", () => {
    expect(() => evaluateBatch([], STRUCTURE, new Float64Array(3), SCENARIO, ["iae"])).toThrow(/family/);
    expect(() => evaluateBatch(FAMILY, STRUCTURE, new Float64Array(4), SCENARIO, ["iae"])).toThrow(/candidates/);
    expect(() => evaluateBatch(FAMILY, STRUCTURE, new Float64Array(3), SCENARIO, ["nope" as CriterionId])).toThrow(/criteria/);
    expect(() =>
      evaluateBatch(FAMILY, STRUCTURE, new Float64Array(3), SCENARIO, ["iae"], { into: { status: new Uint8Array(1), scores: new Float64Array(1) } }),
    ).toThrow(/into/);
  });
});
