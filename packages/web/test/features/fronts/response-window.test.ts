import { describe, expect, it } from "vitest";
import { responseWindowEnd } from "../../../src/features/fronts/response-window.js";

describe("responseWindowEnd", () => {
  it("responseWindowEnd opens on 1.5 × the 2 % settling time of a first-order step", () => {
    // y = 1 − e^(−t/τ), τ = 2 s: |y − 1| ≤ 0.02 from t = τ·ln 50 ≈ 7.82 s (closed form); u = e^(−t/τ) settles alike.
    const t = Array.from({ length: 4001 }, (_, k) => k * 0.1);
    const y = t.map((s) => 1 - Math.exp(-s / 2));
    const u = t.map((s) => Math.exp(-s / 2));
    expect(responseWindowEnd(t, y, u)).toBeCloseTo(1.5 * 2 * Math.log(50), 0);
  });

  it("responseWindowEnd keeps the whole horizon when the response is still moving at the end", () => {
    const t = Array.from({ length: 101 }, (_, k) => k);
    const ramp = t.map((s) => s);
    expect(responseWindowEnd(t, ramp, ramp)).toBe(100);
    expect(responseWindowEnd([], [], [])).toBe(0);
  });
});
