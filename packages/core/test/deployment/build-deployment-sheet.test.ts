import { describe, expect, it } from "vitest";
import { CRITERIA } from "../../src/criteria/registry.js";
import { deployablePid } from "../../src/deployment/deployable-pid.js";
import { buildDeploymentSheet } from "../../src/deployment/build-deployment-sheet.js";
import { DeploymentSheetError, type DeploymentDesign } from "../../src/deployment/deployment-design.js";
import { discretePidRealization } from "../../src/deployment/discrete-pid-realization.js";
import { discretizePid } from "../../src/deployment/discretize-pid.js";
import { initialDiscretePidState, stepDiscretePid } from "../../src/deployment/step-discrete-pid.js";
import { simulateSampledLoop } from "../../src/deployment/simulate-sampled-loop.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

const plant800: TransferFunctionPlant = { kind: "transfer-function", num: [1.4], den: [12, 7, 1], delay: 0.3, actuator: { min: 0, max: 10 } };
const plant400: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [6, 5, 1], delay: 0.2, actuator: { min: 0, max: 10 } };

const design: DeploymentDesign = {
  variants: [
    { label: "Ember 400", plant: plant400 },
    { label: "Ember 800", plant: plant800 },
  ],
  controller: { kind: "pid2dof", kp: 2.2, ki: 0.6, kd: 1.1, tf: 0.12, b: 0.7, c: 0 },
  scenario: { kind: "combined", horizon: 40, dt: 0.005, load: { size: 0.5, time: 20 } },
  criteria: ["iae", "itae", "overshoot", "upeak", "ms"],
};

describe("discretePidRealization", () => {
  it("discretePidRealization has the impulse response of stepDiscretePid from y to u (r = 0)", () => {
    // The state space and the difference equations are the same linear map: feed y = δ[k] into both.
    for (const method of ["tustin", "backward-euler"] as const) {
      const d = discretizePid({ kp: 1.3, ki: 0.7, kd: 0.4, tf: 0.05, b: 1, c: 1 }, { sampleTime: 0.02, method });
      const ss = discretePidRealization(d);
      const x = new Float64Array(ss.n);
      let state = initialDiscretePidState(d, 0, 0, 0);
      for (let k = 0; k < 12; k++) {
        const y = k === 0 ? 1 : 0;
        let u = ss.d * y;
        for (let i = 0; i < ss.n; i++) u += ss.c[i]! * x[i]!;
        const next = new Float64Array(ss.n);
        for (let i = 0; i < ss.n; i++) {
          next[i] = ss.b[i]! * y;
          for (let j = 0; j < ss.n; j++) next[i]! += ss.a[i * ss.n + j]! * x[j]!;
        }
        x.set(next);
        const step = stepDiscretePid(d, state, 0, y);
        state = step.state;
        expectClose(u, step.u, 1e-15, 1e-13);
      }
    }
  });

  it("discretePidRealization of a P controller has no state (no pole at z = 1 left behind)", () => {
    const ss = discretePidRealization(discretizePid({ kp: 2, ki: 0, kd: 0, tf: 0, b: 1, c: 1 }, { sampleTime: 0.1, method: "tustin" }));
    expect(ss.n).toBe(0);
    expect(ss.d).toBe(-2);
  });
});

