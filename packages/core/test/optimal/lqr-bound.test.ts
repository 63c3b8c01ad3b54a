import { describe, expect, it } from "vitest";
import { boundCurve } from "../../src/optimal/bound-curve.js";
import { exactQuadraticCosts } from "../../src/optimal/exact-quadratic-costs.js";
import { lqrBound } from "../../src/optimal/lqr-bound.js";
import type { Plant } from "../../src/plants/plant.js";
import { isLoopStable } from "../../src/evaluation/evaluate-candidate.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

const CUBIC: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };

describe("lqrBound", () => {
  it("lqrBound on an integrator 1/s gives Δr²·√(q·r)", () => {
    // Closed form: x̃' = ũ, x̃(0) = −Δr, J = ∫(q x̃² + r ũ²): the scalar CARE −p²/r + q = 0 gives p = √(q r).
    for (const [q, r, step] of [[1, 1, 1], [4, 0.25, 2], [0.5, 8, -1]]) {
      const bound = lqrBound({ kind: "transfer-function", num: [1], den: [1, 0], delay: 0 }, { kind: "setpoint-step", setpoint: step }, { q, r });
      expect(bound.ok).toBe(true);
      if (bound.ok) expectClose(bound.cost, step * step * Math.sqrt(q * r), 1e-14, 1e-12);
    }
  });

  it("lqrBound on a first-order lag gives the scalar CARE value and u∞ = 1/G(0)", () => {
    // Closed form: G = k/(τs + 1) = (k/τ)/(s + 1/τ), realised as A = −1/τ, B = 1, C = k/τ; x∞ = τ/k,
    // p solves 2ap − p²/r + q c² = 0 ⇒ p = r(a + √(a² + q c²/r)); bound = p·x∞².
    const k = 2;
    const tau = 4;
    const [q, r] = [1, 0.5];
    const bound = lqrBound({ kind: "transfer-function", num: [k], den: [tau, 1], delay: 0 }, { kind: "setpoint-step" }, { q, r });
    expect(bound.ok).toBe(true);
    if (!bound.ok) return;
    const a = -1 / tau;
    const c = k / tau;
    const p = r * (a + Math.sqrt(a * a + (q * c * c) / r));
    expectClose(bound.cost, p * (tau / k) ** 2, 1e-14, 1e-12);
    expectClose(bound.uInfinity, 1 / k, 1e-15, 1e-13);
  });

  it("lqrBound is below the exact quadratic cost of every one of 400 random stable PID candidates on 1/(s+1)³", () => {
    // The bound is the minimum over ALL inputs (Kalman 1960; Anderson & Moore 1990, §3.3), so no
    // candidate may score below it; the candidates' J is exact (Lyapunov), not simulated.
    const random = seededRandom(2026);
    for (const [q, r] of [[1, 1], [1, 0.01], [1, 10]]) {
      const bound = lqrBound(CUBIC, { kind: "setpoint-step" }, { q, r });
      expect(bound.ok).toBe(true);
      if (!bound.ok) continue;
      let checked = 0;
      let closest = Infinity;
      for (let i = 0; i < 400; i++) {
        const kp = 0.05 + random() * 6;
        const ki = 0.01 + random() * 2;
        const kd = random() * 4;
        const controller = { kind: "pid", kp, ki, kd, tf: kd === 0 ? 0 : kd / (10 * kp) } as const;
        if (!isLoopStable(CUBIC, controller)) continue;
        const exact = exactQuadraticCosts(CUBIC, controller, { kind: "setpoint-step" }, { q, r });
        if (!exact.ok) continue;
        checked++;
        closest = Math.min(closest, exact.quadratic / bound.cost);
        expect(exact.quadratic).toBeGreaterThanOrEqual(bound.cost);
      }
      expect(checked).toBeGreaterThan(150);
      expect(closest).toBeGreaterThan(1);
    }
  });

  it("lqrBound over a finite horizon grows with T towards the infinite-horizon bound", () => {
    // Anderson & Moore 1990, §3.1: the finite-horizon optimum is monotone in T and tends to x₀ᵀP x₀ of the CARE.
    const infinite = lqrBound(CUBIC, { kind: "setpoint-step" }, { q: 1, r: 1 });
    expect(infinite.ok).toBe(true);
    if (!infinite.ok) return;
    let previous = 0;
    for (const horizon of [1, 3, 10, 100]) {
      const finite = lqrBound(CUBIC, { kind: "setpoint-step" }, { q: 1, r: 1, horizon });
      expect(finite.ok).toBe(true);
      if (!finite.ok) continue;
      expect(finite.cost).toBeGreaterThanOrEqual(previous);
      expect(finite.cost).toBeLessThanOrEqual(infinite.cost * (1 + 1e-12));
      previous = finite.cost;
    }
    expectClose(previous, infinite.cost, 1e-12, 1e-10);
  });

  it("lqrBound adds q·Δr²·θ for a dead time θ", () => {
    // While the dead time hides every input, e = Δr whatever the controller does (see lqrBound).
    const free = lqrBound(CUBIC, { kind: "setpoint-step", setpoint: 2 }, { q: 3, r: 1 });
    const delayed = lqrBound({ ...CUBIC, delay: 1.5 } as Plant, { kind: "setpoint-step", setpoint: 2 }, { q: 3, r: 1 });
    expect(free.ok && delayed.ok).toBe(true);
    if (free.ok && delayed.ok) expectClose(delayed.cost, free.cost + 3 * 4 * 1.5, 1e-13, 1e-12);
  });

  it("lqrBound reports a plant with a zero at s = 0", () => {
    const bound = lqrBound({ kind: "transfer-function", num: [1, 0], den: [1, 2, 1], delay: 0 }, { kind: "setpoint-step" });
    expect(bound.ok).toBe(false);
  });
});

