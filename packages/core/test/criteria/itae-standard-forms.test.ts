import { describe, expect, it } from "vitest";
import { itae } from "../../src/criteria/itae.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { nelderMead } from "../support/nelder-mead.js";

/*
 * D. Graham and R. C. Lathrop, "The synthesis of 'optimum' transient response: criteria and
 * standard forms", Trans. AIEE 72(5), 273–288, 1953: the closed loops ωⁿ/(sⁿ + … + ωⁿ) that minimise
 * ITAE after a unit step have denominators
 *   n = 2: s² + 1.4ωs + ω²   (ζ = 0.7)
 *   n = 3: s³ + 1.75ωs² + 2.15ω²s + ω³.
 * The optimum is flat, so the tests compare ITAE values at the published coefficients with the
 * minimum found here rather than forcing the coefficients.
 *
 * Realisation (closed form): the plant ωⁿ/(s·(sⁿ⁻¹ + … + aₙ₋₁ωⁿ⁻¹)) under P control kp = 1 in unity
 * feedback closes to exactly ωⁿ/(sⁿ + … + aₙ₋₁ωⁿ⁻¹s + ωⁿ). ω = 1; horizon 30 s, where the slowest
 * envelope near the optimum is below e^(−0.7·30) ≈ 1e-9, so the truncated tail is negligible;
 * dt = 0.01 s (simulateLoop is exact on the grid; the trapezoid adds O(dt²) ≈ 1e-5 relative).
 */
const P_CONTROL = { kind: "pid" as const, kp: 1, ki: 0, kd: 0, tf: 0 };
const SCENARIO = { kind: "setpoint-step" as const, horizon: 30, dt: 0.01 };

function closedLoopItae(den: number[]): number {
  const trace = simulateLoop({ kind: "transfer-function", num: [1], den, delay: 0 }, P_CONTROL, SCENARIO);
  return itae(trace.t, trace.e);
}

describe("ITAE standard forms (Graham & Lathrop 1953)", () => {
  it("minimising ITAE over ζ of ω²/(s² + 2ζωs + ω²) finds ζ ≈ 0.75; ITAE at ζ = 0.7 is within 3 % of that minimum", () => {
    const f = (zeta: number) => (zeta > 0 ? closedLoopItae([1, 2 * zeta, 0]) : Infinity);
    const best = nelderMead((x) => f(x[0]), [1], { step: 0.1, xTol: 1e-5 });
    const zetaFound = best.x[0];
    // Found here: ζ = 0.7527, min ITAE = 1.9518; ITAE(0.7) = 1.9896, 1.94 % above the minimum.
    expect(zetaFound).toBeGreaterThan(0.74);
    expect(zetaFound).toBeLessThan(0.765);
    const atPublished = f(0.7);
    expect(atPublished).toBeGreaterThanOrEqual(best.value);
    expect((atPublished - best.value) / best.value).toBeLessThan(0.03);
  });

  it("minimising ITAE over (a2, a1) of ω³/(s³ + a2ωs² + a1ω²s + ω³) lands within 5 % of (1.75, 2.15)", () => {
    // Routh–Hurwitz for a cubic with positive coefficients: stable iff a2·a1 > 1; outside, score ∞.
    const f = ([a2, a1]: readonly number[]) => (a2 > 0 && a1 > 0 && a2 * a1 > 1 ? closedLoopItae([1, a2, a1, 0]) : Infinity);
    const best = nelderMead(f, [1.5, 2.5], { step: 0.3, xTol: 1e-4, maxEvaluations: 400 });
    const [a2, a1] = best.x;
    // Found here: a2 = 1.783, a1 = 2.172 (1.9 % and 1.0 % from the table), ITAE 3.1382 vs 3.1432 at the table's values.
    expect(Math.abs(a2 - 1.75) / 1.75).toBeLessThan(0.05);
    expect(Math.abs(a1 - 2.15) / 2.15).toBeLessThan(0.05);
    expect(best.evaluations).toBeLessThan(400);
    const atPublished = f([1.75, 2.15]);
    expect((atPublished - best.value) / best.value).toBeLessThan(0.01);
  });
});
