import { describe, expect, it } from "vitest";
import { effort } from "../../src/criteria/effort.js";
import { iae } from "../../src/criteria/iae.js";
import { ise } from "../../src/criteria/ise.js";
import { itae } from "../../src/criteria/itae.js";
import { itse } from "../../src/criteria/itse.js";
import { quadratic, quadraticCriterion } from "../../src/criteria/quadratic.js";
import { rawEffort } from "../../src/criteria/raw-effort.js";
import { expectClose } from "../support/expect-close.js";
import { grid, traceFromSamples } from "./trace-from-samples.js";

/*
 * e(t) = e^(−t) on [0, T]; closed forms (integration by parts):
 *   IAE  = ∫ e^(−t) dt      = 1 − e^(−T)
 *   ISE  = ∫ e^(−2t) dt     = (1 − e^(−2T))/2
 *   ITAE = ∫ t·e^(−t) dt    = 1 − (1 + T)e^(−T)
 *   ITSE = ∫ t·e^(−2t) dt   = (1 − (1 + 2T)e^(−2T))/4
 * The composite trapezoid rule errs by h²/12·(f'(T) − f'(0)) + O(h⁴) (Euler–Maclaurin; e.g.
 * K. E. Atkinson, An Introduction to Numerical Analysis, 2nd ed., Wiley, 1989, §5.4), so halving
 * dt divides the error by 4.
 */
const T = 10;
const cases = [
  { name: "iae", f: iae, exact: 1 - Math.exp(-T), slope0: -1, slopeT: -Math.exp(-T) },
  { name: "ise", f: ise, exact: (1 - Math.exp(-2 * T)) / 2, slope0: -2, slopeT: -2 * Math.exp(-2 * T) },
  { name: "itae", f: itae, exact: 1 - (1 + T) * Math.exp(-T), slope0: 1, slopeT: (1 - T) * Math.exp(-T) },
  { name: "itse", f: itse, exact: (1 - (1 + 2 * T) * Math.exp(-2 * T)) / 4, slope0: 1, slopeT: (1 - 2 * T) * Math.exp(-2 * T) },
];

describe("integral criteria on e(t) = e^(−t)", () => {
  for (const { name, f, exact, slope0, slopeT } of cases) {
    it(`${name}(t, e) matches its closed form with the trapezoid's h²/12 error, shrinking 4× when dt halves`, () => {
      const error = (dt: number) => {
        const t = grid(Math.round(T / dt), dt);
        return f(t, t.map((v) => Math.exp(-v))) - exact;
      };
      const coarse = error(0.1);
      const fine = error(0.05);
      // Leading term of the error within 2 % (the O(h⁴) remainder is far smaller at h = 0.1).
      expectClose(coarse, (0.01 / 12) * (slopeT - slope0), 0, 0.02);
      expectClose(fine, (0.0025 / 12) * (slopeT - slope0), 0, 0.02);
      // O(dt²): ratio 4 within 2 %.
      expectClose(coarse / fine, 4, 0.08);
    });
  }

  it("itse(t, e) ignores the error at t = 0⁺ (its weight t is 0) and punishes late error", () => {
    // Definition ∫t·e²dt: a spike at t = 0 costs nothing; the same spike at t = 5 costs about 5·Δ.
    const t = grid(100, 0.1);
    const early = t.map((_, k) => (k === 0 ? 1 : 0));
    const late = t.map((_, k) => (k === 50 ? 1 : 0));
    expect(itse(t, early)).toBe(0);
    expectClose(itse(t, late), 5 * 0.1, 1e-12);
  });
});

describe("rawEffort and quadratic", () => {
  const dt = 0.01;
  const t = grid(2000, dt);
  const y = t.map((v) => 1 - Math.exp(-v));
  const u = t.map((v) => 0.5 + 2 * Math.exp(-v));
  const trace = traceFromSamples(t, y, { u, uInfinity: 0.5 });

  it("rawEffort(t, u) integrates u² from 0, growing with u∞²·T", () => {
    // Closed form: u = 0.5 + 2e^(−t) ⇒ ∫₀ᵀ u² = 0.25T + 2(1 − e^(−T)) + 2(1 − e^(−2T)); trapezoid error ≈ dt²/12·|(u²)'(0)| = 1e-4/12·10 ≈ 8.3e-5.
    const exact = 0.25 * 20 + 2 * (1 - Math.exp(-20)) + 2 * (1 - Math.exp(-40));
    expectClose(rawEffort(t, u), exact, 1e-4);
  });

  it("quadratic with q = 1, r = 0 equals ISE and with q = 0, r = 1 equals effort (definition J = q·ISE + r·Effort)", () => {
    expectClose(quadraticCriterion.compute(trace, { q: 1, r: 0 }), ise(t, trace.e), 1e-13, 1e-13);
    expectClose(quadraticCriterion.compute(trace, { q: 0, r: 1 }), effort(t, u, 0.5), 1e-13, 1e-13);
    // Defaults q = r = 1: the sum.
    expectClose(quadraticCriterion.compute(trace), ise(t, trace.e) + effort(t, u, 0.5), 1e-13, 1e-13);
    expectClose(quadratic(t, trace.e, u, 0.5, { q: 3, r: 0.25 }), 3 * ise(t, trace.e) + 0.25 * effort(t, u, 0.5), 1e-12, 1e-13);
  });

  it("quadratic needs u∞ only when r > 0, and refuses negative or non-finite weights naming them", () => {
    const noSteadyState = { ...trace, uInfinity: NaN };
    expect(quadraticCriterion.compute(noSteadyState)).toBeNaN();
    expectClose(quadraticCriterion.compute(noSteadyState, { q: 1, r: 0 }), ise(t, trace.e), 1e-13, 1e-13);
    expect(() => quadraticCriterion.compute(trace, { q: -1 })).toThrow(/^q must be a finite number ≥ 0/);
    expect(() => quadraticCriterion.compute(trace, { r: Number.POSITIVE_INFINITY })).toThrow(/^r must/);
    expect(() => quadratic(t, trace.e, u, NaN, { r: 1 })).toThrow(/uInfinity/);
  });
});
