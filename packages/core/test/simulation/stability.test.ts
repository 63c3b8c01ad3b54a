import { describe, expect, it } from "vitest";
import type { PidController } from "../../src/controllers/pid.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { closedLoopCharacteristicPolynomial } from "../../src/simulation/closed-loop-characteristic-polynomial.js";
import { closedLoopPoles } from "../../src/simulation/closed-loop-poles.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { isStable } from "../../src/simulation/is-stable.js";
import { expectClose } from "../support/expect-close.js";

const p = (kp: number, ki = 0, kd = 0, tf = 0): PidController => ({ kind: "pid", kp, ki, kd, tf });
const cubic: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
const scenario = { kind: "setpoint-step", horizon: 30, dt: 0.01 } as const;

describe("closedLoopCharacteristicPolynomial", () => {
  it("closedLoopCharacteristicPolynomial(1/(s + 1), PID) expands den_p·den_c + num_p·num_c", () => {
    // Closed form by hand: (s + 1)(tf s² + s) + (kp tf + kd)s² + (kp + ki tf)s + ki
    //   = tf s³ + (tf + 1 + kp tf + kd)s² + (1 + kp + ki tf)s + ki.
    const [kp, ki, kd, tf] = [2, 0.5, 0.3, 0.1];
    const chi = closedLoopCharacteristicPolynomial({ kind: "transfer-function", num: [1], den: [1, 1], delay: 0 }, p(kp, ki, kd, tf));
    const expected = [tf, tf + 1 + kp * tf + kd, 1 + kp + ki * tf, ki];
    expected.forEach((c, i) => expectClose(chi[i], c, 1e-15));
  });

  it("closedLoopCharacteristicPolynomial adds no root at 0 for a PD controller", () => {
    // C = kp + kd s/(tf s + 1) has no integrator, so χ(0) = den_p(0) + kp·num_p(0) = 1 + kp ≠ 0.
    const chi = closedLoopCharacteristicPolynomial(cubic, p(2, 0, 1, 0.1));
    expect(chi).toHaveLength(5);
    expectClose(chi[chi.length - 1], 3, 1e-15);
  });
});

describe("stability verdict", () => {
  it("1/(s + 1)³ under P control is stable iff kp < 8 (Routh)", () => {
    // Routh (E. J. Routh, A Treatise on the Stability of a Given State of Motion, 1877): the cubic
    // s³ + a₂s² + a₁s + a₀ is stable iff all aᵢ > 0 and a₂a₁ > a₀; here a₂ = a₁ = 3, a₀ = 1 + kp.
    expect(isStable(closedLoopPoles(cubic, p(7.9)))).toBe(true);
    expect(isStable(closedLoopPoles(cubic, p(8.1)))).toBe(false);
    // kp = 8: χ = (s + 3)(s² + 3), a pair on the imaginary axis at ±j√3, which counts as unstable.
    const marginal = closedLoopPoles(cubic, p(8));
    expectClose(Math.abs(marginal[1].im), Math.sqrt(3), 1e-12);
    expect(isStable(marginal)).toBe(false);
  });

  it("evaluateCandidate marks kp = 9 on 1/(s + 1)³ unstable with null scores", () => {
    const result = evaluateCandidate(cubic, p(9), scenario, ["iae", "ise", "itae", "effort"]);
    expect(result.status).toBe("unstable");
    expect(result.scores).toBeNull();
    expect(result.poles).toHaveLength(3);
    expect(result.poles.some((pole) => pole.re > 0)).toBe(true);
  });

  it("evaluateCandidate scores a stable PID with exactly the requested criteria", () => {
    const result = evaluateCandidate(cubic, p(1, 0.5, 0.5, 0.05), scenario, ["iae", "effort"]);
    expect(result.status).toBe("stable");
    expect(Object.keys(result.scores ?? {})).toEqual(["iae", "effort"]);
    expect(result.scores!.iae).toBeGreaterThan(0);
  });

  it("evaluateCandidate calls a plant with a pole at 0 and no controller action unstable", () => {
    // 1/s with C = 0: χ(s) = s, a closed-loop pole exactly at 0 — marginal, not stable.
    const integrator: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 0], delay: 0 };
    expect(evaluateCandidate(integrator, p(0), scenario, ["iae"]).status).toBe("unstable");
    expect(evaluateCandidate(integrator, p(1), scenario, ["iae"]).status).toBe("stable");
  });

  it("evaluateCandidate names an unknown criterion", () => {
    expect(() => evaluateCandidate(cubic, p(1), scenario, ["iae", "notACriterion" as "iae"])).toThrow(/criteria/);
  });

  it("the Padé verdict for e^(−s)/(s + 1) under P control flips at the ultimate gain", () => {
    // Closed form (Nyquist): the loop K·e^(−jω)/(jω + 1) crosses −1 where ω + atan ω = π,
    // at the gain K_u = √(1 + ω²) ≈ 2.26. Found here by bisection, independently of the code.
    let [lo, hi] = [0, Math.PI];
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (mid + Math.atan(mid) < Math.PI) lo = mid;
      else hi = mid;
    }
    const ku = Math.sqrt(1 + lo * lo);
    const delayed: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 1 };
    expect(isStable(closedLoopPoles(delayed, p(0.97 * ku)))).toBe(true);
    expect(isStable(closedLoopPoles(delayed, p(1.03 * ku)))).toBe(false);
  });

  it("evaluateCandidate calls a candidate diverged when its simulated trace leaves the bound", () => {
    // 1/(s − 1) under kp = 3 with the actuator limited to [−1, 1]: the verdict ignores the limits and
    // sees s − 1 + 3 = s + 2 (stable). But once x > 1 the plant needs u < −1 to turn back: u = 3(1 − x)
    // reaches −1 at x = 4/3, from there x' = x − 1 > 0, so x − 1 grows as e^t (closed form) until it
    // leaves the divergence bound; the candidate must then be "diverged" with null scores, not ranked.
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, -1], delay: 0, actuator: { min: -1, max: 1 } };
    expect(isStable(closedLoopPoles(plant, p(3)))).toBe(true);
    const result = evaluateCandidate(plant, p(3), { kind: "setpoint-step", horizon: 30, dt: 0.01 }, ["iae"]);
    expect(result.status).toBe("diverged");
    expect(result.scores).toBeNull();
  });
});
