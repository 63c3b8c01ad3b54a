import { describe, expect, it } from "vitest";
import { fitStepModel, MAX_SEARCH_SAMPLES } from "../../src/identification/fit-step-model.js";
import { identifyStepTest } from "../../src/identification/identify-step-test.js";
import { prepareStepTest } from "../../src/identification/prepare-step-test.js";
import { readStepTest } from "../../src/identification/read-step-test.js";
import { twoPointEstimate } from "../../src/identification/two-point-estimate.js";
import { expectClose } from "../support/expect-close.js";
import { stepCsv, type SyntheticStep } from "./step-data.js";

// Closed-form step responses (Seborg, Edgar, Mellichamp & Doyle, Process Dynamics and Control,
// 4th ed., 2016, §5.2–5.3), s the time after the step, written here independently of the source:
//   FOPDT k·e^(−θs)/(τs+1):            Δy = k·Δu·(1 − e^(−(s−θ)/τ))
//   SOPDT k·e^(−θs)/((τ1s+1)(τ2s+1)):  Δy = k·Δu·(1 − (τ1·e^(−(s−θ)/τ1) − τ2·e^(−(s−θ)/τ2))/(τ1 − τ2))
//   IPDT  k·e^(−θs)/s:                 Δy = k·Δu·(s − θ)
const FOPDT_TRUE = { k: 0.8, tau: 12, theta: 3.7 };
const SOPDT_TRUE = { k: -1.5, tau1: 9, tau2: 3, theta: 2.3 };
const IPDT_TRUE = { k: 0.05, theta: 4.2 };
const DU = 15;

const fopdt = (s: number) => (s > FOPDT_TRUE.theta ? FOPDT_TRUE.k * DU * (1 - Math.exp(-(s - FOPDT_TRUE.theta) / FOPDT_TRUE.tau)) : 0);
const sopdt = (s: number) => {
  const { k, tau1, tau2, theta } = SOPDT_TRUE;
  const r = s - theta;
  return r > 0 ? k * DU * (1 - (tau1 * Math.exp(-r / tau1) - tau2 * Math.exp(-r / tau2)) / (tau1 - tau2)) : 0;
};
const ipdt = (s: number) => (s > IPDT_TRUE.theta ? IPDT_TRUE.k * DU * (s - IPDT_TRUE.theta) : 0);

const base = { h: 0.5, stepTime: 10, u0: 20, du: DU, y0: 50 };
const CASES = [
  { kind: "fopdt", truth: FOPDT_TRUE as Record<string, number>, data: { ...base, horizon: 160, response: fopdt, sd: 0.15 } },
  { kind: "sopdt", truth: SOPDT_TRUE as Record<string, number>, data: { ...base, horizon: 160, response: sopdt, sd: 0.2 } },
  { kind: "ipdt", truth: IPDT_TRUE as Record<string, number>, data: { ...base, horizon: 100, response: ipdt, sd: 0.15 } },
] as const satisfies readonly { kind: "fopdt" | "sopdt" | "ipdt"; truth: Record<string, number>; data: SyntheticStep }[];

