import { describe, expect, it } from "vitest";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

describe("load step at the plant input", () => {
  it("simulateLoop: 1/(s + 1) under PI kp = ki = 1 answers a unit load step with y = t·e^(−t)", () => {
    // Closed form: Y/D = G/(1 + GC) = s/(τs² + (1 + kp)s + ki) = s/(s + 1)² for τ = kp = ki = 1, so a
    // unit load step gives Y = 1/(s + 1)², y(t) = t·e^(−t); u∞ = −1 (the integrator cancels the load).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    const trace = simulateLoop(plant, { kind: "pi", kp: 1, ki: 1 }, { kind: "load-step", horizon: 10, dt: 0.01 });
    expect(trace.stepSize).toBe(0);
    for (let k = 0; k < trace.t.length; k++) expectClose(trace.y[k], trace.t[k] * Math.exp(-trace.t[k]), 1e-12);
    expectClose(trace.uInfinity, -1, 1e-12);
    expectClose(trace.yInfinity, 0, 1e-12);
  });

  it("simulateLoop: a load step off the grid is switched exactly inside its step", () => {
    // Same closed form shifted to the load time T = 2.0037: y(t) = (t − T)·e^(−(t − T)) for t ≥ T.
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    const T = 2.0037;
    const trace = simulateLoop(plant, { kind: "pi", kp: 1, ki: 1 }, { kind: "load-step", horizon: 10, dt: 0.01, load: { size: 1, time: T } });
    for (let k = 0; k < trace.t.length; k++) {
      const s = trace.t[k] - T;
      expectClose(trace.y[k], s > 0 ? s * Math.exp(-s) : 0, 1e-12);
    }
  });

  it("simulateLoop: the grid path (dead time 0.5 s) gives the delayed closed form for a P loop's load response", () => {
    // Reference: with a pure delay θ in front of G = 1/(s + 1) and no controller action (kp = 0), the
    // plant sees the load after θ: y = 1 − e^(−(t − θ)) for t ≥ θ (closed form, first-order step).
    // Sampled at dt, the controller takes the grid path, exact for held inputs (the continuous
    // controller's joint Runge–Kutta path is checked in joint-loop.test.ts).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0.5 };
    const trace = simulateLoop(plant, { kind: "p", kp: 0, sampleTime: 0.01 }, { kind: "load-step", horizon: 5, dt: 0.01 });
    for (let k = 0; k < trace.t.length; k++) {
      const s = trace.t[k] - 0.5;
      expectClose(trace.y[k], s >= 0 ? 1 - Math.exp(-s) : 0, 1e-12);
    }
  });
});
