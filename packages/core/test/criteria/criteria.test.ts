import { describe, expect, it } from "vitest";
import { effort } from "../../src/criteria/effort.js";
import { iae } from "../../src/criteria/iae.js";
import { ise } from "../../src/criteria/ise.js";
import { itae } from "../../src/criteria/itae.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { CRITERION_IDS } from "../../src/criteria/criterion-id.js";
import type { LoopTrace } from "../../src/simulation/loop-trace.js";
import { expectClose } from "../support/expect-close.js";

const grid = (n: number, dt: number) => Float64Array.from({ length: n + 1 }, (_, k) => k * dt);

describe("criteria on given samples", () => {
  it("every criterion is 0 under perfect tracking", () => {
    // Invariant (common practice): e ≡ 0 and u ≡ u∞ give zero cost.
    const t = grid(100, 0.1);
    const zero = new Float64Array(t.length);
    const trace: LoopTrace = { t, r: new Float64Array(t.length).fill(1), y: new Float64Array(t.length).fill(1), u: new Float64Array(t.length).fill(0.5), e: zero, uInfinity: 0.5, y0: 0, stepSize: 1, yInfinity: 1, status: "ok" };
    for (const id of CRITERION_IDS) expect(CRITERIA[id].compute(trace)).toBe(0);
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

  it("CRITERIA lists every criterion id with the brief's labels", () => {
    expect(Object.keys(CRITERIA).sort()).toEqual([...CRITERION_IDS].sort());
    expect(CRITERIA.effort.label).toBe("Effort ∫(u−u∞)²dt");
    expect(CRITERION_IDS.map((id) => CRITERIA[id].label)).toEqual(["IAE", "ISE", "ITAE", "Effort ∫(u−u∞)²dt"]);
  });
});
