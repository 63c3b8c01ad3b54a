import { describe, expect, it } from "vitest";
import { nyquistContour } from "../../src/stability/nyquist-contour.js";
import { expectClose } from "../support/expect-close.js";

describe("nyquistContour", () => {
  it("nyquistContour runs without gaps from the quarter circle at 0 over the indentations to ω_max", () => {
    // Contour of Åström & Murray 2008 §9.2: quarter circle r·e^(jφ), axis, semicircle around j·2, axis.
    const segments = nyquistContour(
      [
        { omega: 0, radius: 1e-3 },
        { omega: 2, radius: 1e-2 },
      ],
      50,
      0.5,
      [{ re: 0, im: 0 }, { re: 0, im: 2 }, { re: -1, im: 0 }],
    );
    expect(segments.map((s) => s.onAxis)).toEqual([false, true, false, true]);
    const first = segments[0].at(segments[0].grid[0]);
    expectClose(first.sigma, 1e-3, 1e-15);
    expectClose(first.omega, 0, 1e-15);
    for (let i = 1; i < segments.length; i++) {
      const end = segments[i - 1].at(segments[i - 1].grid[segments[i - 1].grid.length - 1]);
      const start = segments[i].at(segments[i].grid[0]);
      expectClose(start.sigma, end.sigma, 1e-12);
      expectClose(start.omega, end.omega, 1e-12);
    }
    const last = segments[segments.length - 1];
    expect(last.at(last.grid[last.grid.length - 1]).omega).toBe(50);
    // The dead time θ = 0.5 s bounds the axis steps by DELAY_PHASE_STEP/θ.
    const axis = segments[3].grid;
    for (let i = 1; i < axis.length; i++) expect(axis[i] - axis[i - 1]).toBeLessThanOrEqual(Math.PI / 8 / 0.5 + 1e-12);
  });
});