describe("fitStepModel on synthetic step tests", () => {
  for (const c of CASES) {
    it(`fitStepModel(${c.kind}) recovers the true parameters within 1e-4 relative from noise-free data`, () => {
      const { fit } = identifyStepTest(stepCsv({ ...c.data, sd: 0 }), { model: c.kind });
      if (!fit.ok) throw new Error(fit.reason);
      for (const [name, value] of Object.entries(c.truth)) expectClose(fit.parameters[name], value, 0, 1e-4);
      expectClose(fit.r2, 1, 1e-10);
    });

    it(`fitStepModel(${c.kind}) brackets the true parameters in its 95 % intervals under seeded Gaussian noise`, () => {
      const { fit } = identifyStepTest(stepCsv({ ...c.data, seed: 7 }), { model: c.kind });
      if (!fit.ok) throw new Error(fit.reason);
      for (const [name, value] of Object.entries(c.truth)) {
        const [lo, hi] = fit.intervals[name];
        expect(lo, `${name} low`).toBeLessThan(value);
        expect(hi, `${name} high`).toBeGreaterThan(value);
        // The interval is informative, not a blanket: narrower than the value itself.
        expect(hi - lo, `${name} width`).toBeLessThan(Math.abs(value));
      }
      expect(fit.r2).toBeGreaterThan(0.99);
      // Residuals are y − ŷ per sample: their squares add up to the SSE.
      expectClose(fit.residuals.reduce((s, r) => s + r * r, 0), fit.sse, 0, 1e-12);
    });
  }

  it("the 95 % intervals of the FOPDT fit cover the truth in about 95 % of 40 seeded tests, for k, τ and θ", () => {
    // Coverage of a 95 % interval (Bates & Watts 1988, §2.3): over 40 independent noise draws the
    // count covering a true parameter is Binomial(40, 0.95): mean 38, sd 1.4; fewer than 34 (3 sd) fails.
    // k depends on the initial level, estimated from the 20 samples before the step: the fitted
    // correction δ carries that uncertainty into its interval.
    const covered: Record<string, number> = { k: 0, tau: 0, theta: 0 };
    for (let seed = 100; seed < 140; seed++) {
      const { fit } = identifyStepTest(stepCsv({ ...CASES[0].data, seed }), { model: "fopdt" });
      if (!fit.ok) throw new Error(fit.reason);
      for (const name of Object.keys(covered)) {
        const value = FOPDT_TRUE[name as keyof typeof FOPDT_TRUE];
        if (fit.intervals[name][0] < value && value < fit.intervals[name][1]) covered[name]++;
      }
    }
    for (const name of Object.keys(covered)) expect(covered[name], name).toBeGreaterThanOrEqual(34);
  });

  it("fitStepModel on a test longer than MAX_SEARCH_SAMPLES searches a subset, refines on all samples and still recovers the truth", () => {
    // 8001 samples (h = 0.02 s) > MAX_SEARCH_SAMPLES = 4000: the Gauss–Newton refinement on every sample must
    // reach the noise-free optimum (the true parameters) as the full search does.
    expect(MAX_SEARCH_SAMPLES).toBeLessThan(8001);
    const { fit } = identifyStepTest(stepCsv({ ...CASES[0].data, h: 0.02, sd: 0 }), { model: "fopdt" });
    if (!fit.ok) throw new Error(fit.reason);
    for (const [name, value] of Object.entries(FOPDT_TRUE)) expectClose(fit.parameters[name], value, 0, 1e-4);
    // With noise, the 95 % intervals of all 8001 samples still bracket the truth.
    const noisy = identifyStepTest(stepCsv({ ...CASES[0].data, h: 0.02, seed: 11 }), { model: "fopdt" }).fit;
    if (!noisy.ok) throw new Error(noisy.reason);
    // Degrees of freedom n − q: k, τ, θ and the initial-level correction δ.
    expect(noisy.dof).toBe(8001 - 4);
    for (const [name, value] of Object.entries(FOPDT_TRUE)) {
      expect(noisy.intervals[name][0]).toBeLessThan(value);
      expect(noisy.intervals[name][1]).toBeGreaterThan(value);
    }
  });

  it("fitStepModel handles a downward input step between samples, the time column in minutes and a trimmed window", () => {
    // FOPDT with Δu = −15 at t = 10.2 s, sampled every 0.5 s: the first sample at the new level is at
    // 10.5 s, so the model's step comes 0.3 s late and the fitted θ is the true θ − 0.3 s (exact data).
    const minutes = (s: number) => s / 60;
    const n = 321;
    const lines = ["t_min;valve;temperature"];
    for (let j = 0; j < n; j++) {
      const t = j * 0.5;
      const u = t >= 10.2 ? 5 : 20;
      const dy = t - 10.2 > FOPDT_TRUE.theta ? FOPDT_TRUE.k * -15 * (1 - Math.exp(-(t - 10.2 - FOPDT_TRUE.theta) / FOPDT_TRUE.tau)) : 0;
      lines.push([minutes(t), u, 70 + dy].map((v) => String(v).replace(".", ",")).join(";"));
    }
    const { fit, test } = identifyStepTest(lines.join("\n"), { model: "fopdt", timeUnit: "min", trim: { from: 2, to: 150 } });
    if (!fit.ok) throw new Error(fit.reason);
    expect(test.units.time).toBe("min");
    expectClose(fit.stepTime, 10.5, 1e-12);
    expectClose(fit.stepSize, -15, 1e-12);
    expectClose(fit.parameters.k, FOPDT_TRUE.k, 0, 1e-4);
    expectClose(fit.parameters.tau, FOPDT_TRUE.tau, 0, 1e-4);
    expectClose(fit.parameters.theta, FOPDT_TRUE.theta - 0.3, 0, 1e-4);
    expectClose(fit.y0, 70, 1e-9);
    expectClose(fit.t[0], 2, 1e-12);
  });

  it("the fitted model is a transfer function with the fitted parameters", () => {
    const { fit } = identifyStepTest(stepCsv({ ...CASES[1].data, sd: 0 }), { model: "sopdt" });
    if (!fit.ok) throw new Error(fit.reason);
    const p = fit.parameters;
    // G(s) = k·e^(−θs)/(τ1τ2 s² + (τ1 + τ2)s + 1), τ1 ≥ τ2.
    expect(p.tau1).toBeGreaterThan(p.tau2);
    expect(fit.model.kind).toBe("transfer-function");
    expect(fit.model.num).toEqual([p.k]);
    expectClose(fit.model.den[0], p.tau1 * p.tau2, 0, 1e-15);
    expectClose(fit.model.den[1], p.tau1 + p.tau2, 0, 1e-15);
    expect(fit.model.delay).toBe(p.theta);
  });
});

