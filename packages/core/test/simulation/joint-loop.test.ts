import { describe, expect, it } from "vitest";
import { CRITERIA } from "../../src/criteria/registry.js";
import { CRITERION_IDS } from "../../src/criteria/criterion-id.js";
import type { NonlinearPlant } from "../../src/plants/nonlinear.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import type { LoopTrace } from "../../src/simulation/loop-trace.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";
import { createOdexSolver } from "../support/odex-reference.js";

/** Damped pendulum with torque input: m·l²·θ'' = u − m·g·l·sin θ − b·θ' (Newton's second law for rotation). */
const [M, L, G, B] = [1, 0.5, 9.81, 0.2];
const pendulum: NonlinearPlant = {
  kind: "nonlinear",
  states: ["th", "w"],
  parameters: { m: M, l: L, g: G, b: B },
  derivatives: ["w", "(u - m*g*l*sin(th) - b*w)/(m*l^2)"],
  output: "th",
  initial: [0, 0],
};
const filteredPid = { kind: "pid" as const, kp: 6, ki: 4, kd: 1.2, tf: 0.1 };

/**
 * Reference figures of the pendulum loop from odex (Gragg–Bulirsch–Stoer extrapolation; E. Hairer and
 * G. Wanner's ODEX) at rtol 1e-10, on the closed loop written out by hand: states θ, ω, the integral
 * x_i' = e and the derivative filter x_d' = −x_d/tf + e, u = ki·x_i − (kd/tf²)·x_d + (kp + kd/tf)·e.
 * The integrals ride along as extra states (∫|e|, ∫e², ∫t|e|, ∫u, ∫u²), so they are as accurate as
 * the integration; effort = ∫u² − 2c∫u + c²T with c = u(T), overshoot from the dense output every
 * 0.5 ms, both measured against the final values like the criteria (y∞ = y(T), u∞ = u(T)).
 */
function pendulumReference(T: number): { iae: number; ise: number; itae: number; effort: number; overshoot: number } {
  const { kp, ki, kd, tf } = filteredPid;
  const control = (z: number[]): number => ki * z[2] - (kd / (tf * tf)) * z[3] + (kp + kd / tf) * (1 - z[0]);
  const f = (t: number, z: number[]): number[] => {
    const e = 1 - z[0];
    const u = control(z);
    return [z[1], (u - M * G * L * Math.sin(z[0]) - B * z[1]) / (M * L * L), e, -z[3] / tf + e, Math.abs(e), e * e, t * Math.abs(e), u, u * u];
  };
  const solver = createOdexSolver(9) as ReturnType<typeof createOdexSolver> & { denseOutput: boolean; grid(dt: number, out: (t: number, y: number[]) => void): unknown };
  solver.absoluteTolerance = 1e-12;
  solver.relativeTolerance = 1e-10;
  solver.denseOutput = true;
  let peak = -Infinity;
  const solve = solver.solve as unknown as (f: (t: number, y: number[]) => number[], t0: number, y0: number[], t1: number, out: unknown) => { y: number[] };
  const end = solve.call(solver, f, 0, [0, 0, 0, 0, 0, 0, 0, 0, 0], T, solver.grid(0.0005, (_t, y) => (peak = Math.max(peak, y[0])))).y;
  const uEnd = control(end);
  return {
    iae: end[4],
    ise: end[5],
    itae: end[6],
    effort: end[8] - 2 * uEnd * end[7] + uEnd * uEnd * T,
    overshoot: (100 * Math.max(0, peak - end[0])) / end[0],
  };
}

/**
 * Method-of-steps reference of the FOPDT loop K·e^(−θs)/(τs + 1) under PI (kp, ki), unit setpoint
 * step from rest (R. Bellman and K. L. Cooke, Differential-Difference Equations, Academic Press,
 * 1963, ch. 3: on [iθ, (i+1)θ] the delayed input is the controller output of the previous segment).
 * Every segment i is integrated by odex at rtol 1e-12 together with copies of segments 0…i−1 in the
 * local time s ∈ [0, θ], so the delayed input u(t − θ) is the previous copy's exact state, never
 * interpolated. y and u are sampled from the dense output every `fine` seconds; the criteria on that
 * fine grid (trapezoid error O(fine²), ~1e-7 relative at 1 ms) stand for the continuous figures.
 */
