import { describe, expect, it } from "vitest";
import { exactQuadraticCosts } from "../../src/optimal/exact-quadratic-costs.js";
import type { Plant } from "../../src/plants/plant.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { criterionOptionsSchema } from "../../src/sweeps/sweep-input.js";
import { expectClose } from "../support/expect-close.js";

// The seeded Ember 200 plate, G = 1/((8s + 1)(2s + 1)), under a filtered PID.
const EMBER_200: Plant = { kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 0 };
const PID = { kind: "pid", kp: 3, ki: 0.4, kd: 2, tf: 0.1 } as const;
const QUADRATIC = ["ise", "effort", "quadratic"] as const;

describe("evaluateCandidate with criterion.horizon \"infinite\"", () => {
  it("evaluateCandidate(…, { horizon: \"infinite\" }) returns exactQuadraticCosts' ise, effort and quadratic", () => {
    // Reference: exactQuadraticCosts itself (Lyapunov form, Kwakernaak & Sivan 1972, §1.11), checked against
    // closed forms in test/optimal/exact-quadratic-costs.test.ts; the two must agree to rounding.
    const exact = exactQuadraticCosts(EMBER_200, PID, { kind: "setpoint-step" }, { q: 2, r: 0.5 });
    const result = evaluateCandidate(EMBER_200, PID, { kind: "setpoint-step", horizon: 5, dt: 0.01 }, [...QUADRATIC, "iae"], {
      criterion: { q: 2, r: 0.5, horizon: "infinite" },
    });
    expect(exact.ok).toBe(true);
    expect(result.status).toBe("stable");
    if (!exact.ok || !result.scores) return;
    expect(result.scores.ise).toBe(exact.ise);
    expect(result.scores.effort).toBe(exact.effort);
    expect(result.scores.quadratic).toBe(exact.quadratic);
    // Other criteria keep the simulated horizon: IAE over 5 s is finite and positive.
    expect(result.scores.iae).toBeGreaterThan(0);
  });

  it("differs from the simulated value on a short horizon and matches it on a long one", () => {
    // On 5 s the loop (slowest closed-loop pole ≈ −0.16 rad/s, by numpy.roots) has not settled: the simulated ISE misses the tail.
    // On 150 s the tail e^(−2·0.16·150) is below 1e-20; with dt = 1 ms the trapezoid's error on the
    // derivative kick (u(0⁺) = kp + kd/tf = 23) stays under 1e-4 relative (common practice: O(dt²/tf²)).
    const infinite = evaluateCandidate(EMBER_200, PID, { kind: "setpoint-step", horizon: 5, dt: 0.01 }, QUADRATIC, { criterion: { horizon: "infinite" } });
    const short = evaluateCandidate(EMBER_200, PID, { kind: "setpoint-step", horizon: 5, dt: 0.01 }, QUADRATIC);
    const long = evaluateCandidate(EMBER_200, PID, { kind: "setpoint-step", horizon: 150, dt: 0.001 }, QUADRATIC, { criterion: { horizon: "simulated" } });
    if (!infinite.scores || !short.scores || !long.scores) throw new Error("expected stable scores");
    expect(Math.abs(short.scores.ise - infinite.scores.ise)).toBeGreaterThan(0.01 * infinite.scores.ise);
    expectClose(long.scores.ise, infinite.scores.ise, 1e-8, 1e-5);
    expectClose(long.scores.effort, infinite.scores.effort, 1e-8, 1e-4);
    expectClose(long.scores.quadratic, infinite.scores.quadratic, 1e-8, 1e-4);
  });

  it("gives NaN (does not apply) for dead time, actuator limits, sampled controllers, load and noise", () => {
    // The Lyapunov form needs a finite-dimensional, linear, continuous loop under a step at t = 0 (see exactQuadraticCosts).
    const scenario = { kind: "setpoint-step", horizon: 60, dt: 0.01 } as const;
    const options = { criterion: { horizon: "infinite" } } as const;
    const cases = [
      evaluateCandidate({ ...EMBER_200, delay: 0.5 }, { ...PID, kd: 0, tf: 0 }, scenario, QUADRATIC, options),
      evaluateCandidate({ ...EMBER_200, actuator: { min: 0, max: 5 } } as Plant, PID, scenario, QUADRATIC, options),
      evaluateCandidate(EMBER_200, { ...PID, sampleTime: 0.1 }, scenario, QUADRATIC, options),
      evaluateCandidate(EMBER_200, PID, { kind: "combined", horizon: 60, dt: 0.01 }, QUADRATIC, options),
      evaluateCandidate(EMBER_200, PID, { ...scenario, noise: { sd: 0.01, seed: 1 } }, QUADRATIC, options),
    ];
    for (const result of cases) {
      expect(result.status).toBe("stable");
      expect(result.scores?.ise).toBeNaN();
      expect(result.scores?.effort).toBeNaN();
      expect(result.scores?.quadratic).toBeNaN();
    }
  });

  it("criterionOptionsSchema accepts horizon \"simulated\" and \"infinite\" and names the field otherwise", () => {
    expect(criterionOptionsSchema.parse({ horizon: "infinite" }).horizon).toBe("infinite");
    const bad = criterionOptionsSchema.safeParse({ horizon: "forever" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.path).toEqual(["horizon"]);
  });
});
