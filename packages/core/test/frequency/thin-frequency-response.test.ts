import { describe, expect, it } from "vitest";
import { frequencyResponse } from "../../src/frequency/frequency-response.js";
import { MAX_FREQUENCY_POINTS, thinFrequencyResponse } from "../../src/frequency/thin-frequency-response.js";

// L(s) = ωn²/(s(s + 2ζωn)) closes to T(s) = ωn²/(s² + 2ζωn·s + ωn²), whose peak for ζ < 1/√2 is
// Mt = 1/(2ζ√(1 − ζ²)) at ω = ωn√(1 − 2ζ²) (closed form, second-order system).
const WN = 2;
const ZETA = 0.2;
const loop = { num: [WN * WN], den: [1, 2 * ZETA * WN, 0], delay: 0 };

describe("thinFrequencyResponse", () => {
  it("thinFrequencyResponse keeps at most MAX_FREQUENCY_POINTS + 3 increasing frequencies and the true peaks of |S| and |T|", () => {
    const response = frequencyResponse(loop);
    const thin = thinFrequencyResponse(response);
    expect(thin.omega.length).toBeLessThanOrEqual(MAX_FREQUENCY_POINTS + 3);
    for (let i = 1; i < thin.omega.length; i++) expect(thin.omega[i]!).toBeGreaterThan(thin.omega[i - 1]!);
    // The peaks of the full grid survive the thinning exactly (the plotted maxima are Ms and Mt).
    const full = (c: { re: Float64Array; im: Float64Array }) => Math.max(...Array.from(c.re, (re, i) => Math.hypot(re, c.im[i]!)));
    expect(Math.max(...thin.T)).toBe(full(response.T));
    expect(Math.max(...thin.S)).toBe(full(response.S));
    // And Mt is the closed form within the grid's resolution.
    const mt = 1 / (2 * ZETA * Math.sqrt(1 - ZETA * ZETA));
    expect(Math.abs(Math.max(...thin.T) - mt) / mt).toBeLessThan(1e-3);
    // |S| + |T| ≥ 1 everywhere (S + T = 1, triangle inequality).
    thin.S.forEach((s, i) => expect(s + thin.T[i]!).toBeGreaterThanOrEqual(1 - 1e-12));
    expect(thin.invW).toBeUndefined();
  });

  it("thinFrequencyResponse ends one decade above where |L| falls below the plotting tail gain", () => {
    const thin = thinFrequencyResponse(frequencyResponse(loop));
    // |L(jω)| ≈ ωn²/ω² at high frequency: 1e-4 at ω = 100·ωn = 200 rad/s, so the band ends near 2000 rad/s.
    const last = thin.omega[thin.omega.length - 1]!;
    expect(last).toBeGreaterThan(200);
    expect(last).toBeLessThanOrEqual(2000 * 1.0001);
  });

  it("thinFrequencyResponse refuses fewer than two points", () => {
    expect(() => thinFrequencyResponse(frequencyResponse(loop), 1)).toThrow(RangeError);
  });
});
