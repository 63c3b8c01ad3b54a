import { describe, expect, it } from "vitest";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { polynomialAdd } from "../../src/linear-algebra/polynomial-add.js";
import { evaluateLoop, type LoopTransferFunction } from "../../src/stability/evaluate-loop.js";
import { isHurwitz } from "../../src/stability/is-hurwitz.js";
import { nyquistStability } from "../../src/stability/nyquist-stability.js";
import { frequencyResponse } from "../../src/frequency/frequency-response.js";
import { expectClose } from "../support/expect-close.js";

/** Upper limit Ω of the numerical integral [rad/s] and Simpson panels on [0, Ω]. */
const OMEGA = 400;
const PANELS = 400_000;

/** ln|S(jω)| = −ln|1 + L(jω)|. */
function logSensitivity(loop: LoopTransferFunction, omega: number): number {
  const l = evaluateLoop(loop, omega);
  return -Math.log(Math.hypot(1 + l.re, l.im));
}

/**
 * ∫₀^∞ ln|S(jω)| dω: composite Simpson on [0, Ω] (h = 1e-3), plus the tail. For relative degree
 * ≥ 2, L(jω) ≈ −c/ω² for large ω, so ln|S| ≈ c/ω² and ∫_Ω^∞ ≈ c/Ω = Ω·ln|S(jΩ)|; the error of this
 * correction is O(Ω⁻³) for delay-free loops.
 */
function sensitivityIntegral(loop: LoopTransferFunction): number {
  const h = OMEGA / PANELS;
  let sum = logSensitivity(loop, 0) + logSensitivity(loop, OMEGA);
  for (let k = 1; k < PANELS; k++) sum += (k % 2 === 1 ? 4 : 2) * logSensitivity(loop, k * h);
  return (sum * h) / 3 + OMEGA * logSensitivity(loop, OMEGA);
}

describe("Bode's sensitivity integral", () => {
  it("∫₀^∞ ln|S(jω)| dω = π·Σ Re pᵢ over the open-loop right-half-plane poles (relative degree ≥ 2)", () => {
    // H. W. Bode, Network Analysis and Feedback Amplifier Design, 1945; J. S. Freudenberg and
    // D. P. Looze, "Right half plane poles and zeros and design tradeoffs in feedback systems",
    // IEEE TAC 30(6), 1985, Theorem 1: for a stable closed loop and relative degree ≥ 2, the integral
    // equals π times the sum of the real parts of the open-loop RHP poles (0 for a stable open loop).
    // Tolerance 1e-5 absolute: Simpson's error on h = 1e-3 is far below it; the tail correction's is O(Ω⁻³).
    const loops: LoopTransferFunction[] = [
      { num: [2], den: [1, 3, 2], delay: 0 }, // 2/((s + 1)(s + 2)), stable: 0
      { num: [4], den: [1, 3, 3, 1], delay: 0 }, // 4/(s + 1)³, K < 8 stable: 0
      { num: [6], den: [1, 1, -2], delay: 0 }, // 6/((s − 1)(s + 2)): s² + s + 4: π·1
      { num: [30, 60], den: [1, 4.5, -8.5, 3], delay: 0 }, // 30(s + 2)/((s − 1)(s − 0.5)(s + 6)): π·1.5
    ];
    for (const loop of loops) {
      expect(isHurwitz(polynomialAdd(loop.den, loop.num))).toBe(true);
      const rhp = polynomialRoots(loop.den).filter((p) => p.re > 0).reduce((acc, p) => acc + p.re, 0);
      expectClose(sensitivityIntegral(loop), Math.PI * rhp, 1e-5);
    }
  });

  it("holds with a dead time too, and |S| > 1 somewhere when the open loop is stable", () => {
    // Freudenberg & Looze 1985 cover a delay; L = 2e^(−0.2s)/((s + 1)(s + 2)) is stable in closed loop
    // (Nyquist verdict), open-loop stable ⇒ integral 0. With the delay ln|S| oscillates like cos(ωθ)/ω²
    // beyond Ω, so the tail correction is only O(1/(Ω²θ)): tolerance 1e-3.
    const loop = { num: [2], den: [1, 3, 2], delay: 0.2 };
    expect(nyquistStability(loop).stable).toBe(true);
    expectClose(sensitivityIntegral(loop), 0, 1e-3);
    // The area of sensitivity reduction must be paid back by |S| > 1 (the "waterbed"): Ms > 1.
    expect(frequencyResponse(loop).sensitivityPeak.value).toBeGreaterThan(1);
  });
});
