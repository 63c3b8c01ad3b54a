import { describe, expect, it } from "vitest";
import { overshoot } from "../../src/criteria/overshoot.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { riseTime } from "../../src/criteria/rise-time.js";
import { settlingTime } from "../../src/criteria/settling-time.js";
import { undershoot } from "../../src/criteria/undershoot.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";
import { grid, traceFromSamples } from "./trace-from-samples.js";

/**
 * Closed-form unit-step response of the second-order prototype ωn²/(s² + 2ζωn s + ωn²), ζ < 1:
 * y = 1 − e^(−ζωn t)(cos ωd t + ζ/√(1 − ζ²)·sin ωd t), ωd = ωn√(1 − ζ²)
 * (K. Ogata, Modern Control Engineering, 5th ed., 2010, §5-3).
 */
function prototypeStep(t: Float64Array, zeta: number, wn: number): Float64Array {
  const root = Math.sqrt(1 - zeta * zeta);
  const wd = wn * root;
  return t.map((v) => 1 - Math.exp(-zeta * wn * v) * (Math.cos(wd * v) + (zeta / root) * Math.sin(wd * v)));
}

describe("overshoot", () => {
  const dt = 1e-3;
  const wn = 2;
  const t = grid(20_000, dt);
  for (const zeta of [0.2, 0.5, 0.7]) {
    it(`is 100·exp(−ζπ/√(1 − ζ²)) % for the prototype, ζ = ${zeta} (Ogata 2010, §5-3)`, () => {
      const expected = 100 * Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta));
      // Sampling misses the peak by at most ½|y''|(dt/2)² ≤ ωn²dt²/8 (in %: ×100).
      const tol = (100 * wn * wn * dt * dt) / 8 + 1e-10;
      expectClose(CRITERIA.overshoot.compute(traceFromSamples(t, prototypeStep(t, zeta, wn))), expected, tol);
      // Sign-aware: the mirrored step from y0 = 3 down by 2 overshoots by the same percentage.
      const down = prototypeStep(t, zeta, wn).map((v) => 3 - 2 * v);
      expectClose(CRITERIA.overshoot.compute(traceFromSamples(t, down, { y0: 3, stepSize: -2, yInfinity: 1 })), expected, tol);
    });
  }

  it("of simulateLoop on the prototype (plant ωn²/(s(s + 2ζωn)), kp = 1) agrees with the closed form", () => {
    // Unity feedback closes ωn²/(s(s + 2ζωn)) to the prototype; y∞ = 1 (type-1 loop).
    const zeta = 0.4;
    const trace = simulateLoop(
      { kind: "transfer-function", num: [wn * wn], den: [1, 2 * zeta * wn, 0], delay: 0 },
      { kind: "pid", kp: 1, ki: 0, kd: 0, tf: 0 },
      { kind: "setpoint-step", horizon: 20, dt },
    );
    expectClose(trace.yInfinity, 1, 1e-12);
    expectClose(CRITERIA.overshoot.compute(trace), 100 * Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta)), (100 * wn * wn * dt * dt) / 8 + 1e-9);
  });

  it("is 0 when y never passes its final value (first-order response, closed form 1 − e^(−t))", () => {
    const t1 = grid(1000, 0.01);
    expect(overshoot(t1.map((v) => 1 - Math.exp(-v)), 0, 1)).toBe(0);
  });

  it("is measured against the setpoint when y∞ is NaN (no exact steady state known)", () => {
    const y = prototypeStep(t, 0.5, wn);
    const known = CRITERIA.overshoot.compute(traceFromSamples(t, y));
    expectClose(CRITERIA.overshoot.compute(traceFromSamples(t, y, { yInfinity: NaN })), known, 1e-12);
  });
});

