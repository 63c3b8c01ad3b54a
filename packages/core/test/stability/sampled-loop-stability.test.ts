import { describe, expect, it } from "vitest";
import type { Controller } from "../../src/controllers/controller.js";
import { controllerRealization } from "../../src/controllers/controller-realization.js";
import { evaluateCandidate, isContinuousLoopStable } from "../../src/evaluation/evaluate-candidate.js";
import { polynomialRoots } from "../../src/linear-algebra/polynomial-roots.js";
import { linearPlantModel } from "../../src/plants/linear-plant-model.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { sampledLoopCharacteristicPolynomial, sampledLoopStability } from "../../src/stability/sampled-loop-stability.js";
import { isSchurStable } from "../../src/stability/schur-cohn.js";
import { expectClose } from "../support/expect-close.js";

const firstOrder = (delay = 0): TransferFunctionPlant => ({ kind: "transfer-function", num: [1], den: [1, 1], delay });
const sampledPi = (kp: number, ki: number, sampleTime: number): Controller => ({ kind: "pi", kp, ki, sampleTime });

const verdictOf = (plant: TransferFunctionPlant, controller: Controller) => {
  const model = linearPlantModel(plant);
  return sampledLoopStability({ plant: model.ss, delay: model.delay, controller: controllerRealization(controller), sampleTime: controller.sampleTime! });
};

/**
 * Worked by hand. G(s) = 1/(s + 1) sampled with ZOH at h: x_{k+1} = a x_k + b u_k, a = e^(−h),
 * b = 1 − a (Åström & Wittenmark, Computer-Controlled Systems, 1997, §2.3, Table 2.1). The PI as the
 * simulation updates it (its integrator's exact ZOH step at h, r = 0): x_i,k+1 = x_i,k − h·y_k,
 * u_k = ki·x_i,k − kp·y_k, i.e. K(z) = −(kp(z − 1) + ki·h)/(z − 1). The closed loop:
 *
 *   χ(z) = (z − a)(z − 1) + b(kp(z − 1) + ki·h) = z² + a₁z + a₀,
 *   a₁ = b·kp − 1 − a,   a₀ = a − b·kp + b·ki·h.
 *
 * Jury's conditions for a quadratic (Jury 1964; Åström & Wittenmark 1997, §3.2, Example 3.2):
 * χ(1) > 0, χ(−1) > 0, |a₀| < 1. Here χ(1) = b·ki·h > 0 always and
 * χ(−1) = 2(1 + a) − 2b·kp + b·ki·h.
 * kp = 3, ki = 1:
 *   h = 1:   a = 0.367879, b = 0.632121: χ(−1) = 2.735759 − 3.792723 + 0.632121 = −0.424843 < 0
 *            → a real root below −1: UNSTABLE (a₀ = −0.896362, a₁ = 0.528483).
 *   h = 0.1: a = 0.904837, b = 0.095163: χ(−1) = 3.809675 − 0.570975 + 0.009516 = 3.248216 > 0,
 *            a₀ = 0.904837 − 0.285488 + 0.009516 = 0.628865, |a₀| < 1 → STABLE.
 * In continuous time the same PI on 1/(s + 1) gives χ(s) = s² + (1 + kp)s + ki, stable for every
 * kp > −1, ki > 0 (Routh).
 */