function fopdtReference(theta: number, T: number, fine: number): LoopTrace {
  const [K, tau, kp, ki] = [1, 2, 1, 0.5];
  const segments = Math.ceil(T / theta - 1e-9);
  const samples = Math.round(T / fine) + 1;
  const y = new Float64Array(samples);
  const u = new Float64Array(samples);
  let starts: number[] = [0, 0];
  const record = (t: number, x: number, xi: number): void => {
    const k = Math.round(t / fine);
    if (k < samples && Math.abs(k * fine - t) < 1e-9) {
      y[k] = x;
      u[k] = kp * (1 - x) + ki * xi;
    }
  };
  for (let i = 0; i < segments; i++) {
    const n = 2 * (i + 1);
    const f = (_s: number, z: number[]): number[] => {
      const dz = new Array<number>(n);
      for (let q = 0; q <= i; q++) {
        const v = q === 0 ? 0 : kp * (1 - z[2 * q - 2]) + ki * z[2 * q - 1];
        dz[2 * q] = (-z[2 * q] + K * v) / tau;
        dz[2 * q + 1] = 1 - z[2 * q];
      }
      return dz;
    };
    const solver = createOdexSolver(n) as ReturnType<typeof createOdexSolver> & { denseOutput: boolean; grid(dt: number, out: (t: number, y: number[]) => void): unknown };
    solver.absoluteTolerance = 1e-13;
    solver.relativeTolerance = 1e-12;
    solver.denseOutput = true;
    const t0 = i * theta;
    const solve = solver.solve as unknown as (f: (t: number, y: number[]) => number[], t0: number, y0: number[], t1: number, out: unknown) => { y: number[] };
    const end = solve.call(solver, f, 0, starts, theta, solver.grid(fine, (s, z) => record(t0 + s, z[2 * i], z[2 * i + 1]))).y;
    record(t0 + theta, end[2 * i], end[2 * i + 1]);
    starts = [0, 0, ...end];
  }
  const t = Float64Array.from({ length: samples }, (_, k) => k * fine);
  const r = new Float64Array(samples).fill(1);
  return { t, r, y, u, e: y.map((v) => 1 - v), uInfinity: 1 / K, y0: 0, stepSize: 1, yInfinity: 1, status: "ok" };
}

const fopdt = (theta: number): TransferFunctionPlant => ({ kind: "transfer-function", num: [1], den: [2, 1], delay: theta });
const TIME_CRITERIA = CRITERION_IDS.filter((id) => CRITERIA[id].kind === "time");

/** Largest |y_k − y_ref(t_k)| over the trace's grid, y_ref sampled every `fine` seconds. */
function worstOutputError(trace: LoopTrace, reference: LoopTrace, fine: number): number {
  let worst = 0;
  for (let k = 0; k < trace.t.length; k++) worst = Math.max(worst, Math.abs(trace.y[k] - reference.y[Math.round(trace.t[k] / fine)]));
  return worst;
}

/**
 * The criterion `id` of the trace within 1e-3 relative of the reference's; a criterion that does not
 * apply to this scenario (NaN on the reference, e.g. load recovery without a load step) must not
 * apply to the trace either.
 */
function expectSameFigure(id: (typeof TIME_CRITERIA)[number], trace: LoopTrace, reference: LoopTrace): void {
  const expected = CRITERIA[id].compute(reference);
  if (Number.isNaN(expected)) expect(CRITERIA[id].compute(trace), id).toBeNaN();
  else expectClose(CRITERIA[id].compute(trace), expected, 1e-9, 1e-3);
}

