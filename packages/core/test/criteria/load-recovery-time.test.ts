import { describe, expect, it } from "vitest";
import { loadRecoveryTime } from "../../src/criteria/load-recovery-time.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
const BAND = 0.02;

describe("loadRecoveryTime", () => {
  it("P on 1/(s + 1) under a load step: t_rec = τ_c·ln(1/β) (closed form)", () => {
    // Closed form: y' = −y + (u + d), u = −kp·y (r = 0) ⇒ y = y∞(1 − e^(−t/τc)), τc = 1/(1 + kp),
    // y∞ = d/(1 + kp). e = −y, e_f = −y∞, so |e − e_f| = y∞·e^(−t/τc), peak y∞ at t = 0⁺, and it
    // falls to β·y∞ at t = τc·ln(1/β).
    const kp = 2;
    const tauC = 1 / (1 + kp);
    const scenario = { kind: "load-step" as const, horizon: 5, dt: 0.001 };
    const result = evaluateCandidate(plant, { kind: "p", kp }, scenario, ["loadRecoveryTime", "settlingTime", "overshoot"]);
    expect(result.status).toBe("stable");
    // Linear interpolation of an exponential between samples: error ≤ dt²/(8τc) ≈ 4e-7 s.
    expectClose(result.scores!.loadRecoveryTime, tauC * Math.log(1 / BAND), 1e-6);
    expect(result.scores!.settlingTime).toBeNaN(); // the step-response figures do not apply here
  });

  it("PI on 1/(s + 1) with poles at −1 and −4: the recovery solved from the closed-form response", () => {
    // kp = ki = 4: χ = s² + 5s + 4 = (s + 1)(s + 4). Y/D = s/((s + 1)(s + 4)) · 1/s for a unit load,
    // y(t) = (e^(−t) − e^(−4t))/3 (closed form), e = −y, e_f = 0. Peak at e^(3t) = 4, t* = ln 4/3,
    // y* = 4^(−1/3)/4. t_rec solves y(t) = β·y* on t > t* (y falls monotonically there): bisection.
    const y = (t: number) => (Math.exp(-t) - Math.exp(-4 * t)) / 3;
    const peak = Math.pow(4, -1 / 3) / 4;
    expectClose(y(Math.log(4) / 3), peak, 1e-15);
    let lo = Math.log(4) / 3;
    let hi = 20;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (y(mid) > BAND * peak) lo = mid;
      else hi = mid;
    }
    const scenario = { kind: "load-step" as const, horizon: 15, dt: 0.001 };
    const result = evaluateCandidate(plant, { kind: "pi", kp: 4, ki: 4 }, scenario, ["loadRecoveryTime"]);
    // The sampled peak is within dt of t*, so D is low by at most O(dt²)·|y''| ≈ 1e-7 relative.
    expectClose(result.scores!.loadRecoveryTime, lo, 1e-5);
  });

  it("is measured from the load time in a combined scenario (superposition: same as the load alone)", () => {
    // Linear loop: the setpoint transient has decayed by e^(−20) at the load time t_l = 20 s.
    const controller = { kind: "pi" as const, kp: 4, ki: 4 };
    const alone = evaluateCandidate(plant, controller, { kind: "load-step", horizon: 15, dt: 0.001 }, ["loadRecoveryTime"]);
    const combined = evaluateCandidate(plant, controller, { kind: "combined", horizon: 35, dt: 0.001, load: { size: 1, time: 20 } }, ["loadRecoveryTime"]);
    expectClose(combined.scores!.loadRecoveryTime, alone.scores!.loadRecoveryTime, 1e-6);
  });

  it("is NaN without a load, Infinity when not recovered, 0 when the load moves nothing (invariants)", () => {
    const step = simulateLoop(plant, { kind: "pi", kp: 1, ki: 1 }, { kind: "setpoint-step", horizon: 10, dt: 0.01 });
    expect(CRITERIA.loadRecoveryTime.compute(step)).toBeNaN();
    const slow = simulateLoop(plant, { kind: "pi", kp: 0.1, ki: 0.05 }, { kind: "load-step", horizon: 5, dt: 0.01 });
    expect(CRITERIA.loadRecoveryTime.compute(slow)).toBe(Infinity);
    expect(loadRecoveryTime([0, 1, 2], [0, 0, 0], 0, 0)).toBe(0);
    expect(() => loadRecoveryTime([0, 1], [0, 1], 0, 0, 1.5)).toThrow(RangeError);
  });
});
