import { describe, expect, it } from "vitest";
import { effort } from "../../src/criteria/effort.js";
import { iae } from "../../src/criteria/iae.js";
import { ise } from "../../src/criteria/ise.js";
import { itae } from "../../src/criteria/itae.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { CRITERION_IDS, type CriterionId } from "../../src/criteria/criterion-id.js";
import { sweepInputSchema } from "../../src/sweeps/sweep-input.js";
import { expectClose } from "../support/expect-close.js";
import { grid, traceFromSamples } from "./trace-from-samples.js";

/** The frequency-domain criteria (kind "frequency"): they read the loop, not a trace. */
const FREQUENCY_IDS = ["ms", "mt", "gainMargin", "phaseMargin", "crossoverFrequency", "bandwidth", "wsNorm"] as const;
const TIME_IDS = CRITERION_IDS.filter((id) => CRITERIA[id].kind === "time");

describe("criteria on given samples", () => {
  it("every criterion is 0 under perfect tracking with u∞ = 0", () => {
    // Invariant (common practice): y jumps to r at 0⁺ and stays, u ≡ u∞ = 0 (e.g. an integrating
    // plant) ⇒ no error, no input, no overshoot or undershoot; rise and settling happen at t[0] = 0.
    const t = grid(100, 0.1);
    const trace = traceFromSamples(t, new Float64Array(t.length).fill(1));
    // loadRecoveryTime does not apply without a load step (NaN); with one that moves nothing it is 0
    // (load-recovery-time.test.ts).
    for (const id of TIME_IDS) {
      if (id === "loadRecoveryTime") expect(CRITERIA[id].compute(trace), id).toBeNaN();
      else expect(CRITERIA[id].compute(trace), id).toBe(0);
    }
  });

  it("under perfect tracking with u∞ = 0.5, only the figures measured from u = 0 are non-zero", () => {
    // Definitions: upeak = max|u| = 0.5, rawEffort = ∫u² = 0.25·T (T = 10); the rest measure from u∞ or e.
    const t = grid(100, 0.1);
    const u = new Float64Array(t.length).fill(0.5);
    const trace = traceFromSamples(t, new Float64Array(t.length).fill(1), { u, uInfinity: 0.5 });
    for (const id of TIME_IDS) {
      if (id === "upeak") expect(CRITERIA[id].compute(trace)).toBe(0.5);
      else if (id === "rawEffort") expectClose(CRITERIA[id].compute(trace), 2.5, 1e-13);
      else if (id === "loadRecoveryTime") expect(CRITERIA[id].compute(trace), id).toBeNaN(); // no load step
      else expect(CRITERIA[id].compute(trace), id).toBe(0);
    }
  });

  it("iae, ise, itae integrate a constant error exactly", () => {
    // Closed form: e ≡ c on [0, T] ⇒ IAE = |c|T, ISE = c²T, ITAE = |c|T²/2 (trapezoid exact for linear integrands).
    const t = grid(50, 0.2);
    const e = new Float64Array(t.length).fill(-0.5);
    expectClose(iae(t, e), 5, 1e-13);
    expectClose(ise(t, e), 2.5, 1e-13);
    expectClose(itae(t, e), 25, 1e-12);
  });

  it("itae(t, e) weights late error by time", () => {
    // Same |e| mass early and late: ITAE is larger for the late one (definition ∫t|e|dt).
    const t = grid(100, 0.1);
    const early = t.map((v) => (v < 2 ? 1 : 0));
    const late = t.map((v) => (v > 8 ? 1 : 0));
    expectClose(iae(t, early), iae(t, late), 1e-12);
    expect(itae(t, late)).toBeGreaterThan(4 * itae(t, early));
  });

  it("effort(t, u, u∞) integrates (u − u∞)², converging at second order", () => {
    // Closed form: u = u∞ + e^(−t) ⇒ ∫₀^∞ (u − u∞)² dt = 1/2; trapezoid error ≈ dt²/12·(f'(T) − f'(0)) = dt²/6.
    const dt = 1e-3;
    const t = grid(40_000, dt);
    const u = t.map((v) => 2 + Math.exp(-v));
    expectClose(effort(t, u, 2), 0.5, (dt * dt) / 6 + 1e-12);
  });

  it("criteria name their parameter for mismatched lengths; effort names uInfinity", () => {
    expect(() => iae(grid(3, 1), new Float64Array(2))).toThrow(/^e/);
    expect(() => effort(grid(3, 1), new Float64Array(4), NaN)).toThrow(/uInfinity/);
  });

  it("CRITERIA lists every criterion id, time criteria then the frequency ones, keeping the first version's labels", () => {
    expect(Object.keys(CRITERIA).sort()).toEqual([...CRITERION_IDS].sort());
    for (const id of CRITERION_IDS) {
      expect(CRITERIA[id].id).toBe(id);
      expect(CRITERIA[id].kind).toBe((FREQUENCY_IDS as readonly string[]).includes(id) ? "frequency" : "time");
      expect(typeof CRITERIA[id].computeLoop).toBe(CRITERIA[id].kind === "frequency" ? "function" : "undefined");
    }
    expect(["iae", "ise", "itae", "effort"].map((id) => CRITERIA[id as CriterionId].label)).toEqual(["IAE", "ISE", "ITAE", "Effort ∫(u−u∞)²dt"]);
  });

  it("CRITERION_IDS holds the evaluate spec's ids plus quadratic, undershoot, steadyStateError, loadRecoveryTime and the frequency criteria", () => {
    // The `loopyard evaluate` criterion names of the Engine I issue, exactly, and Engine II's frequency ids.
    const specIds = ["iae", "ise", "itae", "itse", "effort", "rawEffort", "tv", "upeak", "overshoot", "riseTime", "settlingTime"];
    expect([...CRITERION_IDS].sort()).toEqual([...specIds, "quadratic", "undershoot", "steadyStateError", "loadRecoveryTime", ...FREQUENCY_IDS].sort());
  });

  it("the sweep schema accepts every id (wsNorm with its weight) and defaults to the first version's four", () => {
    const input = {
      name: "defaults",
      plantRevisionId: "7f0c7a3e-2b0a-4c1e-9b1a-3d5e6f708192",
      ranges: { kp: { min: 1, max: 1, count: 1 }, ki: { min: 0, max: 0, count: 1 }, kd: { min: 0, max: 0, count: 1 } },
      scenario: { horizon: 10, dt: 0.01 },
    };
    expect(sweepInputSchema.parse(input).criteria).toEqual(["iae", "ise", "itae", "effort"]);
    const weight = { preset: "performance", M: 2, omegaB: 0.5, A: 1e-4 };
    expect(sweepInputSchema.parse({ ...input, criteria: [...CRITERION_IDS], criterionOptions: { weight } }).criteria).toEqual([...CRITERION_IDS]);
  });
});
