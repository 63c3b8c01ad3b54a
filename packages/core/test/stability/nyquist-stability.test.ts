import { describe, expect, it } from "vitest";
import { polynomialAdd } from "../../src/linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../../src/linear-algebra/polynomial-multiply.js";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { padeDelay } from "../../src/plants/pade-delay.js";
import { closedLoopPoles } from "../../src/simulation/closed-loop-poles.js";
import { isStable } from "../../src/simulation/is-stable.js";
import { nyquistStability } from "../../src/stability/nyquist-stability.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

/** Root of a continuous increasing function g on [lo, hi] by bisection (independent of the code under test). */
function bisect(g: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe("nyquistStability with dead time", () => {
  // Closed form: L = K e^(−s)/(s + 1) has arg L(jω) = −ω − atan ω, which reaches −π where
  // ω_u + atan ω_u = π (equivalently ω_u = tan(π − ω_u)); |L(jω_u)| = 1 gives the ultimate gain
  // K_u = √(1 + ω_u²). The closed loop is stable iff 0 ≤ K < K_u (Nyquist 1932; Åström & Murray 2008 §9.2).
  const omegaU = bisect((w) => w + Math.atan(w) - Math.PI, 0, Math.PI);
  const kU = Math.sqrt(1 + omegaU * omegaU);

  it("the ultimate point of e^(−s)/(s + 1) is ω_u ≈ 2.0288 rad/s, K_u = √(1 + ω_u²) ≈ 2.2618", () => {
    expectClose(omegaU, 2.0288, 5e-5);
    expectClose(kU, 2.2618, 5e-5);
  });

  it("nyquistStability(K e^(−s)/(s + 1)) is stable at 0.98·K_u and has two right-half-plane poles at 1.02·K_u", () => {
    expect(nyquistStability({ num: [0.98 * kU], den: [1, 1], delay: 1 })).toEqual({ stable: true, encirclements: 0, openLoopRhpPoles: 0 });
    // Just past K_u one complex pair has crossed at ±jω_u: Z = 2.
    const beyond = nyquistStability({ num: [1.02 * kU], den: [1, 1], delay: 1 });
    expect(beyond.stable).toBe(false);
    expect(beyond.encirclements).toBe(2);
    expect(beyond.openLoopRhpPoles).toBe(0);
  });

  it("nyquistStability(K e^(−s)/(s(s + 1))) flips at the K_u of the phase condition, with the integrator indented", () => {
    // Closed form: arg L(jω) = −π/2 − atan ω − ω = −π ⇔ ω_u + atan ω_u = π/2, and |L(jω_u)| = 1 ⇔
    // K_u = ω_u √(1 + ω_u²) (Åström & Murray 2008 §9.2; derivation as above).
    const w = bisect((x) => x + Math.atan(x) - Math.PI / 2, 0, Math.PI / 2);
    const ku = w * Math.sqrt(1 + w * w);
    expectClose(w, 0.8603, 5e-5);
    expectClose(ku, 1.1349, 5e-5);
    expect(nyquistStability({ num: [0.98 * ku], den: [1, 1, 0], delay: 1 })).toEqual({ stable: true, encirclements: 0, openLoopRhpPoles: 0 });
    const beyond = nyquistStability({ num: [1.02 * ku], den: [1, 1, 0], delay: 1 });
    expect(beyond.stable).toBe(false);
    expect(beyond.encirclements).toBe(2);
  });

  it("nyquistStability(2e^(−θs)/(s − 1)) is stable (P = 1, N = −1) for θ = 0.2 and loses stability at θ_max = atan(√3)/√3", () => {
    // Closed form: at θ = 0 the closed-loop pole is s = 1 − 2 = −1. The roots cross the imaginary axis
    // only where |L(jω)| = 2/√(1 + ω²) = 1, i.e. ω = √3, with arg L = −θω − (π − atan ω) = −π (mod 2π),
    // i.e. θω = atan ω: θ_max = atan(√3)/√3 = π/(3√3) ≈ 0.6046 s. Stable for θ < θ_max.
    const thetaMax = Math.PI / (3 * Math.sqrt(3));
    expect(nyquistStability({ num: [2], den: [1, -1], delay: 0.2 })).toEqual({ stable: true, encirclements: -1, openLoopRhpPoles: 1 });
    expect(nyquistStability({ num: [2], den: [1, -1], delay: 0.98 * thetaMax }).stable).toBe(true);
    const beyond = nyquistStability({ num: [2], den: [1, -1], delay: 1.02 * thetaMax });
    expect(beyond.stable).toBe(false);
    expect(beyond.openLoopRhpPoles).toBe(1);
    expect(beyond.encirclements).toBe(1); // Z = N + P = 2: the pair that crossed at ±j√3
  });

  it("nyquistStability agrees with a high-order Padé model on 300 random loops with dead time", () => {
    // Independent check: e^(−θs) ≈ [10/10] Padé approximant (Baker & Graves-Morris 1996 §1.2), whose
    // phase error is negligible while ωθ ≲ 10; the right-half-plane roots of den·q(θs) + num·q(−θs)
    // must number Z = N + P. Plants: 1…4 real poles (a fifth of them unstable), a fifth with an
    // integrator, gain 0.1…3, θ = 0.05…1.55 s; draws with a root within 0.02 of the axis are skipped.
    const rand = seededRandom(7);
    let checked = 0;
    let unstable = 0;
    while (checked < 300) {
      const degree = 1 + Math.floor(rand() * 4);
      let den = [1];
      for (let i = 0; i < degree; i++) den = polynomialMultiply(den, [1, (rand() < 0.8 ? 1 : -1) * (0.2 + 2 * rand())]);
      if (rand() < 0.2) den = polynomialMultiply(den, [1, 0]);
      const num = [10 ** (-1 + 1.5 * rand())];
      const delay = 0.05 + 1.5 * rand();
      const pade = padeDelay(delay, 10);
      const roots = polynomialRoots(polynomialAdd(polynomialMultiply(den, pade.den), polynomialMultiply(num, pade.num)));
      if (roots.some((p) => Math.abs(p.re) < 0.02)) continue;
      const rhp = roots.filter((p) => p.re > 0).length;
      const verdict = nyquistStability({ num, den, delay });
      expect(verdict.stable, `num = [${num}], den = [${den}], θ = ${delay}`).toBe(rhp === 0);
      expect(verdict.encirclements + verdict.openLoopRhpPoles, `num = [${num}], den = [${den}], θ = ${delay}`).toBe(rhp);
      checked++;
      if (rhp > 0) unstable++;
    }
    expect(unstable).toBeGreaterThan(50);
    expect(unstable).toBeLessThan(250);
  });

  it("nyquistStability reports a biproper loop with dead time and |D| ≥ 1 as neutral, not stable", () => {
    // L = 2e^(−s)(s + 1)/(s + 2): |L| → 2 at high frequency; 1 + L e^(−θs) = 0 has root chains
    // approaching Re s = ln 2/θ > 0 (Hale & Verduyn Lunel 1993 ch. 9).
    const verdict = nyquistStability({ num: [2, 2], den: [1, 2], delay: 1 });
    expect(verdict.stable).toBe(false);
    expect(verdict.reason).toMatch(/neutral/);
  });

  it("nyquistStability calls a biproper delayed loop with sup|L| < 1 stable (small gain)", () => {
    // L = 0.4(s + 2)/(s + 1)·e^(−s): |L(jω)| = 0.4√((4 + ω²)/(1 + ω²)) ≤ 0.8 < 1, so L cannot encircle −1
    // (Nyquist 1932); P = 0, hence stable.
    expect(nyquistStability({ num: [0.4, 0.8], den: [1, 1], delay: 1 })).toEqual({ stable: true, encirclements: 0, openLoopRhpPoles: 0 });
  });
});

describe("nyquistStability without dead time", () => {
  it("nyquistStability(K/(s − 1)) is stable for K = 2 with P = 1 and N = −1, unstable for K = 0.5", () => {
    // Closed form: 1 + K/(s − 1) = 0 ⇔ s = 1 − K.
    expect(nyquistStability({ num: [2], den: [1, -1], delay: 0 })).toEqual({ stable: true, encirclements: -1, openLoopRhpPoles: 1 });
    expect(nyquistStability({ num: [0.5], den: [1, -1], delay: 0 })).toMatchObject({ stable: false, encirclements: 0, openLoopRhpPoles: 1 });
  });

  it("nyquistStability finds closed-loop poles on the imaginary axis (marginal) and calls them not stable", () => {
    // Closed forms: 1/s² → s² + 1 (roots ±j); 1/(s² + 1) → s² + 2 (±j√2); 8/(s + 1)³ → (s + 3)(s² + 3).
    for (const loop of [
      { num: [1], den: [1, 0, 0], delay: 0 },
      { num: [1], den: [1, 0, 1], delay: 0 },
      { num: [8], den: [1, 3, 3, 1], delay: 0 },
    ]) {
      const verdict = nyquistStability(loop);
      expect(verdict.stable).toBe(false);
      expect(verdict.reason).toMatch(/imaginary axis/);
    }
  });

  it("nyquistStability indents double integrators and undamped pairs", () => {
    // Closed forms: (s + 1)/s² → s² + s + 1 (stable); (s + 1)/(s(s² + 1)) → s³ + 2s + 1 (no s² term: 2 RHP roots).
    expect(nyquistStability({ num: [1, 1], den: [1, 0, 0], delay: 0 })).toEqual({ stable: true, encirclements: 0, openLoopRhpPoles: 0 });
    const verdict = nyquistStability({ num: [1, 1], den: [1, 0, 1, 0], delay: 0 });
    expect(verdict).toMatchObject({ stable: false, encirclements: 2, openLoopRhpPoles: 0 });
  });

  it("nyquistStability handles biproper loops: −2(s + 3)/(s + 1) is stable, −(s + 2)/(s + 1) is ill-posed", () => {
    // Closed forms: 1 + L = (−s − 5)/(s + 1), root −5; and 1 + L = −1/(s + 1), which has no finite root —
    // the loop gain tends to −1, an ill-posed feedback loop.
    expect(nyquistStability({ num: [-2, -6], den: [1, 1], delay: 0 }).stable).toBe(true);
    expect(nyquistStability({ num: [-1, -2], den: [1, 1], delay: 0 }).reason).toMatch(/ill-posed/);
  });

  it("nyquistStability agrees with the closed-loop poles on 400 random delay-free loops", () => {
    // Independent check: the roots of den + num (closedLoopPoles with kp = 1) and isStable; Z = N + P
    // must equal the number of closed-loop poles in the right half-plane (Nyquist 1932).
    const rand = seededRandom(4242);
    let checked = 0;
    let stableCount = 0;
    let rhpOpenLoop = 0;
    let integrators = 0;
    while (checked < 400) {
      const degree = 1 + Math.floor(rand() * 6);
      let den = [1, ...Array.from({ length: degree }, () => -1 + 4 * rand())];
      const withIntegrator = rand() < 0.25;
      if (withIntegrator) den = polynomialMultiply(den, [1, 0]);
      const numDegree = Math.floor(rand() * (den.length - (rand() < 0.2 ? 0 : 1)));
      const gain = 10 ** (-1 + 2 * rand());
      const num = Array.from({ length: numDegree + 1 }, () => gain * (-1 + 3 * rand()));
      const openLoop = polynomialRoots(den);
      const closedLoop = closedLoopPoles({ kind: "transfer-function", num, den, delay: 0 }, { kind: "pid", kp: 1, ki: 0, kd: 0, tf: 0 });
      // Skip draws with poles near the imaginary axis (rounding decides there), except exact integrators.
      const nearAxis = (p: { re: number; im: number }) => Math.abs(p.re) < 1e-3 * Math.max(1, Math.hypot(p.re, p.im));
      if (closedLoop.some(nearAxis) || openLoop.some((p) => nearAxis(p) && !(p.re === 0 && p.im === 0))) continue;
      if (closedLoop.length !== den.length - 1) continue; // 1 + D = 0: ill-posed, covered above
      const verdict = nyquistStability({ num, den, delay: 0 });
      const rhpClosed = closedLoop.filter((p) => p.re > 0).length;
      expect(verdict.stable, `num = [${num}], den = [${den}]`).toBe(isStable(closedLoop));
      expect(verdict.encirclements + verdict.openLoopRhpPoles, `num = [${num}], den = [${den}]`).toBe(rhpClosed);
      checked++;
      if (verdict.stable) stableCount++;
      if (verdict.openLoopRhpPoles > 0) rhpOpenLoop++;
      if (withIntegrator) integrators++;
    }
    expect(stableCount).toBeGreaterThan(40);
    expect(rhpOpenLoop).toBeGreaterThan(100);
    expect(integrators).toBeGreaterThan(50);
  });
});

describe("nyquistStability on static loops and tiny gains", () => {
  it("nyquistStability decides static loops: L = D e^(−θs) is stable iff |D| < 1, L = D iff 1 + D ≠ 0", () => {
    // Closed forms: y(t) = −D·y(t − θ) + … is a difference equation, stable iff |D| < 1; without delay
    // the closed loop D/(1 + D) has no dynamics.
    expect(nyquistStability({ num: [0.5], den: [1], delay: 1 }).stable).toBe(true);
    expect(nyquistStability({ num: [-0.5], den: [1], delay: 1 }).stable).toBe(true);
    expect(nyquistStability({ num: [-1.5], den: [1], delay: 1 }).reason).toMatch(/neutral/);
    expect(nyquistStability({ num: [-3], den: [1], delay: 0 }).stable).toBe(true);
  });

  it("nyquistStability sees a closed-loop pole at +1e-9 next to an indented integrator (L = −1e-9/s)", () => {
    // Closed form: s − 1e-9 = 0. The indentation shrinks until |L| ≥ 10 on it, so the root stays outside it.
    expect(nyquistStability({ num: [-1e-9], den: [1, 0], delay: 0 })).toMatchObject({ stable: false, encirclements: 1 });
    expect(nyquistStability({ num: [1e-9], den: [1, 0], delay: 0 }).stable).toBe(true);
  });

  it("nyquistStability(1/s³) counts the two right-half-plane roots of s³ + 1", () => {
    // Closed form: s³ + 1 = (s + 1)(s² − s + 1), roots −1 and 0.5 ± 0.866j.
    expect(nyquistStability({ num: [1], den: [1, 0, 0, 0], delay: 0 })).toMatchObject({ stable: false, encirclements: 2, openLoopRhpPoles: 0 });
  });
});

describe("nyquistStability input handling", () => {
  it("nyquistStability names the bad field", () => {
    expect(() => nyquistStability({ num: [1, 0, 0], den: [1, 1], delay: 0 })).toThrow(/loop\.num/);
    expect(() => nyquistStability({ num: [1], den: [0], delay: 0 })).toThrow(/loop\.den/);
    expect(() => nyquistStability({ num: [1], den: [1, 1], delay: -1 })).toThrow(/loop\.delay/);
    expect(() => nyquistStability({ num: [Number.NaN], den: [1, 1], delay: 0 })).toThrow(/loop\.num\[0\]/);
  });

  it("nyquistStability calls a zero loop stable iff the open loop is", () => {
    // L = 0: the closed loop is the open loop (closed form).
    expect(nyquistStability({ num: [0], den: [1, 2], delay: 0 }).stable).toBe(true);
    expect(nyquistStability({ num: [0], den: [1, -2], delay: 0 })).toMatchObject({ stable: false, openLoopRhpPoles: 1 });
    expect(nyquistStability({ num: [], den: [1, 0], delay: 0.5 }).stable).toBe(false);
  });
});
