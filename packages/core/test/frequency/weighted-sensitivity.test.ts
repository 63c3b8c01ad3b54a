import { describe, expect, it } from "vitest";
import { wsNorm } from "../../src/criteria/ws-norm.js";
import { performanceWeight } from "../../src/frequency/performance-weight.js";
import { evaluateLoop, type LoopTransferFunction } from "../../src/stability/evaluate-loop.js";
import { expectClose } from "../support/expect-close.js";

/** |W(jω)| of a rational weight. */
function weightMagnitude(w: { num: readonly number[]; den: readonly number[] }, omega: number): number {
  const v = evaluateLoop({ num: w.num, den: w.den, delay: 0 }, omega);
  return Math.hypot(v.re, v.im);
}

function sensitivityMagnitude(loop: LoopTransferFunction, omega: number): number {
  const l = evaluateLoop(loop, omega);
  return 1 / Math.hypot(1 + l.re, l.im);
}

/** 240,001 log-spaced frequencies over 10⁻⁸ … 10⁴ rad/s (far below the weight's corner ωB·A = 5e-4). */
const DENSE = Array.from({ length: 240_001 }, (_, k) => 10 ** (-8 + (12 * k) / 240_000));

describe("wsNorm(loop, weight)", () => {
  it("performanceWeight(M, ωB, A) = (s/M + ωB)/(s + ωB·A) bounds |S| by A at low and M at high frequency", () => {
    // Skogestad & Postlethwaite 2005, eq. (2.105): 1/|W(0)| = A, 1/|W(j∞)| = M.
    const w = performanceWeight({ M: 2, omegaB: 0.5, A: 1e-3 });
    expect(w).toEqual({ num: [0.5, 0.5], den: [1, 0.5e-3] });
    expectClose(1 / weightMagnitude(w, 0), 1e-3, 1e-15);
    expectClose(1 / weightMagnitude(w, 1e9), 2, 1e-6);
    expect(() => performanceWeight({ M: 0, omegaB: 1, A: 0 })).toThrow(/^M must/);
    expect(() => performanceWeight({ M: 2, omegaB: -1, A: 0 })).toThrow(/^omegaB must/);
    expect(() => performanceWeight({ M: 2, omegaB: 1, A: -1 })).toThrow(/^A must/);
  });

  it("equals max(ωB/k, 1/M) for L = k/s and the weight with A = 0", () => {
    // Closed form: S = s/(s + k), W = (s/M + ωB)/s ⇒ W·S = (s/M + ωB)/(s + k),
    // |W·S|² = (ω²/M² + ωB²)/(ω² + k²) is monotone between ωB²/k² (ω = 0) and 1/M² (ω → ∞).
    for (const [k, M, omegaB] of [[1, 2, 0.5], [1, 2, 3], [4, 1.5, 1]]) {
      expectClose(wsNorm({ num: [k], den: [1, 0], delay: 0 }, performanceWeight({ M, omegaB, A: 0 })), Math.max(omegaB / k, 1 / M), 0, 1e-6);
    }
  });

  it("‖W·S‖∞ < 1 exactly when |S| < 1/|W| at every frequency of a dense grid", () => {
    // Definition of the H∞ norm as the peak gain (Zhou, Doyle & Glover 1996, §4.3) and the reading of
    // the weight as a bound (Skogestad & Postlethwaite 2005, §2.8.2): scaling W by 0.99/ν gives a norm
    // of 0.99 and |S| under 1/|W| everywhere; scaling by 1.01/ν gives 1.01 and |S| above 1/|W| somewhere.
    const loops: LoopTransferFunction[] = [
      { num: [2, 1], den: [10, 1, 0], delay: 0.5 }, // PI on an integrating plant with dead time
      { num: [1.5, 0.15], den: [80, 24, 1, 0], delay: 1 }, // PI (kp 1, ki 0.1) on the Ember 800 plate 1.5e^(−s)/((20s + 1)(4s + 1))
      { num: [4], den: [1, 3, 3, 1], delay: 0 },
    ];
    for (const loop of loops) {
      const base = performanceWeight({ M: 2, omegaB: 0.05, A: 1e-2 });
      const nu = wsNorm(loop, base);
      for (const [factor, below] of [[0.99, true], [1.01, false]] as const) {
        const scaled = { num: base.num.map((c) => (c * factor) / nu), den: base.den };
        expectClose(wsNorm(loop, scaled), factor, 0, 1e-9);
        let margin = Infinity;
        for (const w of DENSE) margin = Math.min(margin, 1 / weightMagnitude(scaled, w) - sensitivityMagnitude(loop, w));
        if (below) expect(margin).toBeGreaterThan(0);
        else expect(margin).toBeLessThan(0);
      }
    }
  });

  it("names the missing or bad weight", () => {
    const loop = { num: [1], den: [1, 1, 0], delay: 0 };
    expect(() => wsNorm(loop, undefined)).toThrow(/^weight: wsNorm needs a sensitivity weight/);
    expect(() => wsNorm(loop, { num: [1], den: [0] })).toThrow(/^weight\.den/);
  });
});
