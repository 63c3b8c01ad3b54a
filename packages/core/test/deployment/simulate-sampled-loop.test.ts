import { describe, expect, it } from "vitest";
import { CRITERIA } from "../../src/criteria/registry.js";
import { continuousController, deployablePid } from "../../src/deployment/deployable-pid.js";
import { deploymentSheet } from "../../src/deployment/deployment-sheet.js";
import { discretizePid } from "../../src/deployment/discretize-pid.js";
import { sampledCriteria } from "../../src/deployment/sampled-criteria.js";
import { simulateSampledLoop } from "../../src/deployment/simulate-sampled-loop.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

describe("simulateSampledLoop", () => {
  it("a P controller on a first-order plant follows the closed form of the sampled loop", () => {
    // ZOH of k/(τs + 1) at h: y[n+1] = a·y[n] + k(1 − a)·u[n], a = e^(−h/τ) (Åström & Wittenmark 1997, §2.3).
    // With u = kp(r − y): y[n] = y∞(1 − λⁿ), λ = a − k·kp(1 − a), y∞ = k·kp·r/(1 + k·kp).
    const [k, tau, kp, h] = [2, 1.5, 1.2, 0.1];
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [k], den: [tau, 1], delay: 0 };
    const d = discretizePid({ kp, ki: 0, kd: 0, tf: 0, b: 1, c: 1 }, { sampleTime: h, method: "tustin" });
    // dt = h/4: the trace has four points per sample; the sample instants are every fourth.
    const trace = simulateSampledLoop(plant, d, { kind: "setpoint-step", horizon: 3, dt: h / 4 });
    const a = Math.exp(-h / tau);
    const lambda = a - k * kp * (1 - a);
    const yInf = (k * kp) / (1 + k * kp);
    for (let n = 0; n <= 30; n++) expectClose(trace.y[4 * n], yInf * (1 - lambda ** n), 1e-13);
    expectClose(trace.t[4], h, 1e-15);
    // Between samples u is held: u on [nh, (n+1)h) equals kp(r − y[n]).
    expectClose(trace.u[4 * 5 + 3], kp * (1 - trace.y[4 * 5]), 1e-13);
    // u∞ = kp(r − y∞) (no integral action), y∞ from the loop's DC gain.
    expectClose(trace.yInfinity, yInf, 1e-15);
    expectClose(trace.uInfinity, kp * (1 - yInf), 1e-15);
  });

  it("a dead time of 2.5 samples delays the first output move by 2.5 samples exactly", () => {
    // e^(−θs)/(s + 1) under a constant u = kp·r from t = 0 (u changes again only after the output moves):
    // y(t) = kp·(1 − e^(−(t − θ))) for θ ≤ t ≤ first sample after θ (closed form of the first-order step).
    const h = 0.2;
    const theta = 2.5 * h;
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: theta };
    const d = discretizePid({ kp: 0.5, ki: 0, kd: 0, tf: 0, b: 1, c: 1 }, { sampleTime: h, method: "backward-euler" });
    const trace = simulateSampledLoop(plant, d, { kind: "setpoint-step", horizon: 2, dt: h / 10 });
    for (let j = 0; j <= 30; j++) {
      const t = trace.t[j];
      expectClose(trace.y[j], t > theta ? 0.5 * (1 - Math.exp(-(t - theta))) : 0, 1e-14);
    }
  });

  it("the sampled loop approaches the continuous loop as the sample time shrinks (error O(h))", () => {
    // Reference: simulateLoop's exact closed loop of the continuous 2-DOF PID (delay-free, no limits).
    // A zero-order hold acts like a delay of h/2 (Åström & Wittenmark 1997, §7.x), so the error of
    // the sampled loop falls about in proportion to h: halving h should roughly halve it.
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [0.5, 1.5, 1], delay: 0 };
    const controller = { kind: "pid2dof", kp: 2, ki: 1.5, kd: 0.4, tf: 0.05, b: 0.8, c: 0 } as const;
    const scenario = { kind: "setpoint-step", horizon: 8, dt: 0.0025 } as const;
    const reference = simulateLoop(plant, controller, scenario);
    for (const method of ["tustin", "backward-euler"] as const) {
      const errors: number[] = [];
      const iaeChange: number[] = [];
      for (const h of [0.04, 0.02, 0.01, 0.005]) {
        const trace = simulateSampledLoop(plant, discretizePid(deployablePid(controller), { sampleTime: h, method }), scenario);
        expect(trace.t.length).toBe(reference.t.length);
        let worst = 0;
        for (let j = 0; j < trace.t.length; j++) worst = Math.max(worst, Math.abs(trace.y[j] - reference.y[j]));
        errors.push(worst);
        iaeChange.push(Math.abs(CRITERIA.iae.compute(trace) - CRITERIA.iae.compute(reference)));
      }
      for (let i = 1; i < errors.length; i++) {
        expect(errors[i], `${method} y error at step ${i}`).toBeLessThan(0.7 * errors[i - 1]);
        expect(errors[i], `${method} y error at step ${i}`).toBeGreaterThan(0.3 * errors[i - 1]);
        expect(iaeChange[i], `${method} IAE change at step ${i}`).toBeLessThan(iaeChange[i - 1]);
      }
      expect(errors[errors.length - 1]).toBeLessThan(5e-3);
    }
  });

  it("with dead time and output limits the sampled loop also approaches the continuous grid loop", () => {
    // Reference: simulateLoop's grid loop (dead time split exactly, continuous controller updated every dt,
    // saturation with the same back-calculation tracking time). Its own error is O(dt) and, in
    // saturation, comparable to the sampled loop's at dt = h/8, so it runs at dt_ref = 1.25e-4 s
    // (ten times finer than the sampled loops' 1.25e-3 s grid) and the two are compared where their
    // grids meet (every tenth reference sample).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1.5], den: [4, 1], delay: 0.35, actuator: { min: 0, max: 1.2 } };
    const controller = { kind: "pid", kp: 1.6, ki: 0.5, kd: 0.3, tf: 0.1 } as const;
    const reference = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: 20, dt: 0.000125 });
    const scenario = { kind: "setpoint-step", horizon: 20, dt: 0.00125 } as const;
    const errors: number[] = [];
    for (const h of [0.08, 0.04, 0.02, 0.01]) {
      const d = discretizePid(deployablePid(controller), { sampleTime: h, method: "tustin", limits: plant.actuator });
      const trace = simulateSampledLoop(plant, d, scenario);
      let worst = 0;
      for (let j = 0; j < trace.t.length; j++) worst = Math.max(worst, Math.abs(trace.y[j] - reference.y[10 * j]));
      errors.push(worst);
      expect(Math.max(...trace.u)).toBeLessThanOrEqual(1.2);
    }
    for (let i = 1; i < errors.length; i++) expect(errors[i], `error at h = ${0.08 / 2 ** i}`).toBeLessThan(0.75 * errors[i - 1]);
  });

  it("continuousController and simulateSampledLoop agree on the steady state with integral action and a load", () => {
    // With integral action y∞ = r; the plant's input balances the load: u∞ = r/G(0) − d (final-value theorem).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [2], den: [1, 1], delay: 0.1 };
    const d = discretizePid({ kp: 1, ki: 1, kd: 0, tf: 0, b: 1, c: 1 }, { sampleTime: 0.05, method: "tustin" });
    const trace = simulateSampledLoop(plant, d, { kind: "combined", horizon: 30, dt: 0.01, load: { size: 0.4, time: 5.013 } });
    expectClose(trace.yInfinity, 1, 1e-15);
    expectClose(trace.uInfinity, 0.5 - 0.4, 1e-15);
    expectClose(trace.y[trace.y.length - 1], 1, 1e-6);
    expectClose(trace.u[trace.u.length - 1], 0.1, 1e-6);
    expect(continuousController(d.pid).kind).toBe("pid2dof");
  });
});

