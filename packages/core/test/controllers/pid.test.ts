import { describe, expect, it } from "vitest";
import { pidStateSpace } from "../../src/controllers/pid-state-space.js";
import { pidTransferFunction } from "../../src/controllers/pid-transfer-function.js";
import { pidFromIdealForm, pidToIdealForm } from "../../src/controllers/pid-ideal-form.js";
import type { PidController } from "../../src/controllers/pid.js";
import { polynomialEvaluate } from "../../src/linear-algebra/polynomial-evaluate.js";
import { expectClose } from "../support/expect-close.js";

const pid = (kp: number, ki: number, kd: number, tf: number): PidController => ({ kind: "pid", kp, ki, kd, tf });

/** The definition C(s) = kp + ki/s + kd·s/(tf·s + 1) at a real s ≠ 0. */
const direct = (c: PidController, s: number) => c.kp + c.ki / s + (c.kd * s) / (c.tf * s + 1);

describe("PID realisations", () => {
  const controllers = [pid(2, 0.5, 0.8, 0.1), pid(1, 0, 0, 0), pid(1.5, 0.3, 0, 0), pid(0.7, 0, 1.2, 0.05), pid(0, 0.4, 0, 0)];

  for (const c of controllers) {
    it(`pidTransferFunction and pidStateSpace of ${JSON.stringify(c)} equal the definition`, () => {
      // Definition of the parallel PID with first-order derivative filter (Åström & Hägglund 2006, §3.3).
      const tf = pidTransferFunction(c);
      const ss = pidStateSpace(c);
      for (const s of [0.2, 1, 3.7]) {
        const expected = direct(c, s);
        expectClose(polynomialEvaluate(tf.num, s) / polynomialEvaluate(tf.den, s), expected, 1e-12, 1e-12);
        // A is diagonal here: C(sI − A)⁻¹B + D = Σ c_i b_i/(s − a_ii) + D.
        let fromSs = ss.d;
        for (let i = 0; i < ss.n; i++) fromSs += (ss.c[i] * ss.b[i]) / (s - ss.a[i * ss.n + i]);
        expectClose(fromSs, expected, 1e-12, 1e-12);
      }
    });
  }

  it("pidStateSpace keeps only the states in use and has feedthrough kp + kd/tf", () => {
    expect(pidStateSpace(pid(1, 0, 0, 0)).n).toBe(0);
    expect(pidStateSpace(pid(1, 1, 0, 0)).n).toBe(1);
    expect(pidStateSpace(pid(1, 1, 2, 0.5)).n).toBe(2);
    expect(pidStateSpace(pid(1, 1, 2, 0.5)).d).toBe(5);
  });

  it("pidStateSpace refuses kd ≠ 0 with tf = 0 naming tf", () => {
    expect(() => pidStateSpace(pid(1, 0, 1, 0))).toThrow(RangeError);
    expect(() => pidStateSpace(pid(1, 0, 1, 0))).toThrow(/^tf/);
    expect(() => pidTransferFunction(pid(1, 0, 1, -0.1))).toThrow(/tf/);
    expect(() => pidStateSpace(pid(NaN, 0, 0, 0))).toThrow(/kp/);
  });
});

describe("PID ideal form", () => {
  it("pidFromIdealForm maps K, Ti, Td, N to kp = K, ki = K/Ti, kd = K·Td, tf = Td/N", () => {
    // Åström & Hägglund 2006, §3.2: K(1 + 1/(Ti s) + Td s/(Td/N s + 1)), expanded term by term.
    const c = pidFromIdealForm({ gain: 2, integralTime: 4, derivativeTime: 0.5, filterDivisor: 10 });
    expectClose(c.kp, 2, 1e-15);
    expectClose(c.ki, 0.5, 1e-15);
    expectClose(c.kd, 1, 1e-15);
    expectClose(c.tf, 0.05, 1e-15);
  });

  it("pidToIdealForm ∘ pidFromIdealForm is the identity (round trip)", () => {
    // Closed form: the two maps are inverse term by term.
    const ideal = { gain: 1.7, integralTime: 12.5, derivativeTime: 2.25, filterDivisor: 8 };
    const back = pidToIdealForm(pidFromIdealForm(ideal));
    expectClose(back.gain, ideal.gain, 0, 1e-15);
    expectClose(back.integralTime, ideal.integralTime, 0, 1e-14);
    expectClose(back.derivativeTime, ideal.derivativeTime, 0, 1e-14);
    expectClose(back.filterDivisor, ideal.filterDivisor, 0, 1e-14);
    const parallel = pid(3, 0.6, 1.2, 0.04);
    const again = pidFromIdealForm(pidToIdealForm(parallel));
    for (const key of ["kp", "ki", "kd", "tf"] as const) expectClose(again[key], parallel[key], 0, 1e-14);
  });

  it("pidToIdealForm gives Ti = ∞ without integral action and refuses kp = 0", () => {
    const ideal = pidToIdealForm(pid(2, 0, 0, 0));
    expect(ideal.integralTime).toBe(Infinity);
    expect(ideal.derivativeTime).toBe(0);
    expect(pidFromIdealForm(ideal)).toEqual(pid(2, 0, 0, 0));
    expect(() => pidToIdealForm(pid(0, 1, 0, 0))).toThrow(/kp/);
  });
});
