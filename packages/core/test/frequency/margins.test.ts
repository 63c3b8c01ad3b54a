import { describe, expect, it } from "vitest";
import { crossoverFrequency } from "../../src/criteria/crossover-frequency.js";
import { gainMargin } from "../../src/criteria/gain-margin.js";
import { phaseMargin } from "../../src/criteria/phase-margin.js";
import { expectClose } from "../support/expect-close.js";

describe("gainMargin, phaseMargin and crossoverFrequency of loops solved by hand", () => {
  it("gainMargin(K/(s + 1)³) = 8/K at the phase crossover ω = √3", () => {
    // Closed form: arg L = −3·atan ω = −180° ⇒ ω₁₈₀ = tan 60° = √3; |L(j√3)| = K/(1 + 3)^(3/2) = K/8.
    // K. J. Åström and T. Hägglund, Advanced PID Control, 2006, §4.2 (gain margin definition).
    for (const K of [0.5, 1, 2, 7.9]) {
      const loop = { num: [K], den: [1, 3, 3, 1], delay: 0 };
      expectClose(gainMargin(loop), 8 / K, 0, 1e-12);
    }
  });

  it("phaseMargin(1/(s(s + 1))) = 90° − atan ωc with ωc = √((√5 − 1)/2)", () => {
    // Closed form: |L(jω)| = 1/(ω√(1 + ω²)) = 1 ⇒ ω⁴ + ω² − 1 = 0 ⇒ ωc² = (√5 − 1)/2;
    // PM = 180° + arg L(jωc) = 180° − 90° − atan ωc ≈ 51.83°. No phase crossover (phase > −180°) ⇒ GM = ∞.
    const loop = { num: [1], den: [1, 1, 0], delay: 0 };
    const wc = Math.sqrt((Math.sqrt(5) - 1) / 2);
    expectClose(crossoverFrequency(loop), wc, 0, 1e-12);
    expectClose(phaseMargin(loop), 90 - (Math.atan(wc) * 180) / Math.PI, 1e-10);
    expect(gainMargin(loop)).toBe(Infinity);
  });

  it("margins of a pure dead-time loop k·e^(−θs): GM = 1/k, PM = 180° − ωcθ in degrees, ωc where |L| = 1 does not exist", () => {
    // Closed form: L = k/s·e^(−θs) ⇒ ωc = k; phase −90° − kθ (rad) ⇒ PM = 90° − kθ·180°/π;
    // phase crossover where ωθ = π/2 ⇒ GM = ω₁₈₀/k = π/(2kθ) (Åström & Hägglund 2006, §4.2 definitions).
    const k = 0.4;
    const theta = 1.5;
    const loop = { num: [k], den: [1, 0], delay: theta };
    expectClose(crossoverFrequency(loop), k, 0, 1e-12);
    expectClose(phaseMargin(loop), 90 - (k * theta * 180) / Math.PI, 1e-10);
    expectClose(gainMargin(loop), Math.PI / (2 * k * theta), 0, 1e-11);
  });

  it("takes the smallest margin over several crossovers and says Infinity when |L| never crosses 1", () => {
    // |L| = 0.5/|jω + 1| < 1 everywhere ⇒ no gain crossover: PM = ∞ (documented), ωc does not apply (NaN).
    const low = { num: [0.5], den: [1, 1], delay: 0 };
    expect(phaseMargin(low)).toBe(Infinity);
    expect(crossoverFrequency(low)).toBeNaN();
    // k·e^(−θs)/s crosses −180° at ωθ = π/2 + 2πm; the first has the largest |L| = k/ω, so GM = π/(2kθ) (closed form).
    const loop = { num: [0.1], den: [1, 0], delay: 2 };
    expectClose(gainMargin(loop), Math.PI / (2 * 0.1 * 2), 0, 1e-11);
    // With a biproper rational part the crossovers go on for ever and GM → 1/|D|:
    // L = 0.5·e^(−s) ⇒ L real negative at ω = π(2m + 1) with |L| = 0.5 ⇒ GM = 2 (closed form).
    expectClose(gainMargin({ num: [0.5], den: [1], delay: 1 }), 2, 0, 1e-12);
  });
});
