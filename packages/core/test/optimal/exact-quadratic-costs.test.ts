import { describe, expect, it } from "vitest";
import { exactQuadraticCosts } from "../../src/optimal/exact-quadratic-costs.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import type { Plant } from "../../src/plants/plant.js";
import { expectClose } from "../support/expect-close.js";

const CUBIC: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };

describe("exactQuadraticCosts", () => {
  it("exactQuadraticCosts gives the 2nd-order prototype's ISE (1 + 4ζ²)/(4ζωn)", () => {
    // Closed form: the double integrator under u = −[ωn², 2ζωn]x + ωn²r has T(s) = ωn²/(s² + 2ζωn s + ωn²),
    // and the unit-step ISE of that prototype is (1 + 4ζ²)/(4ζωn) (Newton, Gould & Kaiser 1957, ISE tables).
    const plant: Plant = { kind: "state-space", A: [[0, 1], [0, 0]], B: [[0], [1]], C: [[1, 0]], D: [[0]] };
    for (const [zeta, wn] of [[0.7, 2], [0.3, 1], [1.5, 0.5]]) {
      const result = exactQuadraticCosts(plant, { kind: "state-feedback", k: [wn * wn, 2 * zeta * wn], n: wn * wn }, { kind: "setpoint-step" });
      expect(result.ok).toBe(true);
      if (result.ok) expectClose(result.ise, (1 + 4 * zeta * zeta) / (4 * zeta * wn), 1e-13, 1e-11);
    }
  });

  it("exactQuadraticCosts on a first-order P loop gives the closed-form effort", () => {
    // Closed form: G = 1/(τs + 1), u = K e: e(t) = 1/(1+K) + K/(1+K)·e^(−t/τ'), τ' = τ/(1+K), u∞ = K/(1+K),
    // so u − u∞ = K²/(1+K)·e^(−t/τ') (the kick u(0⁺) = K included) and Effort = (K²/(1+K))²·τ'/2;
    // ISE is infinite (the offset 1/(1+K) never decays).
    const tau = 2;
    const k = 3;
    const result = exactQuadraticCosts({ kind: "transfer-function", num: [1], den: [tau, 1], delay: 0 }, { kind: "p", kp: k }, { kind: "setpoint-step" });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const amplitude = k - k / (1 + k);
    expectClose(result.effort, (amplitude * amplitude * tau) / (1 + k) / 2, 1e-14, 1e-12);
    expect(result.ise).toBe(Infinity);
    expectClose(result.uInfinity, k / (1 + k), 1e-15, 1e-13);
  });

  it("exactQuadraticCosts equals the simulated ISE, effort and quadratic cost of PID loops on 1/(s+1)³", () => {
    // Cross-check against the engine's exact-at-the-grid simulation (trapezoidal rule, error O(dt²)) over a
    // horizon long enough for the tail to vanish (slowest closed-loop pole ≈ −0.2 ⇒ e^(−2·0.2·90) ≈ 2e-16 in the squared error). The derivative
    // kick u(0⁺) = kp + kd/tf is part of the trajectory in both: only the trapezoid's O(dt²/tf²) error remains.
    const candidates = [
      { kind: "pid", kp: 1.2, ki: 0.5, kd: 0.8, tf: 0.08 },
      { kind: "pid", kp: 0.6, ki: 0.25, kd: 0, tf: 0 },
      { kind: "pid", kp: 2, ki: 0.6, kd: 1.5, tf: 0.15 },
    ] as const;
    for (const controller of candidates) {
      const exact = exactQuadraticCosts(CUBIC, controller, { kind: "setpoint-step" }, { q: 1, r: 0.3 });
      const simulated = evaluateCandidate(CUBIC, controller, { kind: "setpoint-step", horizon: 90, dt: 0.0005 }, ["ise", "effort", "quadratic"], {
        criterion: { q: 1, r: 0.3 },
        poles: false,
      });
      expect(exact.ok).toBe(true);
      expect(simulated.status).toBe("stable");
      if (!exact.ok || !simulated.scores) continue;
      expectClose(exact.ise, simulated.scores.ise, 1e-7, 1e-6);
      expectClose(exact.effort, simulated.scores.effort, 1e-7, 2e-5);
      expectClose(exact.quadratic, simulated.scores.quadratic, 1e-7, 2e-5);
      expectClose(exact.quadratic, exact.ise + 0.3 * exact.effort, 1e-14, 1e-13);
    }
  });

  it("exactQuadraticCosts includes a plant feedthrough's jump at t = 0⁺", () => {
    // G = (s + 2)/(s + 1) (D = 1) under PI: y(0⁺) = D·u(0⁺) ≠ 0; compared with a fine simulation.
    const plant: Plant = { kind: "transfer-function", num: [1, 2], den: [1, 1], delay: 0 };
    const controller = { kind: "pi", kp: 0.5, ki: 0.8 } as const;
    const exact = exactQuadraticCosts(plant, controller, { kind: "setpoint-step", setpoint: 2 });
    const simulated = evaluateCandidate(plant, controller, { kind: "setpoint-step", horizon: 60, dt: 0.0005, setpoint: 2 }, ["ise", "effort"], { poles: false });
    expect(exact.ok).toBe(true);
    if (!exact.ok || !simulated.scores) return;
    expectClose(exact.ise, simulated.scores.ise, 1e-8, 1e-6);
    expectClose(exact.effort, simulated.scores.effort, 1e-8, 1e-6);
  });

  it("exactQuadraticCosts returns a reason for dead time, limits, sampling, a late load and an unstable loop", () => {
    const pid = { kind: "pid", kp: 1, ki: 0.5, kd: 0.2, tf: 0.02 } as const;
    const cases: [Plant, object, object][] = [
      [{ ...CUBIC, delay: 1 } as Plant, pid, { kind: "setpoint-step" }],
      [{ ...CUBIC, actuator: { max: 2 } } as Plant, pid, { kind: "setpoint-step" }],
      [CUBIC, { ...pid, sampleTime: 0.1 }, { kind: "setpoint-step" }],
      [CUBIC, pid, { kind: "load-step", load: { size: 1, time: 3 } }],
      [CUBIC, { kind: "p", kp: 20 }, { kind: "setpoint-step" }], // kp > 8 destabilises 1/(s+1)³ (Routh)
    ];
    for (const [plant, controller, scenario] of cases) {
      const result = exactQuadraticCosts(plant, controller as never, scenario as never);
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.reason.length).toBeGreaterThan(10);
    }
  });
});
