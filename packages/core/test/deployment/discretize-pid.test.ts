import { describe, expect, it } from "vitest";
import { discretizePid } from "../../src/deployment/discretize-pid.js";
import type { DeployablePid } from "../../src/deployment/deployable-pid.js";
import type { DiscretePid } from "../../src/deployment/discrete-pid.js";
import { initialDiscretePidState, stepDiscretePid, type DiscretePidState } from "../../src/deployment/step-discrete-pid.js";
import { expectClose } from "../support/expect-close.js";

const pid = (p: Partial<DeployablePid>): DeployablePid => ({ kp: 0, ki: 0, kd: 0, tf: 0, b: 1, c: 1, ...p });

/** u[k] for e[k] = δ[k] (r = δ, y = 0) from rest: the controller's impulse response. */
function impulseResponse(d: DiscretePid, count: number): number[] {
  let state: DiscretePidState = initialDiscretePidState(d, 0, 0, 0);
  const out: number[] = [];
  for (let k = 0; k < count; k++) {
    const step = stepDiscretePid(d, state, k === 0 ? 1 : 0, 0);
    out.push(step.u);
    state = step.state;
  }
  return out;
}

const H = 0.05;

describe("discretizePid against closed forms", () => {
  it("Tustin of a PI has the impulse response of C(z) = ((kp + ki·h/2) + (ki·h/2 − kp)z⁻¹)/(1 − z⁻¹)", () => {
    // s ← (2/h)(1 − z⁻¹)/(1 + z⁻¹) in kp + ki/s gives the C(z) above (Åström & Wittenmark 1997, §8.2);
    // its impulse response: g0 = kp + ki·h/2, g_k = ki·h for k ≥ 1 (long division).
    const [kp, ki] = [1.7, 0.9];
    const d = discretizePid(pid({ kp, ki }), { sampleTime: H, method: "tustin" });
    const g = impulseResponse(d, 6);
    expectClose(g[0], kp + (ki * H) / 2, 1e-15);
    for (let k = 1; k < 6; k++) expectClose(g[k], ki * H, 1e-15);
  });

  it("Tustin of a filtered derivative has the impulse response of 2kd(1 − z⁻¹)/((2tf + h) + (h − 2tf)z⁻¹)", () => {
    // s ← (2/h)(1 − z⁻¹)/(1 + z⁻¹) in kd·s/(tf·s + 1) gives D(z) = g(1 − z⁻¹)/(1 − a z⁻¹) with
    // g = 2kd/(2tf + h), a = (2tf − h)/(2tf + h); impulse response d0 = g, d_k = g·a^(k−1)·(a − 1).
    const [kd, tf] = [0.6, 0.2];
    const d = discretizePid(pid({ kd, tf }), { sampleTime: H, method: "tustin" });
    const gain = (2 * kd) / (2 * tf + H);
    const a = (2 * tf - H) / (2 * tf + H);
    const response = impulseResponse(d, 8);
    expectClose(response[0], gain, 1e-15);
    for (let k = 1; k < 8; k++) expectClose(response[k], gain * a ** (k - 1) * (a - 1), 1e-14);
  });

  it("backward Euler of a PID has the impulse response of kp + ki·h/(1 − z⁻¹) + kd(1 − z⁻¹)/((tf + h) − tf·z⁻¹)", () => {
    // s ← (1 − z⁻¹)/h (Åström & Wittenmark 1997, §8.2): the integral gives ki·h, ki·h, …; the derivative
    // g(1 − z⁻¹)/(1 − a z⁻¹) with g = kd/(tf + h), a = tf/(tf + h): g, g·a^(k−1)(a − 1), …
    const [kp, ki, kd, tf] = [1.2, 0.4, 0.5, 0.1];
    const d = discretizePid(pid({ kp, ki, kd, tf }), { sampleTime: H, method: "backward-euler" });
    const gain = kd / (tf + H);
    const a = tf / (tf + H);
    const response = impulseResponse(d, 8);
    expectClose(response[0], kp + ki * H + gain, 1e-15);
    for (let k = 1; k < 8; k++) expectClose(response[k], ki * H + gain * a ** (k - 1) * (a - 1), 1e-14);
  });

  it("the set-point weights act on r only: b scales the proportional kick, c the derivative kick", () => {
    // u[0] for a unit set-point step from rest (y = 0): kp·b + bi1 + dr = kp·b + ki·h/2 + c·2kd/(2tf + h) (Tustin).
    const [kp, ki, kd, tf, b, c] = [2, 1, 0.4, 0.1, 0.6, 0.25];
    const d = discretizePid(pid({ kp, ki, kd, tf, b, c }), { sampleTime: H, method: "tustin" });
    const first = stepDiscretePid(d, initialDiscretePidState(d, 0, 0, 0), 1, 0);
    expectClose(first.u, kp * b + (ki * H) / 2 + (c * 2 * kd) / (2 * tf + H), 1e-15);
    // A unit step in y instead (r = 0): −kp − ki·h/2 − 2kd/(2tf + h), weights not involved.
    const load = stepDiscretePid(d, initialDiscretePidState(d, 0, 0, 0), 0, 1);
    expectClose(load.u, -kp - (ki * H) / 2 - (2 * kd) / (2 * tf + H), 1e-15);
  });

  it("stepDiscretePid is pure: the same state and inputs give the same output and leave the state unchanged", () => {
    const d = discretizePid(pid({ kp: 1, ki: 2, kd: 0.1, tf: 0.05 }), { sampleTime: H, method: "backward-euler" });
    const state = initialDiscretePidState(d, 0.5, 0.2, 0.1);
    const copy = { ...state };
    const a = stepDiscretePid(d, state, 1, 0.3);
    const b = stepDiscretePid(d, state, 1, 0.3);
    expect(a).toEqual(b);
    expect(state).toEqual(copy);
    // Bumpless start (initialDiscretePidState): unchanged r and y give u = u_before + bi1·e + bi0·e.
    const still = stepDiscretePid(d, state, 0.5, 0.2);
    expectClose(still.u, 0.1 + 2 * H * 0.3, 1e-15);
  });
});

