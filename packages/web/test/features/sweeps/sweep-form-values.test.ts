import { describe, expect, it } from "vitest";
import { sweepInputSchema } from "@loopyard/core";
import { defaultSweepForm, formFieldOf, structureCounts, sweepFieldErrors, toSweepInput } from "../../../src/features/sweeps/sweep-form-values.js";

const REVISION = "00000000-0000-4000-8000-000000000001";

describe("sweep form values", () => {
  it("toSweepInput sends only the chosen structure's rows, the load step of a load-step scenario and no setpoint", () => {
    const values = { ...defaultSweepForm(REVISION, 50), name: "Tank PI", structure: "pi" as const };
    values.scenario = { ...values.scenario, kind: "load-step", load: { size: 0.2, time: 5 } };
    values.criteria = ["iae", "settlingTime"];
    const input = toSweepInput(values, { stateNames: ["h"] });
    expect(Object.keys(input.ranges)).toEqual(["kp", "ki"]);
    expect(input.filter).toBeUndefined();
    expect(input.scenario).toEqual({ kind: "load-step", horizon: 50, dt: 0.05, load: { size: 0.2, time: 5 } });
    expect(input.criterionOptions).toEqual({ settlingBand: 0.02 });
    expect(sweepInputSchema.safeParse(input).success).toBe(true);
  });

  it("toSweepInput names state-feedback gains k[0]…k[n−1] after the plant's states and n, and the schema accepts them", () => {
    const values = { ...defaultSweepForm(REVISION, 20), name: "SF", structure: "state-feedback" as const };
    const input = toSweepInput(values, { stateNames: ["x₀", "x₁"] });
    expect(Object.keys(input.ranges)).toEqual(["k[0]", "k[1]", "n"]);
    // Grid size is the product of the counts (closed form): 3 · 3 · 1 = 9.
    expect(structureCounts(values, { stateNames: ["x₀", "x₁"] }).reduce((a, b) => a * b, 1)).toBe(9);
    expect(sweepInputSchema.safeParse(input).success).toBe(true);
  });

  it("formFieldOf maps API paths to form fields: brackets dropped, fixed values to their row's min", () => {
    expect(formFieldOf("ranges.k[0].min")).toBe("ranges.k0.min");
    expect(formFieldOf(["ranges", "k[3]", "count"])).toBe("ranges.k3.count");
    expect(formFieldOf("fixed.kd")).toBe("ranges.kd.min");
    expect(formFieldOf("scenario.load.time")).toBe("scenario.load.time");
  });

  it("sweepFieldErrors puts the schema's load-time rule on the load time field", () => {
    const values = { ...defaultSweepForm(REVISION, 50), name: "Late load", structure: "pi" as const };
    values.scenario = { ...values.scenario, kind: "load-step", load: { size: 1, time: 80 } };
    const parsed = sweepInputSchema.safeParse(toSweepInput(values, { stateNames: [] }));
    expect(parsed.success).toBe(false);
    if (!parsed.success) expect(sweepFieldErrors(parsed.error.issues)["scenario.load.time"]).toMatch(/before the end/);
  });

  it("toSweepInput sends the infinite horizon only with ise, effort or quadratic, and the wsNorm weight as the performance preset", () => {
    const values = { ...defaultSweepForm(REVISION, 60), name: "Exact and weighted" };
    values.criteria = ["ise", "effort", "wsNorm"];
    values.criterionOptions = { ...values.criterionOptions, infiniteHorizon: true, weight: { M: 2, omegaB: 0.5, A: 1e-4 } };
    const input = toSweepInput(values, { stateNames: [] });
    expect(input.criterionOptions).toEqual({ horizon: "infinite", weight: { preset: "performance", M: 2, omegaB: 0.5, A: 1e-4 } });
    const parsed = sweepInputSchema.safeParse(input);
    expect(parsed.success).toBe(true);
    // W = (s/M + ωB)/(s + ωB·A) (Skogestad & Postlethwaite 2005, §2.8.2, from memory) = (0.5s + 0.5)/(s + 5e-5).
    const weight = parsed.data?.criterionOptions?.weight;
    expect(weight?.num[0]).toBeCloseTo(0.5, 12);
    expect(weight?.den[1]).toBeCloseTo(5e-5, 15);
    values.criteria = ["iae", "itae"];
    expect(toSweepInput(values, { stateNames: [] }).criterionOptions).toBeUndefined();
  });

  it("sweepFieldErrors puts a bad weight field at its input", () => {
    const values = { ...defaultSweepForm(REVISION, 60), name: "Bad weight", criteria: ["wsNorm" as const] };
    values.criterionOptions = { ...values.criterionOptions, weight: { M: -1, omegaB: 0.5, A: 1e-4 } };
    const parsed = sweepInputSchema.safeParse(toSweepInput(values, { stateNames: [] }));
    expect(parsed.success).toBe(false);
    const errors = sweepFieldErrors(parsed.error?.issues ?? []);
    expect(Object.keys(errors).some((k) => k.startsWith("criterionOptions.weight"))).toBe(true);
  });
});
