import { describe, expect, it } from "vitest";
import type { Controller } from "../../src/controllers/controller.js";
import { controllerRealization } from "../../src/controllers/controller-realization.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import type { NonlinearPlant } from "../../src/plants/nonlinear.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { isEquilibrium, linearizedLoopStability } from "../../src/stability/linearized-loop-stability.js";
import { expectClose } from "../support/expect-close.js";

/**
 * A pendulum with torque input, θ'' = (u − m·g·l·sin θ − b·θ')/(m·l²), started upright (θ = π, at
 * rest, u = 0: an equilibrium since sin π = 0). Linearised there (sin(π + δ) = −δ, closed form):
 *   m·l²·δ'' = u + m·g·l·δ − b·δ',
 * so under P control u = kp(r − y), y = θ, the closed loop's characteristic polynomial is
 *   m·l²·s² + b·s + (kp − m·g·l),
 * stable (Routh, second order: all coefficients positive) iff kp > m·g·l, with a real pole in the
 * right half-plane when kp < m·g·l. Lyapunov's indirect method (Khalil, Nonlinear Systems, 2002,
 * Theorem 4.7) carries both verdicts to the nonlinear loop near the equilibrium.
 */
const m = 0.5;
const g = 9.81;
const l = 0.8;
const b = 0.2;
const mgl = m * g * l;
const upright: NonlinearPlant = {
  kind: "nonlinear",
  states: ["th", "w"],
  parameters: { m, g, l, b },
  derivatives: ["w", "(u - m*g*l*sin(th) - b*w)/(m*l*l)"],
  output: "th",
  initial: [Math.PI, 0],
};
const p = (kp: number, sampleTime?: number): Controller => (sampleTime === undefined ? { kind: "p", kp } : { kind: "p", kp, sampleTime });

describe("linearizedLoopStability", () => {
  it("the upright pendulum under weak P control is locally unstable; its poles are the closed form's", () => {
    const kp = 0.5 * mgl;
    const local = linearizedLoopStability(upright, controllerRealization(p(kp)), undefined);
    expect(local.verdict).toBe("unstable");
    // Roots of m l² s² + b s + (kp − mgl), closed form.
    const a2 = m * l * l;
    const disc = Math.sqrt(b * b - 4 * a2 * (kp - mgl));
    const expected = [(-b - disc) / (2 * a2), (-b + disc) / (2 * a2)];
    const poles = local.poles.map((s) => s.re).sort((x, y) => x - y);
    poles.forEach((s, i) => expectClose(s, expected[i], 1e-6)); // central differences, h = 1e-6: O(h²) plus rounding
    local.poles.forEach((s) => expectClose(s.im, 0, 1e-12));
  });

  it("under strong P control it is locally stable, with the closed form's complex pair", () => {
    const kp = 3 * mgl;
    const local = linearizedLoopStability(upright, controllerRealization(p(kp)), undefined);
    expect(local.verdict).toBe("stable");
    const a2 = m * l * l;
    const re = -b / (2 * a2);
    const im = Math.sqrt(4 * a2 * (kp - mgl) - b * b) / (2 * a2);
    const pair = [...local.poles].sort((x, y) => x.im - y.im);
    expectClose(pair[0].re, re, 1e-6);
    expectClose(pair[1].im, im, 1e-6);
  });

  it("evaluateCandidate calls the weak loop unstable, where the simulation alone finds a bounded swing", () => {
    // Without the local verdict the pendulum falls from the top and swings around the hanging
    // position: bounded, so divergence detection would have scored it "stable".
    const scenario = { kind: "setpoint-step" as const, setpoint: 0.05, horizon: 20, dt: 0.01 };
    const trace = simulateLoop(upright, p(0.5 * mgl), scenario);
    expect(trace.status).toBe("ok");
    const result = evaluateCandidate(upright, p(0.5 * mgl), scenario, ["iae"]);
    expect(result.status).toBe("unstable");
    expect(result.scores).toBeNull();
    expect(result.poles.some((s) => s.re > 0)).toBe(true);
    expect(evaluateCandidate(upright, p(3 * mgl), scenario, ["iae"]).status).toBe("stable");
  });

  it("a sampled controller is judged on the sampled linearisation (z-plane poles)", () => {
    // Strong P at a short sample time stays stable; at a long one (0.5 s against a pendulum period
    // 2π/√((kp − mgl)/(m l²)) ≈ 0.9 s) the held input makes the loop unstable.
    const kp = 3 * mgl;
    const short = linearizedLoopStability(upright, controllerRealization(p(kp, 0.01)), 0.01);
    const long = linearizedLoopStability(upright, controllerRealization(p(kp, 0.5)), 0.5);
    expect(short.plane).toBe("z");
    expect(short.verdict).toBe("stable");
    expect(long.verdict).toBe("unstable");
    // z = e^(s h) for the short sample time: the discrete poles map back to the continuous ones
    // only approximately (the ZOH adds lag), so check the modulus against e^(Re s·h) to O(h).
    const reS = -b / (2 * m * l * l);
    short.poles.forEach((z) => expectClose(Math.hypot(z.re, z.im), Math.exp(reS * 0.01), 2e-3));
  });

  it("an operating point that is not at rest leaves the verdict to the simulation", () => {
    const tilted: NonlinearPlant = { ...upright, initial: [3, 0] };
    expect(isEquilibrium(tilted)).toBe(false);
    expect(isEquilibrium(upright)).toBe(true);
    expect(linearizedLoopStability(tilted, controllerRealization(p(0.5 * mgl)), undefined).verdict).toBe("inconclusive");
  });
});