describe("sampled PI on 1/(s + 1): the discrete closed loop decides", () => {
  const kp = 3;
  const ki = 1;
  const quadratic = (h: number) => {
    const a = Math.exp(-h);
    const b = 1 - a;
    return { a1: b * kp - 1 - a, a0: a - b * kp + b * ki * h };
  };

  it("h = 1 s: χ(−1) < 0 by hand, so unstable; the continuous loop is stable", () => {
    const { a1, a0 } = quadratic(1);
    expectClose(1 - a1 + a0, -0.424843, 1e-6); // χ(−1), hand value above
    expect(isContinuousLoopStable(firstOrder(), sampledPi(kp, ki, 1))).toBe(true);
    const verdict = verdictOf(firstOrder(), sampledPi(kp, ki, 1));
    expect(verdict.stable).toBe(false);
    // The eigenvalues of the closed-loop matrix are the roots of the hand polynomial.
    const roots = polynomialRoots([1, a1, a0]).map((z) => z.re).sort((x, y) => x - y);
    const poles = verdict.poles.map((z) => z.re).sort((x, y) => x - y);
    poles.forEach((z, i) => expectClose(z, roots[i], 1e-12));
    expect(Math.min(...poles)).toBeLessThan(-1);
    expect(isSchurStable([1, a1, a0])).toBe(false);
    const result = evaluateCandidate(firstOrder(), sampledPi(kp, ki, 1), { kind: "setpoint-step", horizon: 20, dt: 0.01 }, ["iae"]);
    expect(result.status).toBe("unstable");
    expect(result.scores).toBeNull();
    expect(result.samplePoles).toHaveLength(2);
  });

  it("h = 0.1 s: Jury's conditions hold by hand, so stable, and it is scored", () => {
    const { a1, a0 } = quadratic(0.1);
    expectClose(a0, 0.628865, 1e-6);
    expect(1 + a1 + a0).toBeGreaterThan(0);
    expect(1 - a1 + a0).toBeGreaterThan(0);
    expect(verdictOf(firstOrder(), sampledPi(kp, ki, 0.1)).stable).toBe(true);
    expect(isSchurStable([1, a1, a0])).toBe(true);
    const result = evaluateCandidate(firstOrder(), sampledPi(kp, ki, 0.1), { kind: "setpoint-step", horizon: 20, dt: 0.01 }, ["iae"]);
    expect(result.status).toBe("stable");
    expect(result.scores!.iae).toBeGreaterThan(0);
  });

  it("the verdict agrees with the simulated loop: the unstable case grows, the stable one settles", () => {
    // Independent check: the grid loop (the same ZOH loop, Ts a multiple of dt) run for 60 s.
    const grow = simulateLoop(firstOrder(), sampledPi(kp, ki, 1), { kind: "setpoint-step", horizon: 60, dt: 0.01 });
    const settle = simulateLoop(firstOrder(), sampledPi(kp, ki, 0.1), { kind: "setpoint-step", horizon: 60, dt: 0.01 });
    const tail = (e: Float64Array) => Math.max(...Array.from(e.subarray(e.length - 200)).map(Math.abs));
    expect(grow.status === "diverged" || tail(grow.e) > 10).toBe(true);
    expect(tail(settle.e)).toBeLessThan(1e-6);
  });
});

/**
 * Dead time of one whole sample, θ = h = 1 s, P control on 1/(s + 1): u_{k−1} reaches the plant, so
 * x_{k+1} = a x_k + b u_{k−1}, u_k = −kp x_k and χ(z) = z(z − a) + b·kp = z² − a z + b·kp (closed form
 * by hand). Jury (as above): χ(1) = 1 − a + b·kp > 0, χ(−1) = 1 + a + b·kp > 0, |b·kp| < 1, so the loop
 * is stable iff kp < 1/b = 1/(1 − e^(−1)) = 1.581977.
 */
describe("whole-sample dead time", () => {
  it("P on e^(−s)/(s + 1) at h = 1: stable iff kp < 1/(1 − e^(−1)) (Jury, by hand)", () => {
    const limit = 1 / (1 - Math.exp(-1));
    expectClose(limit, 1.581977, 1e-6);
    const p = (kp: number): Controller => ({ kind: "p", kp, sampleTime: 1 });
    expect(verdictOf(firstOrder(1), p(limit * 0.99)).stable).toBe(true);
    expect(verdictOf(firstOrder(1), p(limit * 1.01)).stable).toBe(false);
    const poles = verdictOf(firstOrder(1), p(1)).poles.map((z) => Math.hypot(z.re, z.im));
    // |z|² = b·kp for the complex pair (product of the roots), = 1 − e^(−1) at kp = 1.
    poles.forEach((r) => expectClose(r * r, 1 - Math.exp(-1), 1e-12));
  });
});

