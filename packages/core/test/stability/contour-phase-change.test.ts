import { describe, expect, it } from "vitest";
import { contourPhaseChange } from "../../src/stability/contour-phase-change.js";
import type { ContourSegment } from "../../src/stability/nyquist-contour.js";
import { expectClose } from "../support/expect-close.js";

const circle = (centreRe: number, centreIm: number, radius: number, turns: number): ContourSegment => ({
  at: (t) => ({ sigma: centreRe + radius * Math.cos(t), omega: centreIm + radius * Math.sin(t) }),
  grid: [0, Math.PI * turns, 2 * Math.PI * turns],
  minStep: () => 1e-12,
  onAxis: false,
});

describe("contourPhaseChange", () => {
  it("contourPhaseChange of F(s) = (s − a)ᵐ around a circle is 2πm when a is inside and 0 when outside", () => {
    // Argument principle (closed form): arg (s − a)^m turns by 2πm around a circle enclosing a.
    // The initial grid has only 3 points, so the count relies on the adaptive refinement.
    const power = (a: number, m: number) => (sigma: number, omega: number) => {
      let re = 1;
      let im = 0;
      for (let k = 0; k < m; k++) [re, im] = [re * (sigma - a) - im * omega, re * omega + im * (sigma - a)];
      return { re, im };
    };
    for (const m of [1, 3, 7]) {
      const inside = contourPhaseChange(circle(0, 0, 1, 1), power(0.3, m), 1e6);
      expect(inside.kind).toBe("ok");
      if (inside.kind === "ok") expectClose(inside.phase, 2 * Math.PI * m, 1e-9);
      const outside = contourPhaseChange(circle(0, 0, 1, 1), power(2, m), 1e6);
      if (outside.kind === "ok") expectClose(outside.phase, 0, 1e-9);
      else expect.fail("expected ok");
    }
  });

  it("contourPhaseChange reports marginal when F vanishes on the contour", () => {
    // F(jω) = j(ω − 1) has a zero at ω = 1 on the imaginary axis (closed form).
    const axis: ContourSegment = { at: (t) => ({ sigma: 0, omega: t }), grid: [0, 0.5, 3], minStep: (a, b) => 1e-12 * Math.max(a, b), onAxis: true };
    const result = contourPhaseChange(axis, (sigma, omega) => ({ re: sigma, im: omega - 1 }), 1e6);
    expect(result.kind).toBe("marginal");
    if (result.kind === "marginal") expectClose(result.omega, 1, 1e-9);
  });

  it("contourPhaseChange stops at its evaluation budget", () => {
    const result = contourPhaseChange(circle(0, 0, 1, 1), (sigma, omega) => ({ re: sigma - 0.5, im: omega }), 5);
    expect(result.kind).toBe("budget");
  });
});
