import { describe, expect, it } from "vitest";
import { amigoPi, amigoPid } from "../../src/tuning/amigo.js";
import { expectClose } from "../support/expect-close.js";

// Worked FOPDT example: Kp = 1, T = 1, L = 0.2 (formulas: Åström & Hägglund 2004; Advanced PID Control 2006, §7 —
// the constants are as we recall them, "from memory").
describe("amigoPi", () => {
  it("amigoPi on Kp = 1, T = 1, L = 0.2 gives K ≈ 1.20556, Ti ≈ 0.77652", () => {
    // K  = 0.15/Kp + (0.35 − LT/(L+T)²)·T/(Kp·L) = 0.15 + (0.35 − 0.2/1.44)·5 = 0.15 + 1.0555… = 1.205555…
    // Ti = 0.35L + 13LT²/(T² + 12LT + 7L²) = 0.07 + 2.6/3.68 = 0.07 + 0.7065217… = 0.7765217…
    const t = amigoPi({ k: 1, tau: 1, theta: 0.2 });
    expectClose(t.ideal.K, 0.15 + (0.35 - 0.2 / 1.44) * 5, 1e-12);
    expectClose(t.ideal.K, 1.2055556, 1e-7);
    expectClose(t.ideal.Ti, 0.07 + 2.6 / 3.68, 1e-12);
    expectClose(t.ideal.Ti, 0.7765217, 1e-7);
    expect(t.ideal.Td).toBe(0);
  });
});

describe("amigoPid", () => {
  it("amigoPid on Kp = 1, T = 1, L = 0.2 gives K = 2.45, Ti ≈ 0.58667, Td ≈ 0.09434", () => {
    // K  = (1/Kp)(0.2 + 0.45T/L) = 0.2 + 2.25 = 2.45
    // Ti = (0.4L + 0.8T)/(L + 0.1T)·L = 0.88/0.3·0.2 = 0.586666…
    // Td = 0.5LT/(0.3L + T) = 0.1/1.06 = 0.0943396…
    const t = amigoPid({ k: 1, tau: 1, theta: 0.2 });
    expectClose(t.ideal.K, 2.45, 1e-12);
    expectClose(t.ideal.Ti, 0.88 / 1.5, 1e-12);
    expectClose(t.ideal.Td, 0.1 / 1.06, 1e-12);
    expectClose(t.controller.ki, 2.45 / (0.88 / 1.5), 1e-12);
    expectClose(t.controller.kd, (2.45 * 0.1) / 1.06, 1e-12);
  });

  it("amigoPid gain scales with 1/Kp and the rule needs a dead time", () => {
    // K·Kp depends only on L and T: Kp = 4 ⇒ K = 2.45/4.
    expectClose(amigoPid({ k: 4, tau: 1, theta: 0.2 }).ideal.K, 2.45 / 4, 1e-12);
    expect(() => amigoPi({ k: 1, tau: 1, theta: 0 })).toThrow(/model\.theta/);
  });
});
