import { describe, expect, it } from "vitest";
import { seriesToIdeal, simcPi, simcPid } from "../../src/tuning/simc.js";
import { expectClose } from "../support/expect-close.js";

describe("simcPi", () => {
  it("simcPi on k = 1, τ = 1, θ = 0.2 gives Kc = 2.5, τI = 1 (default τc = θ)", () => {
    // Skogestad 2003, SIMC PI (Table 1, from memory): Kc = (1/k)·τ1/(τc + θ) = 1/(0.2 + 0.2) = 2.5;
    // τI = min(τ1, 4(τc + θ)) = min(1, 1.6) = 1. Parallel: kp = 2.5, ki = 2.5.
    const t = simcPi({ k: 1, tau: 1, theta: 0.2 });
    expectClose(t.tauC, 0.2, 1e-15);
    expectClose(t.ideal.K, 2.5, 1e-12);
    expectClose(t.ideal.Ti, 1, 1e-12);
    expectClose(t.controller.ki, 2.5, 1e-12);
    expect(t.controller.kd).toBe(0);
  });

  it("simcPi limits τI to 4(τc + θ) for a lag-dominant plant and scales Kc with 1/k", () => {
    // k = 2, τ1 = 20, θ = 1, τc = 1: Kc = 20/(2·2) = 5; τI = min(20, 8) = 8.
    const t = simcPi({ k: 2, tau: 20, theta: 1 });
    expectClose(t.ideal.K, 5, 1e-12);
    expectClose(t.ideal.Ti, 8, 1e-12);
  });

  it("simcPi takes τ1/10 for τc when the model has no dead time", () => {
    // θ = 0: τc = θ would give infinite gain; documented choice τc = τ1/10 = 0.5 ⇒ Kc = 5/0.5 = 10, τI = min(5, 2) = 2.
    const t = simcPi({ k: 1, tau: 5, theta: 0 });
    expectClose(t.tauC, 0.5, 1e-12);
    expectClose(t.ideal.K, 10, 1e-12);
    expectClose(t.ideal.Ti, 2, 1e-12);
  });
});

describe("simcPid", () => {
  it("simcPid on k = 1, τ1 = 1, τ2 = 0.5, θ = 0.2 gives the series form Kc = 2.5, τI = 1, τD = 0.5 and its ideal form", () => {
    // Skogestad 2003, SIMC PID for second-order plants (series form, τD = τ2): Kc = 1/(0.4) = 2.5, τI = min(1, 1.6) = 1.
    // Series → ideal (multiply out Kc(1 + 1/(τI s))(1 + τD s)): f = 1 + τD/τI = 1.5; K = 3.75, Ti = 1.5, Td = 1/3.
    const t = simcPid({ k: 1, tau1: 1, tau2: 0.5, theta: 0.2 });
    expect(t.series).toEqual({ Kc: expect.closeTo(2.5, 12), tauI: expect.closeTo(1, 12), tauD: expect.closeTo(0.5, 12) });
    expectClose(t.ideal.K, 3.75, 1e-12);
    expectClose(t.ideal.Ti, 1.5, 1e-12);
    expectClose(t.ideal.Td, 1 / 3, 1e-12);
    expectClose(t.controller.kd, 1.25, 1e-12);
    expectClose(t.controller.tf, 1 / 30, 1e-12);
  });

  it("seriesToIdeal keeps the controller's transfer function (invariant)", () => {
    // Kc(τI s + 1)(τD s + 1)/(τI s) = K(Ti·Td s² + Ti s + 1)/(Ti s) for every s: compare the s², s and 1 coefficients
    // of numerator/denominator-scaled forms: Kc·τD = K·Td, Kc(τI + τD)/τI = K, Kc/τI = K/Ti.
    const series = { Kc: 1.7, tauI: 3.2, tauD: 0.9 };
    const ideal = seriesToIdeal(series);
    expectClose(ideal.K * ideal.Td, series.Kc * series.tauD, 1e-12);
    expectClose(ideal.K, (series.Kc * (series.tauI + series.tauD)) / series.tauI, 1e-12);
    expectClose(ideal.K / ideal.Ti, series.Kc / series.tauI, 1e-12);
  });

  it("simcPid rejects a bad model with a RangeError naming the field", () => {
    expect(() => simcPid({ k: 1, tau1: 1, tau2: 2, theta: 0.1 })).toThrow(/model\.tau2/);
    expect(() => simcPi({ k: 0, tau: 1, theta: 0.1 })).toThrow(/model\.k/);
  });
});