describe("joint loop: continuous controllers with nonlinear plants, dead time and limits", () => {
  it("simulateLoop: the pendulum under a filtered PID at dt = 0.01 s matches odex at rtol 1e-10 (IAE, ISE, ITAE, overshoot to 1e-3, effort to 2e-3)", () => {
    // Reference: pendulumReference (odex on the hand-written closed loop; no engine code).
    const T = 20;
    const ref = pendulumReference(T);
    const trace = simulateLoop(pendulum, filteredPid, { kind: "setpoint-step", horizon: T, dt: 0.01 });
    expect(trace.status).toBe("ok");
    expectClose(CRITERIA.iae.compute(trace), ref.iae, 0, 1e-3);
    expectClose(CRITERIA.ise.compute(trace), ref.ise, 0, 1e-3);
    expectClose(CRITERIA.itae.compute(trace), ref.itae, 0, 1e-3);
    expectClose(CRITERIA.overshoot.compute(trace), ref.overshoot, 0, 1e-3);
    expectClose(CRITERIA.effort.compute(trace), ref.effort, 0, 2e-3);
  });

  it("simulateLoop: FOPDT under PI with θ = 1 s at dt = 0.01 s gives every time criterion within 1e-3 of the method of steps, and y converges with order ≥ 2", () => {
    // Reference: fopdtReference (method of steps, odex at rtol 1e-12 per segment of length θ).
    const [theta, T, fine] = [1, 20, 1e-3];
    const ref = fopdtReference(theta, T, fine);
    const trace = simulateLoop(fopdt(theta), { kind: "pi", kp: 1, ki: 0.5 }, { kind: "setpoint-step", horizon: T, dt: 0.01 });
    for (const id of TIME_CRITERIA) expectSameFigure(id, trace, ref);
    // Order: the largest output error at the grid points falls at least 16× when dt is divided by 4
    // (the classical Runge–Kutta method with the Hermite history gives ≈ 4⁴ = 256× until the reference's
    // own accuracy, ~1e-11, is reached).
    const coarse = simulateLoop(fopdt(theta), { kind: "pi", kp: 1, ki: 0.5 }, { kind: "setpoint-step", horizon: T, dt: 0.04 });
    const errorCoarse = worstOutputError(coarse, ref, fine);
    const errorFine = worstOutputError(trace, ref, fine);
    expect(errorCoarse).toBeGreaterThan(1e-10);
    expect(errorCoarse / Math.max(errorFine, 1e-12)).toBeGreaterThanOrEqual(16);
  });

  it("simulateLoop: a dead time θ = 0.737 s that is not a multiple of dt keeps the figures within 1e-3 and the order ≥ 2", () => {
    // Reference: fopdtReference with θ = 0.737 s; the delayed input is read between stored nodes and
    // the breaking points t = m·θ fall inside steps.
    const [theta, T, fine] = [0.737, 20, 1e-3];
    const ref = fopdtReference(theta, T, fine);
    const trace = simulateLoop(fopdt(theta), { kind: "pi", kp: 1, ki: 0.5 }, { kind: "setpoint-step", horizon: T, dt: 0.01 });
    for (const id of TIME_CRITERIA) expectSameFigure(id, trace, ref);
    const coarse = simulateLoop(fopdt(theta), { kind: "pi", kp: 1, ki: 0.5 }, { kind: "setpoint-step", horizon: T, dt: 0.04 });
    const errorCoarse = worstOutputError(coarse, ref, fine);
    expect(errorCoarse).toBeGreaterThan(1e-10);
    expect(errorCoarse / Math.max(worstOutputError(trace, ref, fine), 1e-12)).toBeGreaterThanOrEqual(16);
  });

  it("simulateLoop: the open-loop step through a dead time off the grid on the continuous path is 1 − e^(−(t − θ)) to 1e-10", () => {
    // Closed form: first-order step delayed by θ = 0.5 (kp = 0: no feedback, the load alone acts).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0.5 };
    const trace = simulateLoop(plant, { kind: "p", kp: 0 }, { kind: "load-step", horizon: 5, dt: 0.01 });
    for (let k = 0; k < trace.t.length; k++) {
      const s = trace.t[k] - 0.5;
      expectClose(trace.y[k], s >= 0 ? 1 - Math.exp(-s) : 0, 1e-10);
    }
  });

  it("simulateLoop: saturation of a P loop on 1/(s + 1) switches at the closed-form instant, located inside the step", () => {
    // Closed form: u = min(kp(1 − y), umax) with kp = 4, umax = 2. Saturated, y = 2(1 − e^(−t)) until
    // kp(1 − y) = umax, i.e. y* = 1/2 at t* = ln(4/3) ≈ 0.2877 (not on the grid); then
    // y' = −y + 4(1 − y) ⇒ y = 0.8 + (y* − 0.8)·e^(−5(t − t*)). Tolerance: the classical Runge–Kutta
    // method's own error at h·λ = 0.05, local (hλ)⁵/120 ≈ 3e-9 per unit amplitude; a switch taken at
    // the next grid point instead would cost O(dt²) ≈ 1e-4.
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0, actuator: { max: 2 } };
    const trace = simulateLoop(plant, { kind: "p", kp: 4 }, { kind: "setpoint-step", horizon: 3, dt: 0.01 });
    const tStar = Math.log(4 / 3);
    for (let k = 0; k < trace.t.length; k++) {
      const t = trace.t[k];
      const expected = t <= tStar ? 2 * (1 - Math.exp(-t)) : 0.8 + (0.5 - 0.8) * Math.exp(-5 * (t - tStar));
      expectClose(trace.y[k], expected, 1e-8);
      expect(trace.u[k]).toBeLessThanOrEqual(2);
    }
  });

  it("simulateLoop: measurement noise reaches state feedback — on 1/(s + 1), u = kp·r − kp·(x + n) equals P control of y + n", () => {
    // Invariant: the canonical state of 1/(s + 1) is x = y, and state 0 reads the same noise sequence
    // as the output, so state feedback K = kp, N = kp is the P loop kp(r − y − n) (exact path, held noise).
    // Tolerance: the Runge–Kutta error of the state-feedback run at h·λ = 0.03 (local (hλ)⁵/120 ≈ 2e-10).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 };
    const scenario = { kind: "setpoint-step" as const, horizon: 5, dt: 0.01, noise: { sd: 0.1, seed: 3 } };
    const output = simulateLoop(plant, { kind: "p", kp: 2 }, scenario);
    const state = simulateLoop(plant, { kind: "state-feedback", k: [2], n: 2 }, scenario);
    const quiet = simulateLoop(plant, { kind: "state-feedback", k: [2], n: 2 }, { ...scenario, noise: undefined });
    let differs = 0;
    for (let k = 0; k < output.t.length; k++) {
      expectClose(state.y[k], output.y[k], 1e-8);
      expectClose(state.u[k], output.u[k], 1e-8);
      if (Math.abs(state.u[k] - quiet.u[k]) > 1e-3) differs++;
    }
    expect(differs).toBeGreaterThan(output.t.length / 2);
  });
});