describe("sampledCriteria", () => {
  it("scores the continuous, sampled and Q15 loops on every criterion; Q31 changes the sampled trace by less than Q15", () => {
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [2, 3, 1], delay: 0.2 };
    const controller = { kind: "pid2dof", kp: 2.2, ki: 0.9, kd: 0.8, tf: 0.08, b: 0.7, c: 0 } as const;
    const scenario = { kind: "setpoint-step", horizon: 15, dt: 0.001 } as const;
    const criteria = ["iae", "ise", "itae", "overshoot", "settlingTime", "ms"] as const;
    const q15 = deploymentSheet(controller, { sampleTime: 0.001, method: "tustin", fixedPoint: { format: "q15" } });
    const q31 = deploymentSheet(controller, { sampleTime: 0.001, method: "tustin", fixedPoint: { format: "q31" } });
    const r15 = sampledCriteria(plant, q15, scenario, criteria);
    const r31 = sampledCriteria(plant, q31, scenario, criteria);
    expect(r15.continuous.status).toBe("stable");
    for (const id of criteria) {
      expect(r15.sampled.scores![id], id).toBeDefined();
      if (CRITERIA[id].kind === "frequency") expect(r15.sampled.scores![id]).toBeNaN();
      else {
        // At 1 kHz the sampled loop stays within 1 % of the continuous one on every time criterion.
        expectClose(r15.sampled.scores![id], r15.continuous.scores![id], 1e-3, 1e-2);
        const d15 = Math.abs(r15.rounded!.scores![id] - r15.sampled.scores![id]);
        const d31 = Math.abs(r31.rounded!.scores![id] - r31.sampled.scores![id]);
        expect(d31, id).toBeLessThanOrEqual(d15);
      }
    }
    const trace = simulateSampledLoop(plant, q31.fixedPoint!.discrete, scenario);
    const exact = simulateSampledLoop(plant, q31.discrete, scenario);
    let worst = 0;
    for (let j = 0; j < trace.y.length; j++) worst = Math.max(worst, Math.abs(trace.y[j] - exact.y[j]));
    // Q31 rounds each coefficient by under 2^(e−32) relative to 2^e: the trace moves by about 1e-9.
    expect(worst).toBeLessThan(1e-7);
  });
});
