import { describe, expect, it } from "vitest";
import { tv } from "../../src/criteria/tv.js";
import { upeak } from "../../src/criteria/upeak.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";
import { grid } from "./trace-from-samples.js";

describe("tv and upeak", () => {
  it("tv(u) of a monotone u equals |u(T) − u(0)| (the sum telescopes)", () => {
    const t = grid(3000, 0.01);
    const rising = t.map((v) => 3 - 2 * Math.exp(-v));
    const falling = t.map((v) => -1 + 4 * Math.exp(-0.5 * v));
    expectClose(tv(rising), Math.abs(rising[3000] - rising[0]), 1e-12);
    expectClose(tv(falling), Math.abs(falling[3000] - falling[0]), 1e-12);
  });

  it("tv(u) of sin over one period is 4 when the grid holds the extremes (closed form: 1 + 2 + 1)", () => {
    const n = 400;
    const u = grid(n, (2 * Math.PI) / n).map(Math.sin); // samples at π/2 and 3π/2 (k = 100, 300)
    expectClose(tv(u), 4, 1e-12);
  });

  it("upeak(u) is max |u|, sign-blind", () => {
    expect(upeak(Float64Array.from([0.5, -2.5, 1, 2]))).toBe(2.5);
  });

  it("on a PID loop, upeak and tv start at u(0⁺) = kp + kd/tf: the kick counts in upeak, the jump from u(0⁻) = 0 not in tv", () => {
    // simulateLoop convention (README, "The value of u at t = 0"): strictly proper plant, from rest,
    // unit step ⇒ u[0] = kp·1 + kd/tf·1 = 2 + 0.5/0.05 = 12, after which the derivative part decays.
    const plant = { kind: "transfer-function" as const, num: [1], den: [1, 2, 1], delay: 0 };
    const controller = { kind: "pid" as const, kp: 2, ki: 1, kd: 0.5, tf: 0.05 };
    const trace = simulateLoop(plant, controller, { kind: "setpoint-step", horizon: 20, dt: 0.001 });
    expectClose(trace.u[0], 12, 1e-12);
    expectClose(CRITERIA.upeak.compute(trace), 12, 1e-12);
    let variation = 0;
    for (let k = 1; k < trace.u.length; k++) variation += Math.abs(trace.u[k] - trace.u[k - 1]);
    expectClose(CRITERIA.tv.compute(trace), variation, 1e-12);
    // TV ≥ the fall from the kick to u∞ = 1/G(0) = 1 (with integral action).
    expect(CRITERIA.tv.compute(trace)).toBeGreaterThanOrEqual(12 - 1 - 1e-9);
  });

  it("tv and upeak refuse an empty input", () => {
    expect(() => tv(new Float64Array(0))).toThrow(/^u must/);
    expect(() => upeak(new Float64Array(0))).toThrow(/^u must/);
  });
});