describe("back-calculation, output limits and rate limit", () => {
  it("in lasting saturation the back-calculated integral settles where v − u = ki·Tt·e", () => {
    // Steady state of Ī ← Ī + bi·e + (h/Tt)(u − v) with bi1 + bi0 = ki·h: ki·h·e = (h/Tt)(v − u)
    // (Åström & Hägglund 2006, §3.5: the continuous tracking loop ki·e + (u − v)/Tt = 0).
    const [kp, ki] = [2, 1.5];
    for (const method of ["tustin", "backward-euler"] as const) {
      const d = discretizePid(pid({ kp, ki }), { sampleTime: H, method, limits: { max: 1 }, trackingTime: 0.4 });
      let state = initialDiscretePidState(d, 0, 0, 0);
      let last = stepDiscretePid(d, state, 1, 0);
      for (let k = 0; k < 400; k++) {
        last = stepDiscretePid(d, state, 1, 0);
        state = last.state;
      }
      expect(last.u).toBe(1);
      expectClose(last.v - last.u, ki * 0.4 * 1, 1e-9);
    }
  });

  it("without anti-windup (Tt = Infinity) the integral keeps growing in saturation", () => {
    const d = discretizePid(pid({ kp: 2, ki: 1.5 }), { sampleTime: H, method: "tustin", limits: { max: 1 }, trackingTime: Infinity });
    expect(d.coefficients.at).toBe(0);
    let state = initialDiscretePidState(d, 0, 0, 0);
    for (let k = 0; k < 100; k++) state = stepDiscretePid(d, state, 1, 0).state;
    // Ī after 100 samples of e = 1: 100·ki·h − ki·h/2 (Tustin's first half-step) = 7.4625.
    expectClose(state.integral, 100 * 1.5 * H - (1.5 * H) / 2, 1e-12);
  });

  it("the output stays within [min, max] and moves at most rate·h per sample", () => {
    const d = discretizePid(pid({ kp: 5, ki: 3, kd: 0.5, tf: 0.05 }), { sampleTime: H, method: "tustin", limits: { min: -2, max: 2, rate: 10 } });
    expectClose(d.limits.step, 10 * H, 1e-15);
    let state = initialDiscretePidState(d, 0, 0, 0);
    let previous = 0;
    for (let k = 0; k < 200; k++) {
      const r = k < 100 ? 1 : -1;
      const step = stepDiscretePid(d, state, r, 0.3 * Math.sin(k / 7));
      expect(step.u).toBeGreaterThanOrEqual(-2);
      expect(step.u).toBeLessThanOrEqual(2);
      expect(Math.abs(step.u - previous)).toBeLessThanOrEqual(10 * H + 1e-12);
      previous = step.u;
      state = step.state;
    }
  });

  it("discretizePid names a bad sample time, method, limits and tracking time", () => {
    const p = pid({ kp: 1, ki: 1 });
    expect(() => discretizePid(p, { sampleTime: 0, method: "tustin" })).toThrow(/sampleTime/);
    expect(() => discretizePid(p, { sampleTime: 0.1, method: "euler" as "tustin" })).toThrow(/method/);
    expect(() => discretizePid(p, { sampleTime: 0.1, method: "tustin", limits: { min: 1, max: 0 } })).toThrow(/limits.max/);
    expect(() => discretizePid(p, { sampleTime: 0.1, method: "tustin", trackingTime: -1 })).toThrow(/trackingTime/);
  });
});