describe("boundCurve", () => {
  it("boundCurve is monotone: ISE rises and effort falls as r/q grows, and ISE + ratio·effort is the bound", () => {
    // Weighted-sum scalarisation (Boyd & Vandenberghe 2004, §4.7.4): a larger price on effort buys less of it.
    const curve = boundCurve(CUBIC, { kind: "setpoint-step" });
    expect(curve.ok).toBe(true);
    if (!curve.ok) return;
    expect(curve.skipped).toEqual([]);
    expect(curve.points.length).toBe(33);
    for (let i = 1; i < curve.points.length; i++) {
      expect(curve.points[i].ise).toBeGreaterThan(curve.points[i - 1].ise);
      expect(curve.points[i].effort).toBeLessThan(curve.points[i - 1].effort);
    }
    for (const p of curve.points) expectClose(p.ise + p.ratio * p.effort, p.cost, 1e-12, 1e-9);
  });

  it("boundCurve has no random stable PID candidate below-left of it", () => {
    // Every candidate (ISE, Effort) satisfies ISE + ρ·Effort ≥ bound(ρ) for every ρ on the curve.
    const curve = boundCurve(CUBIC, { kind: "setpoint-step" });
    expect(curve.ok).toBe(true);
    if (!curve.ok) return;
    const random = seededRandom(1990);
    let checked = 0;
    for (let i = 0; i < 300; i++) {
      const kp = 0.05 + random() * 6;
      const ki = 0.01 + random() * 2;
      const kd = random() * 4;
      const controller = { kind: "pid", kp, ki, kd, tf: kd === 0 ? 0 : kd / (10 * kp) } as const;
      const exact = exactQuadraticCosts(CUBIC, controller, { kind: "setpoint-step" });
      if (!exact.ok) continue;
      checked++;
      for (const p of curve.points) expect(exact.ise + p.ratio * exact.effort).toBeGreaterThanOrEqual(p.cost * (1 - 1e-12));
    }
    expect(checked).toBeGreaterThan(100);
  });
});
