import { describe, expect, it } from "vitest";
import { effort } from "../../src/criteria/effort.js";
import { iae } from "../../src/criteria/iae.js";
import { ise } from "../../src/criteria/ise.js";
import { itae } from "../../src/criteria/itae.js";
import type { PidController } from "../../src/controllers/pid.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

/*
 * Closed form (derived here): G = 1/(τs + 1) under P control C = K, unit setpoint step.
 * Closed loop Y/R = K/(τs + 1 + K) ⇒ e(t) = e∞ + (1 − e∞)·e^(−at), e∞ = 1/(1 + K), a = (1 + K)/τ,
 * i.e. e(t) = 1 − K/(1 + K)·(1 − e^(−(1+K)t/τ)). With c = K/(1 + K) = 1 − e∞ and e > 0 throughout:
 *   IAE(T)  = ∫₀ᵀ e dt  = e∞·T + c·(1 − e^(−aT))/a
 *   ISE(T)  = ∫₀ᵀ e² dt = e∞²·T + 2e∞·c·(1 − e^(−aT))/a + c²·(1 − e^(−2aT))/(2a)
 *   ITAE(T) = ∫₀ᵀ t·e dt = e∞·T²/2 + c·(1/a² − e^(−aT)·(T/a + 1/a²))
 * u = K·e, u∞ = K·e∞ ⇒ Effort(T) = ∫₀ᵀ (u − u∞)² dt = (K·c)²·(1 − e^(−2aT))/(2a).
 */
describe("simulateLoop on 1/(τs + 1) under P control", () => {
  const tau = 2;
  const K = 4;
  const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [tau, 1], delay: 0 };
  const controller: PidController = { kind: "pid", kp: K, ki: 0, kd: 0, tf: 0 };
  const T = 10;
  const dt = 1e-3;
  const trace = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: T, dt });
  const eInf = 1 / (1 + K);
  const c = K / (1 + K);
  const a = (1 + K) / tau;
  // Trapezoid error ≈ dt²/12·|f'(0)| ≤ dt²·a for these integrands (|e'| ≤ a·c < a): the stated bound.
  const atol = dt * dt * a;

  it("simulateLoop reproduces the exponential error sample by sample", () => {
    expect(trace.t).toHaveLength(Math.round(T / dt) + 1);
    for (let k = 0; k < trace.t.length; k += 97) {
      expectClose(trace.e[k], eInf + c * Math.exp(-a * trace.t[k]), 1e-12);
      expectClose(trace.u[k], K * trace.e[k], 1e-12);
      expectClose(trace.r[k] - trace.y[k], trace.e[k], 1e-15);
    }
  });

  it("u[0] holds u(0⁺) = kp·1 and u∞ = K/(1 + K)", () => {
    expect(trace.u[0]).toBe(K);
    expectClose(trace.uInfinity, K * eInf, 1e-15);
  });

  it("iae(trace) matches the closed form ∫e dt", () => {
    expectClose(iae(trace.t, trace.e), eInf * T + (c * (1 - Math.exp(-a * T))) / a, atol);
  });

  it("ise(trace) matches the closed form ∫e² dt", () => {
    const expected = eInf * eInf * T + (2 * eInf * c * (1 - Math.exp(-a * T))) / a + (c * c * (1 - Math.exp(-2 * a * T))) / (2 * a);
    expectClose(ise(trace.t, trace.e), expected, atol);
  });

  it("itae(trace) matches the closed form ∫t·e dt", () => {
    const expected = (eInf * T * T) / 2 + c * (1 / (a * a) - Math.exp(-a * T) * (T / a + 1 / (a * a)));
    expectClose(itae(trace.t, trace.e), expected, atol * T);
  });

  it("effort(trace) matches the closed form ∫(u − u∞)² dt", () => {
    const expected = ((K * c) ** 2 * (1 - Math.exp(-2 * a * T))) / (2 * a);
    expectClose(effort(trace.t, trace.u, trace.uInfinity), expected, atol * K * K);
  });
});
