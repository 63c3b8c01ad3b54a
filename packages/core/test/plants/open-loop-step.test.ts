import { describe, expect, it } from "vitest";
import { openLoopStep } from "../../src/plants/open-loop-step.js";
import type { NonlinearPlant } from "../../src/plants/nonlinear.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { expectClose } from "../support/expect-close.js";

const tf = (num: number[], den: number[], delay = 0): TransferFunctionPlant => ({ kind: "transfer-function", num, den, delay });

describe("openLoopStep", () => {
  it("openLoopStep of 1/(τs + 1) is 1 − e^(−t/τ)", () => {
    // Closed form: τy' + y = 1, y(0) = 0 ⇒ y = 1 − e^(−t/τ).
    const tau = 2.5;
    const { t, y } = openLoopStep(tf([1], [tau, 1]), 20, 0.1);
    expect(t).toHaveLength(201);
    for (let k = 0; k < t.length; k++) expectClose(y[k], 1 - Math.exp(-t[k] / tau), 1e-13);
  });

  it("openLoopStep of 1/((s + 1)(s + 2)) follows its partial fractions", () => {
    // Closed form: Y = 1/(s(s + 1)(s + 2)) ⇒ y = 1/2 − e^(−t) + e^(−2t)/2.
    const { t, y } = openLoopStep(tf([1], [1, 3, 2]), 10, 0.05);
    for (let k = 0; k < t.length; k++) expectClose(y[k], 0.5 - Math.exp(-t[k]) + Math.exp(-2 * t[k]) / 2, 1e-13);
  });

  it("openLoopStep of (s + 2)/(s + 1) jumps to D = 1 at t = 0⁺", () => {
    // Closed form: (s + 2)/(s + 1) = 1 + 1/(s + 1) ⇒ y = 1 + (1 − e^(−t)) = 2 − e^(−t).
    const { t, y } = openLoopStep(tf([1, 2], [1, 1]), 5, 0.1);
    for (let k = 0; k < t.length; k++) expectClose(y[k], 2 - Math.exp(-t[k]), 1e-13);
  });

  it("openLoopStep delays the response by a dead time that is not a multiple of dt", () => {
    // Closed form: e^(−θs)/(τs + 1) ⇒ y = 0 for t < θ, 1 − e^(−(t−θ)/τ) for t ≥ θ.
    const [theta, tau] = [0.35, 1.5];
    const { t, y } = openLoopStep(tf([1], [tau, 1], theta), 10, 0.1);
    for (let k = 0; k < t.length; k++) {
      const expected = t[k] < theta ? 0 : 1 - Math.exp(-(t[k] - theta) / tau);
      expectClose(y[k], expected, 1e-13);
    }
  });

  it("openLoopStep of a nonlinear plant passes its actuator's saturation: x' = −x + u with u ≤ 0.5 gives 0.5(1 − e^(−t))", () => {
    // Closed form: the demand u_op + 1 = 1 is saturated to 0.5, so x' = −x + 0.5 from 0.
    const plant: NonlinearPlant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + u"], output: "x", initial: [0], actuator: { max: 0.5 } };
    const { t, y } = openLoopStep(plant, 5, 0.1);
    for (let k = 0; k < t.length; k++) expectClose(y[k], 0.5 * (1 - Math.exp(-t[k])), 1e-7);
  });

  it("openLoopStep of a nonlinear plant passes its actuator's rate limit: the input ramps at 0.4/s to 1", () => {
    // Closed form: x' = −x + u with u = R·t (R = 0.4) until t_r = 2.5 s (not on the grid of 0.3 s), then 1:
    // x = R(t − 1 + e^(−t)) for t ≤ t_r; after it x = 1 + (x(t_r) − 1)·e^(−(t − t_r)).
    const R = 0.4;
    const plant: NonlinearPlant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + u"], output: "x", initial: [0], actuator: { rate: R } };
    const { t, y } = openLoopStep(plant, 8, 0.3);
    const tr = 1 / R;
    const xr = R * (tr - 1 + Math.exp(-tr));
    for (let k = 0; k < t.length; k++) {
      const expected = t[k] <= tr ? R * (t[k] - 1 + Math.exp(-t[k])) : 1 + (xr - 1) * Math.exp(-(t[k] - tr));
      expectClose(y[k], expected, 1e-7);
    }
  });

  it("openLoopStep names dt when the grid would be too fine", () => {
    expect(() => openLoopStep(tf([1], [1, 1]), 10, 0)).toThrow(/dt/);
    expect(() => openLoopStep(tf([1], [1, 1]), 1e5, 1e-4)).toThrow(/dt/);
    expect(() => openLoopStep(tf([1], [1, 1]), -1, 0.1)).toThrow(/horizon/);
  });
});
