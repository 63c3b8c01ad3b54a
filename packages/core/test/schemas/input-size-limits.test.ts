// Sizes taken from input are refused by the schemas themselves (issue 11, item 1: every size
// checked before anything is built from it): the weight's polynomial order, a state-space model's
// matrix dimensions, a nonlinear plant's derivative, initial-value and parameter counts. Each
// limit is the plants' order limit (MAX_PLANT_ORDER = MAX_NONLINEAR_STATES = 10; common practice:
// one bound for every dimension a user writes); each test sends one more than allowed.
import { describe, expect, it } from "vitest";
import { MAX_NONLINEAR_STATES, nonlinearSchema, sensitivityWeightSchema, stateSpaceSchema } from "../../src/index.js";
import { MAX_WEIGHT_COEFFICIENTS } from "../../src/frequency/sensitivity-weight-schema.js";
import { MAX_NONLINEAR_PARAMETERS } from "../../src/plants/nonlinear.js";
import { MAX_PLANT_ORDER } from "../../src/plants/transfer-function.js";

interface Issue {
  path: PropertyKey[];
  message: string;
  code?: string;
  errors?: Issue[][];
}

/** The first issue; of a union (the weight is {num, den} or a preset), the first issue of its first branch. */
function firstIssue(result: { success: boolean; error?: { issues: Issue[] } }): Issue {
  expect(result.success).toBe(false);
  const issue = result.error!.issues[0]!;
  return issue.code === "invalid_union" && issue.errors?.[0]?.[0] ? issue.errors[0][0] : issue;
}

describe("sensitivityWeightSchema", () => {
  it("refuses a numerator of order 11 (12 coefficients), naming num", () => {
    const issue = firstIssue(sensitivityWeightSchema.safeParse({ num: Array(MAX_WEIGHT_COEFFICIENTS + 1).fill(1), den: Array(MAX_WEIGHT_COEFFICIENTS + 1).fill(1) }));
    expect(issue.path).toEqual(["num"]);
    expect(issue.message).toBe("at most 11 coefficients (order 10)");
  });

  it("refuses 100,000 denominator coefficients before any is read as a number", () => {
    const issue = firstIssue(sensitivityWeightSchema.safeParse({ num: [1], den: Array(100_000).fill("x") }));
    expect(issue.path).toEqual(["den"]);
    expect(issue.message).toMatch(/at most 11 coefficients/);
  });

  it("still accepts order 10", () => {
    expect(sensitivityWeightSchema.safeParse({ num: [1], den: Array(MAX_WEIGHT_COEFFICIENTS).fill(1) }).success).toBe(true);
  });
});

describe("stateSpaceSchema", () => {
  const one = { kind: "state-space", A: [[-1]], B: [[1]], C: [[1]], D: [[0]] };

  it("refuses a B of 11 rows, naming B", () => {
    const issue = firstIssue(stateSpaceSchema.safeParse({ ...one, B: Array(MAX_PLANT_ORDER + 1).fill([1]) }));
    expect(issue.path).toEqual(["B"]);
    expect(issue.message).toBe("B has at most 10 rows");
  });

  it("refuses a C row of 11 entries, naming the row", () => {
    const issue = firstIssue(stateSpaceSchema.safeParse({ ...one, C: [Array(MAX_PLANT_ORDER + 1).fill(1)] }));
    expect(issue.path).toEqual(["C", 0]);
    expect(issue.message).toMatch(/a row has at most 10 entries/);
  });

  it("refuses a D of 11 rows", () => {
    expect(firstIssue(stateSpaceSchema.safeParse({ ...one, D: Array(MAX_PLANT_ORDER + 1).fill([0]) })).path).toEqual(["D"]);
  });
});

describe("nonlinearSchema", () => {
  const tank = { kind: "nonlinear", states: ["h"], parameters: { a: 1 }, derivatives: ["-a*h + u"], output: "h", initial: [0] };

  it("refuses 11 derivatives, naming derivatives, before comparing them with the states", () => {
    const issue = firstIssue(nonlinearSchema.safeParse({ ...tank, derivatives: Array(MAX_NONLINEAR_STATES + 1).fill("u") }));
    expect(issue.path).toEqual(["derivatives"]);
    expect(issue.message).toBe("at most 10 derivatives, one per state");
  });

  it("refuses 11 initial values, naming initial", () => {
    const issue = firstIssue(nonlinearSchema.safeParse({ ...tank, initial: Array(MAX_NONLINEAR_STATES + 1).fill(0) }));
    expect(issue.path).toEqual(["initial"]);
  });

  it("refuses 65 parameters, naming parameters", () => {
    const parameters = Object.fromEntries(Array.from({ length: MAX_NONLINEAR_PARAMETERS + 1 }, (_, i) => [`p${i}`, i]));
    const issue = firstIssue(nonlinearSchema.safeParse({ ...tank, parameters }));
    expect(issue.path).toEqual(["parameters"]);
    expect(issue.message).toBe("at most 64 parameters");
  });

  it("still accepts the one-state tank", () => {
    expect(nonlinearSchema.safeParse(tank).success).toBe(true);
  });
});

describe("firstSweepIssue of a weight that fits neither form", () => {
  it("names the coefficient limit at criterionOptions.weight.den, not zod's 'Invalid input'", async () => {
    const { criterionOptionsSchema } = await import("../../src/sweeps/sweep-input.js");
    const { firstSweepIssue } = await import("../../src/sweeps/sweep-issue.js");
    const result = criterionOptionsSchema.safeParse({ weight: { num: [1], den: Array(20).fill(1) } });
    expect(result.success).toBe(false);
    const issue = firstSweepIssue(result.error!);
    expect(issue.field).toBe("weight.den");
    expect(issue.sentence).toBe("weight.den: at most 11 coefficients (order 10)");
  });

  it("names a bad preset's own field when the preset form comes closest", async () => {
    const { criterionOptionsSchema } = await import("../../src/sweeps/sweep-input.js");
    const { firstSweepIssue } = await import("../../src/sweeps/sweep-issue.js");
    const result = criterionOptionsSchema.safeParse({ weight: { preset: "performance", M: -1, omegaB: 1, A: 0 } });
    expect(firstSweepIssue(result.error!).sentence).toBe("weight.M: M must be > 0");
  });
});