describe("buildDeploymentSheet", () => {
  it("gives the coefficients of the closed forms, the three forms and the caution", () => {
    // Tustin, h = 1 ms (derived in discretize-pid.ts and its test; Åström & Wittenmark 1997, §8.2):
    // bi1 = bi0 = ki·h/2, ad = (2tf − h)/(2tf + h), dy = 2kd/(2tf + h), dr = c·dy, pr = kp·b, py = kp.
    const h = 0.001;
    const sheet = buildDeploymentSheet(design, { sampleTime: h, method: "tustin" });
    const { kp, ki, kd, tf, b } = { kp: 2.2, ki: 0.6, kd: 1.1, tf: 0.12, b: 0.7 };
    const value = (name: string) => sheet.discrete.coefficients.find((c) => c.name === name)!.value;
    expectClose(value("pr"), kp * b, 1e-15);
    expectClose(value("py"), kp, 0);
    expectClose(value("bi1"), (ki * h) / 2, 1e-18);
    expectClose(value("bi0"), (ki * h) / 2, 1e-18);
    expectClose(value("ad"), (2 * tf - h) / (2 * tf + h), 1e-15);
    expectClose(value("dy"), (2 * kd) / (2 * tf + h), 1e-14);
    expect(value("dr")).toBe(0);
    // Back-calculation default Tt = √(Ti·Td), Ti = kp/ki, Td = kd/kp (Åström & Hägglund 2006, §3.5); at = h/Tt.
    const tt = Math.sqrt((kp / ki) * (kd / kp));
    expectClose(sheet.discrete.trackingTime!, tt, 1e-14);
    expectClose(value("at"), h / tt, 1e-15);
    expect(sheet.discrete.limits).toEqual({ min: 0, max: 10, rate: null, step: null });
    // Ideal form K = kp, Ti = kp/ki, Td = kd/kp, N = Td/tf (Åström & Hägglund 2006, eq. 3.8).
    if (!sheet.forms.ideal.exists) throw new Error(sheet.forms.ideal.reason);
    expectClose(sheet.forms.ideal.integralTime!, kp / ki, 1e-14);
    expectClose(sheet.forms.ideal.filterDivisor!, kd / kp / tf, 1e-13);
    expect(sheet.forms.weights).toEqual({ b: 0.7, c: 0 });
    expect(sheet.caution).toMatch(/real machine/);
    expect(sheet.caution).toMatch(/local codes/);
    expect(sheet.fixedPoint).toBeNull();
    expect(sheet.aggregate.rounded).toBeNull();
    expect(sheet.variants.map((v) => v.label)).toEqual(["Ember 400", "Ember 800"]);
    expect(JSON.parse(JSON.stringify(sheet))).toEqual(sheet);
  });

  it("backward Euler gives ad = tf/(tf + h) and dy = kd/(tf + h) (derived in discretize-pid.ts)", () => {
    // s ← (1 − z⁻¹)/h in kd·s/(tf·s + 1): kd(1 − z⁻¹)/((tf + h) − tf·z⁻¹) (Åström & Wittenmark 1997, §8.2).
    const h = 0.01;
    const sheet = buildDeploymentSheet(design, { sampleTime: h, method: "backward-euler" });
    const value = (name: string) => sheet.discrete.coefficients.find((c) => c.name === name)!.value;
    expectClose(value("ad"), 0.12 / (0.12 + h), 1e-15);
    expectClose(value("dy"), 1.1 / (0.12 + h), 1e-14);
    expectClose(value("bi1"), 0.6 * h, 1e-17);
    expect(value("bi0")).toBe(0);
  });

  it("Q15 keeps each coefficient within 2^−16 of its scale 2^e; plain-range coefficients within 2^−16", () => {
    // Round to nearest with F = 15 fractional bits: |error| ≤ ½·2^(e − 15) = 2^(e − 16) (common practice, e.g.
    // Yates 2013); a coefficient with |c| < 1 has e ≤ 0, so its error is at most 2^−16.
    const sheet = buildDeploymentSheet(design, { sampleTime: 0.001, method: "tustin", format: "q15" });
    const fixed = sheet.fixedPoint!;
    expect(fixed.fractionalBits).toBe(15);
    for (const c of fixed.coefficients) {
      expect(Math.abs(c.error), c.name).toBeLessThanOrEqual(2 ** (c.exponent - 16));
      if (Math.abs(c.exact) < 1) expect(Math.abs(c.error), c.name).toBeLessThanOrEqual(2 ** -16);
      expect(c.rounded).toBe(c.mantissa * 2 ** (c.exponent - 15));
    }
    // Every variant re-simulated with the rounded coefficients; every time criterion scored three ways.
    for (const v of sheet.variants) {
      expect(v.continuous.status).toBe("stable");
      expect(v.sampled!.status).toBe("ok");
      expect(v.rounded!.status).toBe("ok");
      for (const [k, id] of design.criteria.entries()) {
        if (CRITERIA[id].kind === "frequency") expect(v.sampled!.scores![k]).toBeNull();
        else {
          // At 1 kHz the sampled loop is within 2 % of the continuous one, and Q15 moves it by under 1 %.
          expectClose(v.sampled!.scores![k] as number, v.continuous.scores![k] as number, 1e-3, 2e-2);
          expectClose(v.rounded!.scores![k] as number, v.sampled!.scores![k] as number, 1e-4, 1e-2);
        }
      }
      // 0.2–0.3 s of dead time is 200–300 samples at 1 kHz: a closed loop of order > 24 is judged
      // stable on its characteristic polynomial (Schur–Cohn), which gives no pole radius.
      expect(v.sampledPoleRadius).toBeNull();
      expect(typeof v.margins.ms).toBe("number");
    }
    // Worst case over the family (the default aggregate): the larger IAE of the two variants.
    const iae = (v: (typeof sheet.variants)[number]) => v.continuous.scores![0] as number;
    expect(sheet.aggregate.continuous[0]).toBe(Math.max(iae(sheet.variants[0]!), iae(sheet.variants[1]!)));
  });

  it("the re-simulated sampled loop approaches the continuous loop with observed order 1 in h", () => {
    // A zero-order hold acts as a delay of about h/2 (Åström & Wittenmark 1997, §7.2), so the sampled
    // loop's output error falls in proportion to h: order p = log2(e(h)/e(h/2)) ≈ 1. Observed on this
    // loop (delay-free second-order plant, Tustin PID): p between 0.95 and 1.05 at each halving.
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [2, 3, 1], delay: 0 };
    const controller = { kind: "pid2dof", kp: 2, ki: 0.8, kd: 0.6, tf: 0.1, b: 1, c: 1 } as const;
    const scenario = { kind: "setpoint-step", horizon: 10, dt: 0.0005 } as const;
    const reference = simulateLoop(plant, controller, scenario);
    const errors = [0.032, 0.016, 0.008, 0.004].map((h) => {
      const trace = simulateSampledLoop(plant, discretizePid(deployablePid(controller), { sampleTime: h, method: "tustin" }), scenario);
      let worst = 0;
      for (let j = 0; j < trace.t.length; j++) worst = Math.max(worst, Math.abs(trace.y[j]! - reference.y[j]!));
      return worst;
    });
    for (let i = 1; i < errors.length; i++) {
      const order = Math.log2(errors[i - 1]! / errors[i]!);
      expect(order, `order between h = ${0.032 / 2 ** (i - 1)} and its half`).toBeGreaterThan(0.95);
      expect(order).toBeLessThan(1.05);
    }
  });

  it("refuses a sample time at which the sampled loop is unstable, naming a stable one", () => {
    // P control of k/(τs + 1), ZOH at h: y[n+1] = λ·y[n] + …, λ = a − k·kp(1 − a), a = e^(−h/τ)
    // (Åström & Wittenmark 1997, §2.3). k = 2, kp = 3, τ = 1: λ = 7a − 6, |λ| < 1 ⇔ a > 5/7 ⇔ h < ln(7/5) ≈ 0.336 s.
    const first: DeploymentDesign = {
      variants: [{ label: "Ember 200", plant: { kind: "transfer-function", num: [2], den: [1, 1], delay: 0 } }],
      controller: { kind: "p", kp: 3 },
      scenario: { kind: "setpoint-step", horizon: 10, dt: 0.01 },
      criteria: ["iae"],
    };
    const ok = buildDeploymentSheet(first, { sampleTime: 0.2, method: "tustin" });
    expectClose(ok.variants[0]!.sampledPoleRadius!, Math.abs(7 * Math.exp(-0.2) - 6), 1e-12);
    let error: unknown;
    try {
      buildDeploymentSheet(first, { sampleTime: 0.5, method: "tustin" });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(DeploymentSheetError);
    const refusal = error as DeploymentSheetError;
    expect(refusal.field).toBe("sampleTime");
    expect(refusal.kind).toBe("unsuitable");
    // λ at h = 0.5: 7e^(−0.5) − 6 = −1.754…; the first halving, h = 0.25 s, is stable (a = 0.7788 > 5/7).
    expect(refusal.reason).toMatch(/unstable on Ember 200 \(a closed-loop pole at \|z\| = 1\.75\)/);
    expect(refusal.reason).toMatch(/stable on every variant at h = 0\.25 s/);
  });

  it("refuses a bad, too coarse or too fine sample time and a structure without a sheet, each with a sentence", () => {
    const reasons = (request: Parameters<typeof buildDeploymentSheet>[1], d = design) => {
      try {
        buildDeploymentSheet(d, request);
      } catch (e) {
        if (e instanceof DeploymentSheetError) return `${e.kind}:${e.field}:${e.reason}`;
        throw e;
      }
      return "accepted";
    };
    expect(reasons({ sampleTime: 0, method: "tustin" })).toMatch(/^invalid:sampleTime:The sample time must be a number of seconds greater than 0/);
    expect(reasons({ sampleTime: Number.NaN, method: "tustin" })).toMatch(/^invalid:sampleTime/);
    expect(reasons({ sampleTime: 0.01, method: "euler" as "tustin" })).toMatch(/^invalid:method/);
    expect(reasons({ sampleTime: 0.01, method: "tustin", format: "q7" as "q15" })).toMatch(/^invalid:format/);
    expect(reasons({ sampleTime: 5, method: "tustin" })).toMatch(/^unsuitable:sampleTime:A sample time of 5 s is too coarse for the scenario's 40 s horizon: choose at most 4 s/);
    expect(reasons({ sampleTime: 1e-6, method: "tustin" })).toMatch(/^unsuitable:sampleTime:At h = 0.000001 s the re-simulation .* more than the 200,000 allowed; choose h ≥ 0\.0002 s/);
    expect(reasons({ sampleTime: 0.01, method: "tustin" }, { ...design, controller: { kind: "lead-lag", k: 1, tLead: 1, tLag: 0.1 } })).toMatch(
      /^unsuitable:controller:The deployment sheet covers P, PI, PID/,
    );
  });
});
