import { describe, expect, it } from "vitest";
import { frequencyResponse } from "../../src/frequency/frequency-response.js";
import { evaluateLoop, type LoopTransferFunction } from "../../src/stability/evaluate-loop.js";
import { nyquistStability } from "../../src/stability/nyquist-stability.js";

/** Brute force: max over 2,000,001 log-spaced points of 10⁻³ … 10³ rad/s (relative step 6.9e-6). */
function denseMaximum(loop: LoopTransferFunction, magnitude: (re: number, im: number) => number): number {
  let best = 0;
  const n = 2_000_000;
  for (let k = 0; k <= n; k++) {
    const l = evaluateLoop(loop, 10 ** (-3 + (6 * k) / n));
    best = Math.max(best, magnitude(l.re, l.im));
  }
  return best;
}

describe("peaks of loops with dead time", () => {
  it("Ms and Mt on the adaptive grid match a brute-force dense grid within 1e-6 relative, never below it", () => {
    // Reference: exhaustive evaluation (common practice). The dense grid's step of 6.9e-6 relative puts
    // its maximum within ~1e-10 of the true peak; the adaptive result must not miss a peak. |S(0)| is 0
    // with integral action and 1/(1 + L(0)) < the peaks here, so the dense grid covers Ms.
    const loops: LoopTransferFunction[] = [
      { num: [1.5, 0.15], den: [80, 24, 1, 0], delay: 1 }, // PI (kp 1, ki 0.1) on the Ember 800 plate
      { num: [0.5, 0.25], den: [1, 1, 0], delay: 1.2 }, // PI on 1/(s + 1) with a long dead time
      { num: [2], den: [1, 0.2, 4], delay: 0.05 }, // lightly damped plant ζ = 0.05, gain 0.5, short delay
      { num: [0.3, 0.6, 0.1], den: [0.05, 1.05, 1, 0], delay: 3 }, // filtered PID on 1/(s+1), θ = 3
    ];
    for (const loop of loops) {
      expect(nyquistStability(loop).stable).toBe(true);
      const r = frequencyResponse(loop);
      const sDense = denseMaximum(loop, (re, im) => 1 / Math.hypot(1 + re, im));
      // Plus the limit ω → 0: every loop here has integral action or none, T(0) = L(0)/(1 + L(0)) (1 with an integrator).
      const l0 = loop.den[loop.den.length - 1] === 0 ? Infinity : loop.num[loop.num.length - 1] / loop.den[loop.den.length - 1];
      const t0 = l0 === Infinity ? 1 : Math.abs(l0 / (1 + l0));
      const tDense = Math.max(t0, denseMaximum(loop, (re, im) => Math.hypot(re, im) / Math.hypot(1 + re, im)));
      expect(Math.abs(r.sensitivityPeak.value - sDense)).toBeLessThanOrEqual(1e-6 * sDense);
      expect(r.sensitivityPeak.value).toBeGreaterThanOrEqual(sDense * (1 - 1e-12));
      expect(Math.abs(r.complementaryPeak.value - tDense)).toBeLessThanOrEqual(1e-6 * tDense);
      expect(r.complementaryPeak.value).toBeGreaterThanOrEqual(tDense * (1 - 1e-12));
    }
  });
});