describe("undershoot", () => {
  it("is 100·(2e^(−1/2) − 1) % for the non-minimum-phase (1 − s)/(s + 1)² (closed form)", () => {
    /*
     * Y(s) = (1 − s)/(s(s + 1)²) = 1/s − 1/(s + 1) − 2/(s + 1)² (partial fractions: residue 1 at 0;
     * (1 − s)/s = −2 at s = −1; d/ds (1 − s)/s = −1/s² = −1 at s = −1), so
     * y(t) = 1 − e^(−t) − 2t·e^(−t),  y'(t) = (2t − 1)e^(−t): the dip is at t = ½,
     * y(½) = 1 − 2e^(−1/2) ≈ −0.2131; and y − 1 = −(1 + 2t)e^(−t) < 0, so no overshoot.
     */
    const dt = 1e-3;
    const t = grid(20_000, dt);
    const y = t.map((v) => 1 - Math.exp(-v) - 2 * v * Math.exp(-v));
    const trace = traceFromSamples(t, y);
    // Sampling error ≤ ½|y''(½)|(dt/2)², y''(½) = 2e^(−1/2).
    const tol = (100 * 2 * Math.exp(-0.5) * dt * dt) / 8 + 1e-10;
    expectClose(CRITERIA.undershoot.compute(trace), 100 * (2 * Math.exp(-0.5) - 1), tol);
    expect(CRITERIA.overshoot.compute(trace)).toBe(0);
  });

  it("is 0 for a response that never moves the wrong way, and sign-aware for a downward step", () => {
    const t = grid(1000, 0.01);
    expect(undershoot(t.map((v) => 1 - Math.exp(-v)), 0, 1)).toBe(0);
    // Downward step 0 → −1 that first rises to +0.1: 10 % undershoot (definition).
    const y = Float64Array.from([0, 0.05, 0.1, 0, -0.5, -1, -1]);
    expectClose(undershoot(y, 0, -1), 10, 1e-12);
  });
});

