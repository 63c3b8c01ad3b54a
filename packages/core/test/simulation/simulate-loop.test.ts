import { describe, expect, it } from "vitest";
import type { PidController } from "../../src/controllers/pid.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { IllPosedLoopError } from "../../src/simulation/ill-posed-loop-error.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { steadyStateInput } from "../../src/simulation/steady-state-input.js";
import { expectClose } from "../support/expect-close.js";

const tf = (num: number[], den: number[], delay = 0): TransferFunctionPlant => ({ kind: "transfer-function", num, den, delay });
const p = (kp: number, ki = 0, kd = 0, tf = 0): PidController => ({ kind: "pid", kp, ki, kd, tf });
const step = (horizon: number, dt: number) => ({ kind: "setpoint-step", horizon, dt }) as const;

describe("simulateLoop", () => {
  it("u[0] holds u(0⁺) = kp + kd/tf for a PID on a strictly proper plant", () => {
    // From rest only the feedthrough acts at 0⁺: u = (kp + kd/tf)·e(0⁺), e(0⁺) = 1 (see simulateLoop).
    const trace = simulateLoop(tf([1], [1, 3, 3, 1]), p(2, 0.5, 0.3, 0.05), step(10, 0.01));
    expectClose(trace.u[0], 2 + 0.3 / 0.05, 1e-12);
    expect(trace.y[0]).toBe(0);
    expect(trace.e[0]).toBe(1);
    expect(trace.r[0]).toBe(1);
  });

  it("simulateLoop solves the algebraic loop when the plant has feedthrough", () => {
    // Closed form: G = (s + 2)/(s + 1), C = K ⇒ Y/R = K(s + 2)/((1 + K)s + 1 + 2K): first order with
    // y(0⁺) = K/(1 + K), y∞ = 2K/(1 + 2K), pole −b, b = (1 + 2K)/(1 + K); u = K(1 − y).
    const K = 1.5;
    const trace = simulateLoop(tf([1, 2], [1, 1]), p(K), step(8, 0.01));
    const [y0, yInf, b] = [K / (1 + K), (2 * K) / (1 + 2 * K), (1 + 2 * K) / (1 + K)];
    for (let k = 0; k < trace.t.length; k += 13) {
      expectClose(trace.y[k], yInf + (y0 - yInf) * Math.exp(-b * trace.t[k]), 1e-12);
      expectClose(trace.u[k], K * (1 - trace.y[k]), 1e-12);
    }
    expectClose(trace.u[0], K / (1 + K), 1e-15);
  });

  it("simulateLoop throws IllPosedLoopError when 1 + Dc·Dp = 0", () => {
    // G = −(s + 2)/(s + 1) has Dp = −1; C = 1 has Dc = 1 ⇒ 1 + Dc·Dp = 0.
    expect(() => simulateLoop(tf([-1, -2], [1, 1]), p(1), step(1, 0.01))).toThrow(IllPosedLoopError);
  });

  it("the integral action drives u to u∞ = 1/G(0)", () => {
    // Final value theorem: with integral action e∞ = 0, so u∞ = 1/G(0) = 1/2 for G = 2/(s + 1)³.
    const plant = tf([2], [1, 3, 3, 1]);
    const controller = p(0.5, 0.3, 0.4, 0.04);
    expectClose(steadyStateInput(plant, controller), 0.5, 1e-15);
    const trace = simulateLoop(plant, controller, step(120, 0.01));
    expectClose(trace.u[trace.u.length - 1], 0.5, 1e-6);
    expectClose(trace.e[trace.e.length - 1], 0, 1e-6);
  });

  it("steadyStateInput is kp/(1 + kp·G(0)) without integral action", () => {
    // Final value theorem on C/(1 + CG) with C(0) = kp (the filtered derivative vanishes at DC).
    expectClose(steadyStateInput(tf([2], [1, 1]), p(3, 0, 1, 0.1)), 3 / 7, 1e-15);
    // A pole at s = 0 in the plant: u∞ = 0.
    expect(steadyStateInput(tf([1], [1, 1, 0]), p(1, 0.2))).toBe(0);
  });

  it("with dead time, the first dead-time interval follows the method of steps", () => {
    // Closed form: G = e^(−θs)/(τs + 1), C = K. For t < θ, y = 0, so u = K; for θ ≤ t ≤ 2θ the plant
    // sees u = K from t − θ on: y = K(1 − e^(−(t−θ)/τ)). Sampled at dt, the P controller takes the grid
    // path; θ is a whole number of steps, so the delay line is exact and ZOH of a constant input is
    // exact (over [0, 2θ] the sampled and the continuous P controller give the same u = K; the
    // continuous path is checked against the method of steps in joint-loop.test.ts).
    const [theta, tau, K, dt] = [1, 2, 0.8, 0.01];
    const trace = simulateLoop(tf([1], [tau, 1], theta), { ...p(K), sampleTime: dt }, step(10, dt));
    const d = Math.round(theta / dt);
    for (let k = 0; k < d; k++) {
      expect(trace.y[k]).toBe(0);
      expect(trace.u[k]).toBe(K);
    }
    for (let k = d; k <= 2 * d; k++) expectClose(trace.y[k], K * (1 - Math.exp(-(trace.t[k] - theta) / tau)), 1e-12);
  });

  it("with dead time, u[0] holds u(0⁺) = kp + kd/tf as well", () => {
    // The plant output has not moved at 0⁺ (its input is still delayed), so e[0] = 1 and u[0] = D_c.
    const trace = simulateLoop(tf([1], [2, 1], 0.5), p(1.2, 0.3, 0.6, 0.06), step(5, 0.01));
    expectClose(trace.u[0], 1.2 + 0.6 / 0.06, 1e-12);
    expect(trace.y[0]).toBe(0);
  });

  it("with dead time and a stable P loop, y settles at K·G(0)/(1 + K·G(0))", () => {
    // Final value theorem: e^(−θ·0) = 1, so y∞ = K/(1 + K) for G(0) = 1.
    const trace = simulateLoop(tf([1], [1, 1], 1), p(1.5), step(200, 0.01));
    expectClose(trace.y[trace.y.length - 1], 0.6, 1e-6);
  });

  it("simulateLoop names the bad argument", () => {
    expect(() => simulateLoop(tf([1], [1, 1]), p(1, 0, 1, 0), step(1, 0.01))).toThrow(/tf/);
    expect(() => simulateLoop(tf([1], [1, 1]), p(1), step(1, 2))).toThrow(/dt/);
    expect(() => simulateLoop(tf([1], [0]), p(1), step(1, 0.1))).toThrow(/plant\.den/);
  });
});
