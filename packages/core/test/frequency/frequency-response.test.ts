import { describe, expect, it } from "vitest";
import { frequencyResponse, MAX_POINTS } from "../../src/frequency/frequency-response.js";
import { expectClose } from "../support/expect-close.js";

describe("frequencyResponse(loop)", () => {
  it("gives |S| and |T| of L = k/s by hand on every grid point, with ωc = ωB = k", () => {
    // Closed form: L = k/s ⇒ S = s/(s + k), T = k/(s + k); |S(jω)| = ω/√(ω² + k²), |T(jω)| = k/√(ω² + k²).
    // |L| = 1 and |S| = 1/√2 both at ω = k (Skogestad & Postlethwaite 2005, §2.4.5: ωB = ωc for this loop).
    const k = 2.5;
    const r = frequencyResponse({ num: [k], den: [1, 0], delay: 0 });
    expect(r.omega.length).toBeGreaterThan(100);
    for (let i = 0; i < r.omega.length; i++) {
      const w = r.omega[i];
      expectClose(Math.hypot(r.S.re[i], r.S.im[i]), w / Math.hypot(w, k), 1e-15, 1e-13);
      expectClose(Math.hypot(r.T.re[i], r.T.im[i]), k / Math.hypot(w, k), 1e-15, 1e-13);
      // T = 1 − S (definition).
      expectClose(r.S.re[i] + r.T.re[i], 1, 1e-14);
      expectClose(r.S.im[i] + r.T.im[i], 0, 1e-14);
    }
    expect(r.gainCrossovers).toHaveLength(1);
    expectClose(r.gainCrossovers[0], k, 0, 1e-12);
    expectClose(r.bandwidth, k, 0, 1e-12);
    // |S| rises monotonically to its limit 1 (strictly proper loop); |T| peaks at 1 as ω → 0.
    expect(r.sensitivityPeak.value).toBe(1);
    expect(r.phaseCrossovers).toEqual([]);
  });

  it("gives |S| of L = 1/(s + 1) at chosen frequencies by hand", () => {
    // Closed form: S = (s + 1)/(s + 2) ⇒ |S(jω)|² = (ω² + 1)/(ω² + 4); |S(j0)| = 1/2, |S(j2)| = √(5/8).
    const r = frequencyResponse({ num: [1], den: [1, 1], delay: 0 });
    for (let i = 0; i < r.omega.length; i++) {
      const w = r.omega[i];
      expectClose(Math.hypot(r.S.re[i], r.S.im[i]), Math.sqrt((w * w + 1) / (w * w + 4)), 1e-15, 1e-13);
    }
    // |L| = 1/√(1 + ω²) < 1 for ω > 0: no gain crossover; no phase crossover (phase > −90°).
    expect(r.gainCrossovers).toEqual([]);
    expect(r.phaseCrossovers).toEqual([]);
    // |S| first reaches 1/√2 where (ω² + 1)/(ω² + 4) = 1/2 ⇒ ω = √2.
    expectClose(r.bandwidth, Math.SQRT2, 0, 1e-12);
  });

  it("finds the resonance peak Mt = 1/(2ζ√(1 − ζ²)) of the second-order prototype at ωr = ωn√(1 − 2ζ²)", () => {
    // L = ωn²/(s(s + 2ζωn)) ⇒ T = ωn²/(s² + 2ζωn s + ωn²); resonant peak and frequency for ζ < 1/√2:
    // K. Ogata, Modern Control Engineering, 5th ed., 2010, ch. 7 (resonant peak Mr, frequency ωr).
    for (const [zeta, wn] of [[0.05, 1], [0.2, 3], [0.4, 0.02], [0.6, 50], [0.7, 1]]) {
      const r = frequencyResponse({ num: [wn * wn], den: [1, 2 * zeta * wn, 0], delay: 0 });
      expectClose(r.complementaryPeak.value, 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta)), 0, 1e-12);
      // The frequency of a flat maximum is found to about √(tolerance): 1e-6 relative.
      expectClose(r.complementaryPeak.omega, wn * Math.sqrt(1 - 2 * zeta * zeta), 0, 1e-6);
      expect(Array.from(r.omega)).toContain(r.complementaryPeak.omega);
    }
  });

  it("takes a biproper loop's high-frequency limit into the peaks", () => {
    // Closed form: L = 0.5(s + 2)/(s + 1) ⇒ S = (s + 1)/(1.5s + 2), |S|² = (ω² + 1)/(2.25ω² + 4) rises
    // from 1/2 to its limit 1/(1 + 0.5) = 2/3, so Ms is the limit, reached at ω = ∞.
    const r = frequencyResponse({ num: [0.5, 1], den: [1, 1], delay: 0 });
    expect(r.sensitivityPeak).toEqual({ omega: Infinity, value: 1 / 1.5 });
    expect(r.highFrequencyGain).toBe(0.5);
    // L = 0.5(s + 1)/(s + 2) ⇒ S = (s + 2)/(1.5s + 2.5): |S| falls from 0.8 at ω = 0 to 2/3, so Ms = 0.8 at ω = 0.
    const falling = frequencyResponse({ num: [0.5, 0.5], den: [1, 2], delay: 0 });
    expect(falling.sensitivityPeak.omega).toBe(0);
    expectClose(falling.sensitivityPeak.value, 0.8, 0, 1e-15);
    // An integrator gives T(0) = 1; L = 1/(s(s + 2)) ⇒ T = 1/(s + 1)², |T| falls from 1, so Mt = 1 (closed form).
    const integrating = frequencyResponse({ num: [1], den: [1, 2, 0], delay: 0 });
    expect(integrating.complementaryPeak.value).toBe(1);
    // With dead time, e^(−jωθ) turns the limit 0.5 through every phase: sup |S| = 1/(1 − 0.5) = 2.
    const delayed = frequencyResponse({ num: [0.5, 0.5], den: [1, 2], delay: 1 });
    expect(delayed.sensitivityPeak.value).toBeGreaterThanOrEqual(2);
    expect(delayed.omega.length).toBeLessThan(MAX_POINTS);
  });

  it("returns a weight's magnitude and the weighted peak when a weight is given", () => {
    // W = 2 (constant) ⇒ ‖W·S‖∞ = 2·Ms (definition).
    const loop = { num: [4], den: [1, 3, 3, 1], delay: 0 };
    const r = frequencyResponse(loop, { weight: { num: [2], den: [1] } });
    expectClose(r.weightedPeak!.value, 2 * r.sensitivityPeak.value, 0, 1e-12);
    expect(Array.from(r.weightMagnitude!)).toEqual(Array.from(r.omega, () => 2));
  });

  it("names the bad field of a bad loop or weight", () => {
    expect(() => frequencyResponse({ num: [1, 0, 0], den: [1, 1], delay: 0 })).toThrow(/^loop\.num: the loop must be proper/);
    expect(() => frequencyResponse({ num: [1], den: [0, 0], delay: 0 })).toThrow(/^loop\.den/);
    expect(() => frequencyResponse({ num: [1], den: [1, 1], delay: -1 })).toThrow(/^loop\.delay/);
    expect(() => frequencyResponse({ num: [Number.NaN], den: [1, 1], delay: 0 })).toThrow(/^loop\.num\[0\]/);
    expect(() => frequencyResponse({ num: [1], den: [1, 1], delay: 0 }, { weight: { num: [1, 0], den: [1] } })).toThrow(/^weight\.num: the weight must be proper/);
  });
});