describe("twoPointEstimate (Smith 1957)", () => {
  it("twoPointEstimate on exact FOPDT data gives τ = 1.5·(t63.2 − t28.3) and θ = t63.2 − τ within the sampling error", () => {
    // Exact crossing times of Δy = kΔu(1 − e^(−(s−θ)/τ)): s_f = θ − τ·ln(1 − f) for f = 0.283, 0.632;
    // Smith's formulas on them give τ_S = 1.5·(s_0.632 − s_0.283), θ_S = s_0.632 − τ_S (Smith 1957).
    const h = 0.5;
    const test = prepareStepTest(readStepTest(stepCsv({ ...CASES[0].data, sd: 0 })));
    const est = twoPointEstimate(test);
    if (!est.ok) throw new Error(est.reason);
    const { tau, theta, k } = FOPDT_TRUE;
    const s283 = theta - tau * Math.log(1 - 0.283);
    const s632 = theta - tau * Math.log(1 - 0.632);
    const tauS = 1.5 * (s632 - s283);
    // Linear interpolation between samples h apart misplaces a crossing by at most h²·max|y''|/(8·min|y'|)
    // over the bracketing interval (common practice); here below 0.01 s, so each time is within h/10.
    expectClose(est.t283, s283, h / 10);
    expectClose(est.t632, s632, h / 10);
    expectClose(est.tau, tauS, 1.5 * 2 * (h / 10));
    expectClose(est.theta, s632 - tauS, 4 * (h / 10));
    // The final value is read from the last 10 % of the samples (settled to e^(−(150−θ)/τ) ≈ 5e-6).
    expectClose(est.k, k, 0, 1e-5);
    // Smith's estimate of a true FOPDT: τ_S = 1.5·ln(0.717/0.368)·τ = 1.0005·τ (Smith 1957).
    expectClose(est.tau, tau, 0, 2e-3);
  });

  it("fitStepModel reports the two-point estimate it started from", () => {
    const test = prepareStepTest(readStepTest(stepCsv({ ...CASES[0].data, sd: 0 })));
    const est = twoPointEstimate(test);
    const fit = fitStepModel(test, "fopdt");
    if (!est.ok || !fit.ok) throw new Error("no estimate");
    expect(fit.start).toEqual({ k: est.k, tau: est.tau, theta: est.theta });
  });

  it("twoPointEstimate refuses an output that never settles away from its initial level", () => {
    const test = prepareStepTest(readStepTest(stepCsv({ ...base, horizon: 50, response: () => 0 })));
    const est = twoPointEstimate(test);
    expect(est.ok).toBe(false);
  });
});
