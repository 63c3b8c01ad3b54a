import { describe, expect, it } from "vitest";
import { fitStepTest, identificationProvenance } from "../../src/identification/fit-step-test.js";
import { stepTestSettingsSchema } from "../../src/identification/step-test-settings.js";
import { withWorkBudget } from "../../src/simulation/work-budget.js";
import { expectClose } from "../support/expect-close.js";
import { stepCsv } from "./step-data.js";

// FOPDT k = 0.8, τ = 12 s, θ = 3.7 s under a step of 15 at t = 10 s from y0 = 50:
// y = y0 + kΔu(1 − e^(−(s−θ)/τ)) (closed form, Seborg, Edgar, Mellichamp & Doyle 2016, §5.2).
const truth = { k: 0.8, tau: 12, theta: 3.7 };
const response = (s: number) => (s > truth.theta ? truth.k * 15 * (1 - Math.exp(-(s - truth.theta) / truth.tau)) : 0);
const text = stepCsv({ h: 0.05, horizon: 160, stepTime: 10, u0: 20, du: 15, y0: 50, response });
const settings = stepTestSettingsSchema.parse({ columns: { time: "time", input: "power", output: "temperature" }, units: { input: "%", output: "°C" } });

describe("fitStepTest", () => {
  it("fitStepTest fits each model on every kept sample and thins the plotted series to FIT_PLOT_POINTS", () => {
    const report = fitStepTest(text, settings, ["fopdt", "sopdt", "ipdt"]);
    // 3201 samples (160 s at 0.05 s), all fitted; the plots carry at most 1500 of them, the last included.
    expect(report.samples).toBe(3201);
    expect(report.series.t.length).toBeLessThanOrEqual(1500);
    expect(report.series.t.at(-1)).toBe(160);
    expectClose(report.stepTime, 10, 1e-12);
    expectClose(report.stepSize, 15, 1e-12);
    expectClose(report.y0, 50, 1e-12);
    const fopdt = report.fits.fopdt;
    if (!fopdt?.ok) throw new Error("fopdt did not fit");
    // Noise-free data: the truth within 1e-4 relative (issue's check; Smith 1957 start, Marquardt 1963 search).
    for (const [name, value] of Object.entries(truth)) expectClose(fopdt.parameters[name], value, 0, 1e-4);
    // Fitted levels are in the file's unit: the model's final value is y0 + kΔu = 50 + 12 = 62 (closed form).
    expectClose(fopdt.fitted.at(-1)!, 50 + 12 * (1 - Math.exp(-(150 - 3.7) / 12)), 1e-6);
    expect(fopdt.residuals.length).toBe(report.series.t.length);
    // The measured levels carry the offset too: y(0) = 50.
    expectClose(report.series.y[0], 50, 1e-12);
    expect(report.units).toEqual({ time: "s", input: "%", output: "°C" });
    // An integrating model does not describe a settling response: it fits, but worse than FOPDT.
    const ipdt = report.fits.ipdt;
    if (!ipdt?.ok) throw new Error("ipdt did not fit");
    expect(ipdt.r2).toBeLessThan(fopdt.r2);
  });

  it("identificationProvenance keeps the settings, the resolved columns and the chosen fit", () => {
    const report = fitStepTest(text, settings, ["fopdt"]);
    const provenance = identificationProvenance("5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11", "ember.csv", settings, report, "fopdt");
    expect(provenance?.columns.output).toEqual({ index: 3, name: "temperature" });
    expect(provenance?.fit.model).toBe("fopdt");
    expect(provenance?.fit.samples).toBe(3201);
    expect(identificationProvenance("x", "ember.csv", settings, report, "sopdt")).toBeNull();
  });

  it("fitStepTest charges its model evaluations to the work budget and stops when it runs out", () => {
    const spent = withWorkBudget({ evaluations: 1e9 }, () => fitStepTest(text, settings, ["fopdt"]));
    expect(spent.ok).toBe(true);
    // At least one pass over the 3201 samples per Jacobian column (k, τ, θ, δ: 2 evaluations each, central differences).
    expect(spent.evaluations).toBeGreaterThan(3201 * 8);
    const starved = withWorkBudget({ evaluations: 10_000 }, () => fitStepTest(text, settings, ["fopdt"]));
    expect(starved.ok).toBe(false);
  });

  it("stepTestSettingsSchema refuses the same column chosen twice, naming it", () => {
    const bad = stepTestSettingsSchema.safeParse({ columns: { time: 1, input: 2, output: 2 } });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["columns", "output"]);
  });
});
