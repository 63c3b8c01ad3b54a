import { Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { boundCurve } from "../../src/optimal/bound-curve.js";
import { finiteHorizonRiccati } from "../../src/optimal/finite-horizon-riccati.js";
import { lqrBound } from "../../src/optimal/lqr-bound.js";
import { solveCare } from "../../src/optimal/solve-care.js";
import { riccatiFlow } from "../../src/optimal/solve-rde.js";
import type { Plant } from "../../src/plants/plant.js";
import { expectClose } from "../support/expect-close.js";

/**
 * Scalar Riccati differential equation in the time to go, dp/dτ = 2a·p − g·p² + q, p(0) = 0
 * (x' = a x + b u, cost ∫(q x² + r u²), g = b²/r). Separation of variables gives (closed form)
 *   p(τ) = q·sinh(βτ)/(β·cosh(βτ) − a·sinh(βτ)) = q·tanh(βτ)/(β − a·tanh(βτ)),   β = √(a² + g·q),
 * (substituting: p' = q·β²/(βC − aS)² = 2a·p − g·p² + q with S = sinh βτ, C = cosh βτ),
 * tending to the CARE root (a + β)/g as τ → ∞ (Anderson & Moore 1990, §3.3).
 */
const scalarRde = (a: number, g: number, q: number, tau: number): number => {
  const beta = Math.sqrt(a * a + g * q);
  const th = Math.tanh(beta * tau);
  return (q * th) / (beta - a * th);
};

describe("finiteHorizonRiccati", () => {
  it("matches the scalar closed form from short to long horizons, for stable and unstable a", () => {
    for (const [a, g, q] of [
      [-1, 1, 1],
      [0.5, 2, 3],
      [-1, 1e4, 1], // r/q = 1e-4 on 1/(s + 1): a fast closed loop, a stiff flow
    ]) {
      const care = (a + Math.sqrt(a * a + g * q)) / g;
      const closed = new Matrix([[a - g * care]]);
      for (const tau of [0.001, 0.1, 1, 5, 400]) {
        const p = finiteHorizonRiccati(new Matrix([[g]]), new Matrix([[care]]), closed, tau);
        expect(p).not.toBeNull();
        expectClose(p!.get(0, 0), scalarRde(a, g, q, tau), 1e-12, 1e-15);
      }
    }
  });

  it("matches the stepped Davison–Maki flow on a third-order plant (independent method)", () => {
    // 1/(s + 1)³ in controllable form, Q = CᵀC, R = 1 (Kenney & Leipnik 1985 stepping, solveRde).
    const A = [
      [0, 1, 0],
      [0, 0, 1],
      [-1, -3, -3],
    ];
    const B = [[0], [0], [1]];
    const Q = [
      [1, 0, 0],
      [0, 0, 0],
      [0, 0, 0],
    ];
    const care = solveCare(A, B, Q, [[1]]);
    expect(care.ok).toBe(true);
    if (!care.ok) return;
    const g = new Matrix(B).mmul(new Matrix(B).transpose());
    const pInf = new Matrix(care.P);
    const closed = Matrix.sub(new Matrix(A), g.mmul(pInf));
    for (const tau of [0.5, 2, 8]) {
      const flow = riccatiFlow(new Matrix(A), g, new Matrix(Q), new Matrix(3, 3), tau);
      const p = finiteHorizonRiccati(g, pInf, closed, tau)!;
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expectClose(p.get(i, j), flow!.p.get(i, j), 1e-10, 1e-13);
    }
  });
});

describe("lqrBound over a finite horizon", () => {
  it("works at r/q = 1e-4 over 400 s (the stepped flow needed more than its 2·10⁶ steps) and equals the scalar closed form", () => {
    // 1/(s + 1), unit setpoint step: x∞ = 1, x̃₀ = −1, so the bound is p(T) with a = −1, g = 1/r, q = 1.
    const plant: Plant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    const r = 1e-4;
    const bound = lqrBound(plant, { kind: "setpoint-step" }, { q: 1, r, horizon: 400 });
    expect(bound.ok).toBe(true);
    if (!bound.ok) return;
    expectClose(bound.cost, scalarRde(-1, 1 / r, 1, 400), 1e-12);
    // The stepped flow alone gives up here: ‖M‖₁·T/RDE_STEP_NORM > RDE_MAX_STEPS.
    expect(riccatiFlow(new Matrix([[1]]), new Matrix([[1 / r]]), new Matrix([[1]]), new Matrix(1, 1), 400)).toBeNull();
    const short = lqrBound(plant, { kind: "setpoint-step" }, { q: 1, r: 1, horizon: 0.3 });
    expect(short.ok).toBe(true);
    if (short.ok) expectClose(short.cost, scalarRde(-1, 1, 1, 0.3), 1e-12);
  });
});

describe("boundCurve over a finite horizon", () => {
  const plant: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };

  it("each point lies on its finite-horizon supporting line ISE + ρ·Effort = cost_T(ρ) (lqrBound, closed form)", () => {
    const curve = boundCurve(plant, { kind: "setpoint-step" }, { horizon: 4 });
    expect(curve.ok).toBe(true);
    if (!curve.ok) return;
    for (const point of curve.points) {
      const finite = lqrBound(plant, { kind: "setpoint-step" }, { q: 1, r: point.ratio, horizon: 4 });
      expect(finite.ok).toBe(true);
      if (finite.ok) expectClose(point.ise + point.ratio * point.effort, finite.cost, 1e-9);
      expect(point.shortfall).toBeGreaterThan(0);
    }
  });

  it("equals the infinite-horizon curve to rounding for a horizon of many closed-loop time constants", () => {
    // The gap decays like e^(−2σT) (finiteHorizonRiccati); at T = 400 s it is far below rounding.
    const infinite = boundCurve(plant, { kind: "setpoint-step" });
    const finite = boundCurve(plant, { kind: "setpoint-step" }, { horizon: 400 });
    expect(infinite.ok && finite.ok).toBe(true);
    if (!infinite.ok || !finite.ok) return;
    expect(finite.points).toHaveLength(infinite.points.length);
    finite.points.forEach((p, i) => {
      expectClose(p.ise, infinite.points[i].ise, 1e-12);
      expectClose(p.effort, infinite.points[i].effort, 1e-12);
      expect(p.shortfall!).toBeLessThan(1e-12);
    });
  });

  it("no simulated candidate over [0, T] lies below-left of any finite-horizon point", () => {
    // Candidates scored over T = 4 s by exact simulation: each must satisfy ISE + ρ·Effort ≥ cost_T(ρ).
    const curve = boundCurve(plant, { kind: "setpoint-step" }, { horizon: 4 });
    if (!curve.ok) throw new Error(curve.reason);
    for (const [kp, ki, kd] of [
      [1, 0.5, 0.5],
      [3, 1.5, 2],
      [6, 3, 5],
    ]) {
      const result = evaluateCandidate(plant, { kind: "pid", kp, ki, kd, tf: 0.02 }, { kind: "setpoint-step", horizon: 4, dt: 0.001 }, ["ise", "effort"]);
      expect(result.status).toBe("stable");
      for (const p of curve.points) expect(result.scores!.ise + p.ratio * result.scores!.effort).toBeGreaterThanOrEqual(p.cost * (1 - 1e-9));
    }
  });
});
