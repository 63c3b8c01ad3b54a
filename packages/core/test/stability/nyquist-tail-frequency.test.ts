import { describe, expect, it } from "vitest";
import { loopValueAt } from "../../src/stability/evaluate-loop.js";
import { TAIL_GAIN, nyquistTailFrequency } from "../../src/stability/nyquist-tail-frequency.js";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";

/** Largest distance |1 + L(s) − c| / |c| over sample points with |s| ≥ R in the closed right half-plane. */
function worstOffset(num: number[], den: number[], delay: number, radius: number, centre: number): number {
  let worst = 0;
  for (const scale of [1, 1.5, 3, 10, 100]) {
    for (let i = 0; i <= 40; i++) {
      const phi = -Math.PI / 2 + (Math.PI * i) / 40;
      const r = radius * scale;
      const l = loopValueAt(num, den, delay, r * Math.cos(phi), r * Math.sin(phi));
      worst = Math.max(worst, Math.hypot(1 + l.re - centre, l.im) / Math.abs(centre));
    }
  }
  return worst;
}

describe("nyquistTailFrequency", () => {
  it("nyquistTailFrequency gives an ω_max beyond which 1 + L stays in its disc on the arc and the axis", () => {
    // The bound |num/den − D| ≤ Σ|r_k|R^k/(|a₀|(R − ρ)^n) (triangle inequality) holds for every |s| ≥ R;
    // checked here on sample points of the closed right half-plane.
    const cases: [number[], number[], number][] = [
      [[2.26], [1, 1], 1],
      [[1.1], [1, 1, 0], 1],
      [[5, 1], [1, 0.2, 4], 0],
      [[0.4, 0.8], [1, 1], 1],
      [[-2, -6], [1, 1], 0],
      [[3, 0, 1], [1, 2, 2, 1], 0],
    ];
    for (const [num, den, delay] of cases) {
      const rho = Math.max(...polynomialRoots(den).map((p) => Math.hypot(p.re, p.im)));
      const tail = nyquistTailFrequency(num, den, delay, rho);
      expect(tail).not.toBeNull();
      expect(tail!.omegaMax).toBeGreaterThan(rho);
      // Disc radius relative to |c|: TAIL_GAIN without delay; |D| + TAIL_GAIN(1 − |D|) < 1 with delay.
      const d = num.length === den.length ? Math.abs(num[0] / den[0]) : 0;
      const allowed = delay > 0 ? d + TAIL_GAIN * (1 - d) : TAIL_GAIN;
      expect(worstOffset(num, den, delay, tail!.omegaMax, tail!.centre)).toBeLessThanOrEqual(allowed);
    }
  });
});
