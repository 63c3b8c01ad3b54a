import { describe, expect, it } from "vitest";
import { compileSystem } from "../../src/expressions/compile-system.js";
import type { NonlinearPlant } from "../../src/plants/nonlinear.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { DormandPrince } from "../../src/simulation/dormand-prince.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";
import { createOdexSolver } from "../support/odex-reference.js";

/** Draining tank A·h' = −a·√h + b·u; equilibrium √h = b·u/a, so u_op = 1 gives h = 4 with a = 0.5, b = 1. */
const tank: NonlinearPlant = {
  kind: "nonlinear",
  states: ["h"],
  parameters: { a: 0.5, b: 1, A: 2 },
  derivatives: ["(-a*sqrt(h) + b*u)/A"],
  output: "h",
  initial: [4],
  operatingInput: 1,
};

/** Reference integration by odex (Gragg–Bulirsch–Stoer extrapolation; independent of our Runge–Kutta). */
function odexTank(u: number, h0: number, tEnd: number): number {
  const solver = createOdexSolver(1);
  solver.absoluteTolerance = 1e-12;
  solver.relativeTolerance = 1e-12;
  const { a, b, A } = tank.parameters;
  return solver.solve((_t, y) => [(-a * Math.sqrt(y[0]) + b * u) / A], 0, [h0], tEnd).y[0];
}

describe("nonlinear plants", () => {
  it("DormandPrince agrees with odex at tight tolerance on the tank, within a stated work budget", () => {
    const model = compileSystem({ states: ["h"], parameters: ["a", "b", "A"], derivatives: ["(-a*sqrt(h) + b*u)/A"], output: "h" });
    const solver = new DormandPrince(model, Float64Array.of(0.5, 1, 2), { rtol: 1e-12, atol: 1e-12 });
    const x = Float64Array.of(4);
    solver.advance(x, 0, 10, 1.5);
    expectClose(x[0], odexTank(1.5, 4, 10), 1e-9);
    expect(solver.evaluations).toBeLessThan(3000);
  });

  it("the nonlinear path agrees with the linear path on x' = −x + u, y = x typed as expressions", () => {
    // Reference: the same system as the transfer function 1/(s + 1), simulated by the linear grid loop
    // (dead-time-free but sampled controller, so both take the grid path with the same controller updates).
    const typed: NonlinearPlant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + u"], output: "x", initial: [0] };
    const linear: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    const pid = { kind: "pid" as const, kp: 2, ki: 1, kd: 0.2, tf: 0.05, sampleTime: 0.05 };
    const scenario = { kind: "combined" as const, horizon: 10, dt: 0.01, load: { size: 0.5, time: 4.003 } };
    const a = simulateLoop(typed, pid, scenario);
    const b = simulateLoop(linear, pid, scenario);
    for (let k = 0; k < a.y.length; k++) {
      expectClose(a.y[k], b.y[k], 1e-7);
      expectClose(a.u[k], b.u[k], 1e-6);
    }
  });

  it("the tank from its equilibrium under a constant input change matches odex at every sample", () => {
    // Open loop through the engine: state feedback K = 0, N = 1 gives u = u_op + N·Δr = 1.5.
    const trace = simulateLoop(tank, { kind: "state-feedback", k: [0], n: 1 }, { kind: "setpoint-step", horizon: 20, dt: 0.5, setpoint: 0.5 });
    expect(trace.y0).toBe(4);
    expectClose(trace.y[0], 4, 1e-15);
    for (let k = 1; k < trace.t.length; k += 7) expectClose(trace.y[k], odexTank(1.5, 4, trace.t[k]), 1e-7);
  });

  it("a PI loop on the tank steps from the operating point y0 = 4 to 4.5 and settles there", () => {
    // Reference: integral action removes the steady-state error (final-value theorem, Franklin et al. 2002 §4.2);
    // the equilibrium input for h = 4.5 is u = a·√4.5/b.
    const trace = simulateLoop(tank, { kind: "pi", kp: 2, ki: 0.5 }, { kind: "setpoint-step", horizon: 60, dt: 0.01, setpoint: 0.5 });
    expect(trace.status).toBe("ok");
    expectClose(trace.r[0], 4.5, 1e-15);
    expectClose(trace.yInfinity, 4.5, 1e-4);
    expectClose(trace.uInfinity, 0.5 * Math.sqrt(4.5), 1e-4);
  });

  it("a diverging nonlinear loop returns status diverged, never an exception", () => {
    // x' = x² + u from x = 1 under P kp = 0.5 with a unit step (y0 = 1): u = 0.5·(1 − (x − 1)), so
    // x' = x² − 0.5x + 1.5 > 0 for every x (negative discriminant) and x blows up in finite time
    // (closed form by comparison with x' ≥ (x − 1/4)² + 1.44).
    const blowUp: NonlinearPlant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["x^2 + u"], output: "x", initial: [1] };
    const trace = simulateLoop(blowUp, { kind: "p", kp: 0.5 }, { kind: "setpoint-step", horizon: 5, dt: 0.01 });
    expect(trace.status).toBe("diverged");
    expect(Number.isNaN(trace.y[trace.y.length - 1])).toBe(true);
    const result = evaluateCandidate(blowUp, { kind: "p", kp: 0.5 }, { kind: "setpoint-step", horizon: 5, dt: 0.01 }, ["iae"]);
    expect(result.status).toBe("diverged");
    expect(result.scores).toBeNull();
  });
});
