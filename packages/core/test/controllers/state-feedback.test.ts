import { describe, expect, it } from "vitest";
import type { StateSpacePlant } from "../../src/plants/state-space.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

describe("state feedback u = −K x + N r", () => {
  it("places the poles of the double integrator at −1, −2 and reaches r (closed form)", () => {
    // Pole placement by coefficient matching (Franklin, Powell & Emami-Naeini 2002, §7.5):
    // A − BK = [0 1; −k₁ −k₂] has s² + k₂s + k₁ = (s + 1)(s + 2), so K = [2, 3]; N = k₁ = 2 for unit DC gain.
    // Y(s) = 2/(s(s + 1)(s + 2)) ⇒ y(t) = 1 − 2e^(−t) + e^(−2t).
    const plant: StateSpacePlant = { kind: "state-space", A: [[0, 1], [0, 0]], B: [[0], [1]], C: [[1, 0]], D: [[0]] };
    const controller = { kind: "state-feedback" as const, k: [2, 3], n: 2 };
    const result = evaluateCandidate(plant, controller, { kind: "setpoint-step", horizon: 10, dt: 0.01 }, ["iae"]);
    expect(result.status).toBe("stable");
    const poles = result.poles.map((p) => p.re).sort((a, b) => a - b);
    expectClose(poles[0], -2, 1e-9);
    expectClose(poles[1], -1, 1e-9);
    result.poles.forEach((p) => expectClose(p.im, 0, 1e-9));
    const trace = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: 10, dt: 0.01 });
    for (let k = 0; k < trace.t.length; k++) {
      const t = trace.t[k];
      expectClose(trace.y[k], 1 - 2 * Math.exp(-t) + Math.exp(-2 * t), 1e-12);
    }
    expectClose(trace.yInfinity, 1, 1e-12);
  });

  it("names controller.k when the gain count differs from the plant order", () => {
    const plant: StateSpacePlant = { kind: "state-space", A: [[0, 1], [0, 0]], B: [[0], [1]], C: [[1, 0]], D: [[0]] };
    expect(() => simulateLoop(plant, { kind: "state-feedback", k: [1], n: 1 }, { kind: "setpoint-step", horizon: 1, dt: 0.01 })).toThrow(/controller\.k/);
  });
});
