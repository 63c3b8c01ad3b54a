import { describe, expect, it } from "vitest";
import { CRITERIA } from "../../src/criteria/registry.js";
import { steadyStateError } from "../../src/criteria/steady-state-error.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

describe("steadyStateError", () => {
  /*
   * Plant 1/(s + 1) under P control kp: type-0 loop, e_ss = 1/(1 + kp·G(0)) = 1/(1 + kp)
   * (G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic Systems, 2002,
   * §4.2). With kp = 1 the loop is kp/(s + 1 + kp) = 1/(s + 2): y = ½(1 − e^(−2t)) (closed form).
   */
  const plant = { kind: "transfer-function" as const, num: [1], den: [1, 1], delay: 0 };
  const controller = { kind: "pid" as const, kp: 1, ki: 0, kd: 0, tf: 0 };

  it("is |r − y∞| = 1/(1 + kp) from the exact y∞, even when the horizon ends before y settles", () => {
    const trace = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: 1, dt: 0.001 });
    expectClose(trace.yInfinity, 0.5, 1e-12);
    expectClose(CRITERIA.steadyStateError.compute(trace), 0.5, 1e-12);
    // At T = 1 the output is still ½(1 − e^(−2)) ≈ 0.432, so |r − y(T)| would be ≈ 0.568.
    expectClose(steadyStateError(trace.r, trace.y, NaN), 1 - 0.5 * (1 - Math.exp(-2)), 1e-9);
  });

  it("the step figures of that loop refer to y∞ = ½, not to the setpoint: rise time ln 9/2, no overshoot", () => {
    // Closed form y = ½(1 − e^(−2t)), τ = ½: rise time τ·ln 9 (see step-criteria.test.ts), never above ½.
    const dt = 0.001;
    const trace = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: 10, dt });
    expectClose(CRITERIA.riseTime.compute(trace), Math.log(9) / 2, (dt * dt) / 2 + 1e-9);
    expect(CRITERIA.overshoot.compute(trace)).toBeLessThan(1e-9);
  });

  it("is 0 with integral action (type-1 loop)", () => {
    const trace = simulateLoop(plant, { ...controller, ki: 1 }, { kind: "setpoint-step", horizon: 10, dt: 0.01 });
    expect(CRITERIA.steadyStateError.compute(trace)).toBeLessThan(1e-12);
  });

  it("names r or y when their lengths differ", () => {
    expect(() => steadyStateError(new Float64Array(3), new Float64Array(2), 0)).toThrow(/^y must have/);
  });
});
