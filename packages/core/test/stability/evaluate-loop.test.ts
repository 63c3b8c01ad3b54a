import { describe, expect, it } from "vitest";
import { evaluateLoop } from "../../src/stability/evaluate-loop.js";
import { expectClose } from "../support/expect-close.js";

describe("evaluateLoop", () => {
  it("evaluateLoop(e^(−s)/(s + 1), ω) has |L| = 1/√(1 + ω²) and arg L = −atan ω − ω", () => {
    // Closed form of the first-order-plus-dead-time loop (Åström & Murray 2008 §9.1).
    for (const omega of [0, 0.1, 1, 2.0288, 10, 300]) {
      const l = evaluateLoop({ num: [1], den: [1, 1], delay: 1 }, omega);
      expectClose(Math.hypot(l.re, l.im), 1 / Math.sqrt(1 + omega * omega), 1e-15, 1e-13);
      const phase = -Math.atan(omega) - omega;
      expectClose(l.re, Math.cos(phase) / Math.sqrt(1 + omega * omega), 1e-14, 1e-12);
      expectClose(l.im, Math.sin(phase) / Math.sqrt(1 + omega * omega), 1e-14, 1e-12);
    }
  });

  it("evaluateLoop of a rational loop matches the complex quotient written out by hand", () => {
    // (2jω + 3)/((jω)² + jω + 4) at ω = 1.5: num = 3 + 3j, den = 1.75 + 1.5j; quotient by hand:
    // (3 + 3j)(1.75 − 1.5j)/(1.75² + 1.5²) = (9.75 + 0.75j)/5.3125.
    const l = evaluateLoop({ num: [2, 3], den: [1, 1, 4], delay: 0 }, 1.5);
    expectClose(l.re, 9.75 / 5.3125, 1e-15);
    expectClose(l.im, 0.75 / 5.3125, 1e-15);
  });

  it("evaluateLoop at −ω is the complex conjugate of the value at ω", () => {
    const loop = { num: [1, -2, 5], den: [1, 3, 3, 1], delay: 0.7 };
    const plus = evaluateLoop(loop, 2.3);
    const minus = evaluateLoop(loop, -2.3);
    expectClose(minus.re, plus.re, 1e-15);
    expectClose(minus.im, -plus.im, 1e-15);
  });

  it("evaluateLoop keeps its precision when den is huge (scaled complex division)", () => {
    // 1/(s + 1)^10 at ω = 1e30: |L| = (1 + ω²)^(−5) ≈ 1e-300, still representable.
    const den = [1, 10, 45, 120, 210, 252, 210, 120, 45, 10, 1];
    const l = evaluateLoop({ num: [1], den, delay: 0 }, 1e30);
    expect(Number.isFinite(l.re) && Number.isFinite(l.im)).toBe(true);
  });

  it("evaluateLoop names the bad field", () => {
    expect(() => evaluateLoop({ num: [1], den: [0, 0], delay: 0 }, 1)).toThrow(/loop\.den/);
    expect(() => evaluateLoop({ num: [1], den: [1, 1], delay: Number.NaN }, 1)).toThrow(/loop\.delay/);
    expect(() => evaluateLoop({ num: [1], den: [1, 1], delay: 0 }, Number.POSITIVE_INFINITY)).toThrow(/omega/);
  });
});