describe("riseTime and settlingTime on 1 − e^(−t/τ)", () => {
  /*
   * Closed form: y = 1 − e^(−t/τ) reaches the fraction p at t = −τ·ln(1 − p), so
   * t₉₀ − t₁₀ = τ·(ln 10 − ln(10/9)) = τ·ln 9, and |y − 1| = e^(−t/τ) falls to the band b at τ·ln(1/b):
   * τ·ln 50 for 2 %, τ·ln 20 for 5 % (common practice; Franklin, Powell & Emami-Naeini 2002, §3.4).
   * Linear interpolation errs at each crossing by at most |y''|dt²/(8|y'|) = dt²/(8τ).
   */
  const tau = 2;
  const dt = 0.01;
  const t = grid(5000, dt);
  const y = t.map((v) => 1 - Math.exp(-v / tau));
  const tol = (dt * dt) / (4 * tau) + 1e-12;

  it("riseTime = τ·ln 9, up and down, from any y0", () => {
    expectClose(CRITERIA.riseTime.compute(traceFromSamples(t, y)), tau * Math.log(9), tol);
    const down = y.map((v) => 3 - 2 * v);
    expectClose(CRITERIA.riseTime.compute(traceFromSamples(t, down, { y0: 3, stepSize: -2, yInfinity: 1 })), tau * Math.log(9), tol);
  });

  it("settlingTime = τ·ln 50 for the default 2 % band and τ·ln 20 with settlingBand = 0.05", () => {
    const trace = traceFromSamples(t, y);
    expectClose(CRITERIA.settlingTime.compute(trace), tau * Math.log(50), tol);
    expectClose(CRITERIA.settlingTime.compute(trace, { settlingBand: 0.05 }), tau * Math.log(20), tol);
  });

  it("both are Infinity when the horizon ends before 90 % or inside-band is reached", () => {
    // Horizon τ·ln 5: y(T) = 0.8 < 0.9.
    const n = Math.floor((tau * Math.log(5)) / dt);
    const short = traceFromSamples(t.subarray(0, n + 1), y.subarray(0, n + 1));
    expect(CRITERIA.riseTime.compute(short)).toBe(Infinity);
    expect(CRITERIA.settlingTime.compute(short)).toBe(Infinity);
  });

  it("both are t[0] = 0 when y(0⁺) is already at the final value (direct feedthrough)", () => {
    const flat = new Float64Array(t.length).fill(1);
    expect(riseTime(t, flat, 0, 1)).toBe(0);
    expect(settlingTime(t, flat, 0, 1)).toBe(0);
  });

  it("settlingTime finds the last exit of an oscillating response from its band, between samples", () => {
    // Prototype ζ = 0.5, ωn = 1 (closed form above): |y − 1| ≤ e^(−ζωn t)/√(1 − ζ²), so the 2 % band
    // holds for good after t_env = ln(1/(0.02·√(1 − ζ²)))/(ζωn) ≈ 8.11 s; the last exit is at or before it.
    const zeta = 0.5;
    const dt = 1e-3;
    const tt = grid(30_000, dt);
    const yy = prototypeStep(tt, zeta, 1);
    const ts = settlingTime(tt, yy, 0, 1);
    expect(ts).toBeLessThanOrEqual(Math.log(1 / (0.02 * Math.sqrt(1 - zeta * zeta))) / zeta);
    const k = Math.floor(ts / dt);
    expect(Math.abs(yy[k] - 1)).toBeGreaterThan(0.02);
    for (let j = k + 1; j < yy.length; j++) if (Math.abs(yy[j] - 1) > 0.02) expect.fail(`y[${j}] leaves the band after ts`);
    // The exact exit time by bisection on the closed form between the two samples; the linear
    // interpolation errs by O(dt²).
    const y = (v: number) => prototypeStep(Float64Array.of(v), zeta, 1)[0];
    const outside = Math.sign(yy[k] - 1);
    let [a, b] = [tt[k], tt[k + 1]];
    for (let i = 0; i < 60; i++) {
      const m = (a + b) / 2;
      if (outside * (y(m) - 1) > 0.02) a = m;
      else b = m;
    }
    expectClose(ts, (a + b) / 2, dt * dt);
  });

  it("settlingBand must lie in (0, 1); the error names it", () => {
    const trace = traceFromSamples(t, y);
    for (const band of [0, 1, -0.1, Number.NaN]) {
      expect(() => CRITERIA.settlingTime.compute(trace, { settlingBand: band })).toThrow(/^settlingBand must be a number in \(0, 1\)/);
    }
  });
});

describe("step criteria that do not apply", () => {
  const t = grid(1000, 0.01);
  const y = t.map((v) => 0.2 * v * Math.exp(-v));

  it("overshoot, undershoot, riseTime and settlingTime are NaN without a setpoint change (stepSize = 0)", () => {
    // A load-step-only trace: the output leaves y0 = 0 and returns; there is no change to refer to.
    const trace = traceFromSamples(t, y, { stepSize: 0, yInfinity: 0 });
    for (const id of ["overshoot", "undershoot", "riseTime", "settlingTime"] as const) expect(CRITERIA[id].compute(trace)).toBeNaN();
    // The integral criteria and the steady-state error still apply.
    expect(Number.isFinite(CRITERIA.iae.compute(trace))).toBe(true);
    expect(CRITERIA.steadyStateError.compute(trace)).toBe(0);
  });

  it("every criterion is NaN on a diverged trace", () => {
    const trace = traceFromSamples(t, y, { status: "diverged" });
    for (const [id, definition] of Object.entries(CRITERIA)) expect(definition.compute(trace), id).toBeNaN();
  });

  it("the plain functions refuse a zero output change, naming target", () => {
    expect(() => overshoot(y, 1, 1)).toThrow(/^target must differ from y0/);
    expect(() => riseTime(t, y, 0, Number.NaN)).toThrow(/^target must be finite/);
  });
});