describe("fractional dead time and long delays", () => {
  const loopOf = (plant: TransferFunctionPlant, controller: Controller) => {
    const model = linearPlantModel(plant);
    return { plant: model.ss, delay: model.delay, controller: controllerRealization(controller), sampleTime: controller.sampleTime! };
  };
  const moduli = (zs: { re: number; im: number }[]) => zs.map((z) => Math.hypot(z.re, z.im)).sort((x, y) => x - y);

  it("θ = 2.5 h: the closed-loop matrix's eigenvalues are the roots of χ(z) built from pulse transfer functions", () => {
    // Two independent constructions of the same loop (state matrix with a shift register vs.
    // z^(m+δ)·D_p·D_c − N_c·N_p from the modified z-transform) must have the same poles.
    const loop = loopOf(firstOrder(1), { kind: "pi", kp: 0.8, ki: 0.3, sampleTime: 0.4 });
    const eig = moduli(sampledLoopStability(loop, { method: "eigenvalues" }).poles);
    const chi = sampledLoopCharacteristicPolynomial(loop);
    expect(chi).toHaveLength(1 + 1 + 1 + 3); // n + n_c + m + δ = 1 + 1 + 2 + 1 = 5
    moduli(polynomialRoots(chi)).forEach((r, i) => expectClose(r, eig[i], 1e-9));
  });

  it("the eigenvalue verdict and the Schur–Cohn verdict agree across a gain sweep, and the critical gain lies between", () => {
    const eig: boolean[] = [];
    const jury: boolean[] = [];
    for (const kp of [0.2, 0.5, 0.8, 1.1, 1.4, 1.7, 2.0, 3.0]) {
      const loop = loopOf(firstOrder(1), { kind: "pi", kp, ki: 0.3, sampleTime: 0.4 });
      eig.push(sampledLoopStability(loop, { method: "eigenvalues" }).stable as boolean);
      jury.push(sampledLoopStability(loop, { method: "schur-cohn" }).stable as boolean);
    }
    expect(jury).toEqual(eig);
    expect(eig[0]).toBe(true);
    expect(eig[eig.length - 1]).toBe(false);
  });

  it("a long dead time (m = 150 samples) goes to the Schur–Cohn recursion and agrees with the simulated loop", () => {
    // θ = 15 s, h = 0.1 s: order 1 + 1 + 150 > MAX_SAMPLED_EIGEN_ORDER. A slow PI (kp = 0.2, ki = 0.02)
    // is stable, a hot one (kp = 2) is not: the continuous loop's ultimate gain on e^(−15s)/(s + 1) is
    // Ku = √(1 + ω²) ≈ 1.02 with 15ω + atan ω = π, ω ≈ 0.197 rad/s (closed form of the phase crossover).
    const plant = firstOrder(15);
    const calm: Controller = { kind: "pi", kp: 0.2, ki: 0.02, sampleTime: 0.1 };
    const hot: Controller = { kind: "pi", kp: 2, ki: 0.2, sampleTime: 0.1 };
    const calmVerdict = sampledLoopStability(loopOf(plant, calm));
    expect(calmVerdict.method).toBe("schur-cohn");
    expect(calmVerdict.stable).toBe(true);
    expect(sampledLoopStability(loopOf(plant, hot)).stable).toBe(false);
    const scenario = { kind: "setpoint-step", horizon: 600, dt: 0.1 } as const;
    const tail = (e: Float64Array) => Math.max(...Array.from(e.subarray(e.length - 100)).map(Math.abs));
    expect(tail(simulateLoop(plant, calm, scenario).e)).toBeLessThan(1e-3);
    const hotTrace = simulateLoop(plant, hot, scenario);
    expect(hotTrace.status === "diverged" || tail(hotTrace.e) > 1).toBe(true);
  });
});
