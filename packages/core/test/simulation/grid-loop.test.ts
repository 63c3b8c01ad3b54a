import { describe, expect, it } from "vitest";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

const cubic: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };

describe("grid loop: dead time, sampled controllers, limits, noise", () => {
  it("dead time off the grid: the open-loop step of e^(−θs)/(s + 1) is 1 − e^(−(t − θ)) to 1e-9", () => {
    // Closed form: first-order step delayed by θ. θ = 0.537 is not a multiple of dt = 0.01; the exact
    // split of the held input over the step (Franklin, Powell & Workman 1998, §4.3.4) makes it exact.
    // Open loop: state feedback with K = 0, N = 1 gives u = r = 1 for t ≥ 0.
    const theta = 0.537;
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: theta };
    const trace = simulateLoop(plant, { kind: "state-feedback", k: [0], n: 1 }, { kind: "setpoint-step", horizon: 6, dt: 0.01 });
    for (let k = 0; k < trace.t.length; k++) {
      const s = trace.t[k] - theta;
      expectClose(trace.y[k], s >= 0 ? 1 - Math.exp(-s) : 0, 1e-9);
    }
  });

  it("a sampled PID approaches the continuous one with an error roughly ∝ Ts", () => {
    // Reference: ZOH sampling of a controller perturbs the loop by O(Ts) (Åström & Wittenmark,
    // Computer-Controlled Systems, 1997, §8.2, approximating continuous designs). The continuous
    // loop is simulated exactly; the sampled ones on dt = 0.001.
    const pid = { kind: "pid" as const, kp: 1, ki: 0.4, kd: 0.5, tf: 0.1 };
    const scenario = { kind: "setpoint-step" as const, horizon: 20, dt: 0.001 };
    const exact = simulateLoop(cubic, pid, scenario);
    const errors = [0.04, 0.02, 0.01].map((ts) => {
      const sampled = simulateLoop(cubic, { ...pid, sampleTime: ts }, scenario);
      let worst = 0;
      for (let k = 0; k < exact.y.length; k++) worst = Math.max(worst, Math.abs(sampled.y[k] - exact.y[k]));
      return worst;
    });
    expect(errors[0]).toBeLessThan(0.05);
    // Halving Ts roughly halves the error: ratios within [1.6, 2.4].
    for (let i = 0; i + 1 < errors.length; i++) {
      const ratio = errors[i] / errors[i + 1];
      expect(ratio).toBeGreaterThan(1.6);
      expect(ratio).toBeLessThan(2.4);
    }
  });

  it("anti-windup (back-calculation and conditional) reduces the overshoot after saturation", () => {
    // Reference: Åström & Hägglund, Advanced PID Control, 2006, §3.5 (integrator windup and its cures):
    // with the input saturated, the unprotected integrator winds up and the output overshoots more.
    // 1/(s + 1)³ under PID kp = 2, ki = 1, kd = 1 with u limited to [0, 1.5] (u∞ = 1 lies inside).
    const plant: TransferFunctionPlant = { ...cubic, actuator: { min: 0, max: 1.5 } };
    const pid = { kind: "pid" as const, kp: 2, ki: 1, kd: 1, tf: 0.07 };
    const scenario = { kind: "setpoint-step" as const, horizon: 60, dt: 0.01 };
    const peak = (y: Float64Array) => y.reduce((m, v) => Math.max(m, v), -Infinity);
    const wound = peak(simulateLoop(plant, { ...pid, antiWindup: { kind: "none" } }, scenario).y);
    const back = peak(simulateLoop(plant, pid, scenario).y);
    const conditional = peak(simulateLoop(plant, { ...pid, antiWindup: { kind: "conditional" } }, scenario).y);
    expect(wound).toBeGreaterThan(1.25);
    expect(back).toBeLessThan(wound - 0.2);
    expect(conditional).toBeLessThan(wound - 0.2);
    const u = simulateLoop(plant, pid, scenario).u;
    expect(u.every((v) => v >= 0 && v <= 1.5)).toBe(true);
  });

  it("a rate limit bounds |Δu| per step by rate·dt", () => {
    // Invariant (common practice): the held value moves by at most rate·h per update.
    const plant: TransferFunctionPlant = { ...cubic, actuator: { rate: 2 } };
    const trace = simulateLoop(plant, { kind: "pid", kp: 3, ki: 1, kd: 1, tf: 0.05 }, { kind: "setpoint-step", horizon: 10, dt: 0.01 });
    expect(Math.abs(trace.u[0])).toBeLessThanOrEqual(0.02 + 1e-12);
    for (let k = 1; k < trace.u.length; k++) expect(Math.abs(trace.u[k] - trace.u[k - 1])).toBeLessThanOrEqual(0.02 + 1e-12);
  });

  it("measurement noise is reproducible for a seed and differs across seeds; the recorded y stays noise-free in mean", () => {
    // Reference: a seeded generator (mulberry32 + Box–Muller) — common practice.
    const pid = { kind: "pid" as const, kp: 1, ki: 0.5, kd: 0.3, tf: 0.03 };
    const at = (seed: number) => simulateLoop(cubic, pid, { kind: "setpoint-step", horizon: 10, dt: 0.01, noise: { sd: 0.05, seed } });
    const a = at(7);
    const b = at(7);
    const c = at(8);
    expect(Array.from(a.u)).toEqual(Array.from(b.u));
    let differs = 0;
    for (let k = 0; k < a.u.length; k++) if (a.u[k] !== c.u[k]) differs++;
    expect(differs).toBeGreaterThan(a.u.length / 2);
    const clean = simulateLoop(cubic, pid, { kind: "setpoint-step", horizon: 10, dt: 0.01 });
    let deviation = 0;
    for (let k = 0; k < a.y.length; k++) deviation = Math.max(deviation, Math.abs(a.y[k] - clean.y[k]));
    expect(deviation).toBeGreaterThan(1e-4);
    expect(deviation).toBeLessThan(0.2);
  });

  it("a sample time below dt is refused with a message naming sampleTime", () => {
    expect(() => simulateLoop({ ...cubic, actuator: { max: 2 } }, { kind: "p", kp: 1, sampleTime: 0.001 }, { kind: "setpoint-step", horizon: 1, dt: 0.01 })).toThrow(/sampleTime/);
  });
});
