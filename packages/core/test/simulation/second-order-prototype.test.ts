import { describe, expect, it } from "vitest";
import { effort } from "../../src/criteria/effort.js";
import { ise } from "../../src/criteria/ise.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

/*
 * The plant ωn²/(s(s + 2ζωn)) under P control kp = 1 closes to the second-order prototype
 * ωn²/(s² + 2ζωn s + ωn²) (unity feedback: G/(1 + G)).
 * - ISE of the unit-step error over [0, ∞) = (1 + 4ζ²)/(4ζωn): standard integral tables
 *   (G. C. Newton, L. A. Gould and J. F. Kaiser, Analytical Design of Linear Feedback Controls,
 *   Wiley, 1957, table of the integrals Iₙ — table position from memory; I₂ applied to
 *   E(s) = (s + 2ζωn)/(s² + 2ζωn s + ωn²), the Laplace transform of the unit-step error).
 * - Peak overshoot exp(−ζπ/√(1 − ζ²)) at t_p = π/(ωn√(1 − ζ²)): common practice, e.g. K. Ogata,
 *   Modern Control Engineering, 5th ed., 2010, §5.3.
 * The horizon is 40/(ζωn): the error envelope e^(−ζωn t) is then below e^(−40), so the
 * finite-horizon ISE equals the infinite one to well below the stated tolerance.
 */
describe("simulateLoop on the second-order prototype", () => {
  const cases = [
    { zeta: 0.5, wn: 2 },
    { zeta: 0.2, wn: 3 },
    { zeta: 0.7, wn: 1 },
  ];
  for (const { zeta, wn } of cases) {
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [wn * wn], den: [1, 2 * zeta * wn, 0], delay: 0 };
    const dt = 1e-3;
    const trace = simulateLoop(plant, { kind: "pid", kp: 1, ki: 0, kd: 0, tf: 0 }, { kind: "setpoint-step", horizon: 40 / (zeta * wn), dt });

    it(`ise(trace) = (1 + 4ζ²)/(4ζωn) for ζ = ${zeta}, ωn = ${wn}`, () => {
      // Tolerance: trapezoid error ≈ dt²/12·|f'| with f = e², f'(0) = 0, |f'| ≤ 2ωn: bound dt²·ωn.
      expectClose(ise(trace.t, trace.e), (1 + 4 * zeta * zeta) / (4 * zeta * wn), dt * dt * wn);
    });

    it(`the peak of y is 1 + exp(−ζπ/√(1 − ζ²)) for ζ = ${zeta}, ωn = ${wn}`, () => {
      let peak = 0;
      let at = 0;
      for (let k = 0; k < trace.y.length; k++) if (trace.y[k] > peak) [peak, at] = [trace.y[k], trace.t[k]];
      // Sampling the peak on the grid misses it by at most ½|y''|(dt/2)² ≤ ωn²·dt²/8.
      expectClose(peak - 1, Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta)), (wn * wn * dt * dt) / 8 + 1e-12);
      expectClose(at, Math.PI / (wn * Math.sqrt(1 - zeta * zeta)), dt);
    });

    it(`an integrating plant needs u∞ = 0, and then effort = ISE under kp = 1 (ζ = ${zeta})`, () => {
      // u = kp·e with kp = 1 and u∞ = 0 (pole at s = 0): ∫(u − u∞)² = ∫e².
      expect(trace.uInfinity).toBe(0);
      expectClose(effort(trace.t, trace.u, trace.uInfinity), ise(trace.t, trace.e), 1e-12);
    });
  }
});
