import { readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { comparisonSpecSchema } from "../../src/comparison/comparison-definition.js";
import { CORE_DIR, ensureDist } from "../support/ensure-dist.js";
import { expectClose } from "../support/expect-close.js";
import { expectOneSentence, runLoopyard as loopyard } from "../support/run-loopyard.js";

// These tests spawn the built CLI (node packages/core/dist/cli/main.js), building dist first when it is stale.
beforeAll(() => ensureDist(), 200_000);

/** PI on 1/(s+1) with exact (infinite-horizon) costs: small enough for a quick run. */
const SPEC = {
  family: { variants: [{ label: "plate", plant: { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 } }] },
  structure: "pi",
  ranges: { kp: { min: 0.1, max: 10, scale: "log" }, ki: { min: 0.1, max: 10, scale: "log" } },
  scenario: { kind: "setpoint-step", horizon: 20, dt: 0.01 },
  criterionOptions: { horizon: "infinite" },
  aggregate: { kind: "worst" },
  contenders: [{ criterion: "quadratic", q: 1, r: 1, label: "J1" }, "ise"],
  judges: ["effort"],
  budget: { prescan: 64, starts: 2, evaluations: 150, stability: false },
  seed: 3,
};

interface Output {
  picks: {
    contender: string;
    found: boolean;
    params: Record<string, number>;
    atBound: { parameter: string; bound: string }[];
    scores: Record<string, number>;
    perVariant: { variant: string; status: string; scores: Record<string, number> }[];
  }[];
  crossScore: { columns: { key: string }[]; rows: { contender: string; values: Record<string, number>; regrets: Record<string, number | string> }[]; best: Record<string, string> };
  agreement: { columns: string[]; tau: number[][]; candidates: number; reading: string };
  summary: string[];
}

describe("loopyard compare", () => {
  it("loopyard compare - prints each pick with params, atBound, scores and per-variant scores, the cross-score and the agreement", async () => {
    const run = await loopyard(["compare", "-", "--workers", "1"], JSON.stringify(SPEC));
    expect(run.stderr).toBe("");
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout) as Output;
    expect(out.picks.map((p) => p.contender)).toEqual(["J1", "ise"]);
    // Hand-minimised (see test/comparison/comparison-picks.test.ts): J = ISE + Effort on 1/(s+1) is least at
    // kp = ki = √2, J* = (1 + (√2 − 1)²)/(2√2) = √2 − 1.
    const [j1, ise] = out.picks;
    expectClose(j1.params.kp, Math.SQRT2, 0, 0.01);
    expectClose(j1.params.ki, Math.SQRT2, 0, 0.01);
    expectClose(j1.scores.J1, Math.SQRT2 - 1, 0, 0.005);
    expect(Object.keys(j1.scores)).toEqual(["J1", "ise", "effort"]);
    expect(j1.perVariant).toEqual([{ variant: "plate", status: "stable", scores: j1.scores }]);
    // ISE falls in both gains (closed form (ki + 1)/(2ki(1 + kp))): the box's corner, flagged as chosen by the box.
    expect(ise.atBound).toEqual([
      { parameter: "kp", bound: "max" },
      { parameter: "ki", bound: "max" },
    ]);
    expect(out.crossScore.rows.map((r) => [r.regrets.J1, r.regrets.ise])).toEqual([
      [0, expect.any(Number)],
      [expect.any(Number), 0],
    ]);
    expect(out.crossScore.best).toEqual({ J1: "J1", ise: "ise", effort: "J1" });
    expect(out.agreement.columns).toEqual(["J1", "ise", "effort"]);
    expect(out.agreement.tau[0][0]).toBe(1);
    expect(out.agreement.candidates).toBe(64);
    expect(out.summary.some((s) => s.startsWith("ISE's pick sits on the upper bound of kp and ki"))).toBe(true);
  }, 120_000);

  it.each([
    [{ contenders: ["iae", "fastness"] }, "contenders[1]"],
    [{ judges: ["ise"] }, "judges[0]"],
    [{ constraints: { margin: { max: 2 } } }, "constraints.margin"],
    [{ constraints: { ms: { below: 2 } } }, "constraints.ms"],
    [{ contenders: [{ criterion: "quadratic", r: -1, label: "bad" }] }, "contenders[0]"],
    [{ ranges: { kp: { min: 1, max: 1 }, ki: { min: 0.1, max: 1 } } }, "ranges.kp.max"],
    [{ ranges: { kp: { min: 0.1, max: 1 }, kd: { min: 0.1, max: 1 } } }, "ranges.kd"],
    [{ budget: { prescan: 4 } }, "budget.prescan"],
    [{ family: { variants: [] } }, "family.variants"],
  ])("loopyard compare refuses %j with one sentence naming %s (exit code 2)", async (change, field) => {
    const run = await loopyard(["compare", "-"], JSON.stringify({ ...SPEC, ...change }));
    expect(run.code).toBe(2);
    expectOneSentence(run.stderr, field);
  });

  it("loopyard compare refuses an option it does not take", async () => {
    const run = await loopyard(["compare", "spec.json", "--format", "csv"]);
    expect(run.code).toBe(2);
    expectOneSentence(run.stderr, "--format");
  });

  it("the example compare-ember-family-pid.json is a valid comparison spec", () => {
    const example = JSON.parse(readFileSync(join(CORE_DIR, "examples", "compare-ember-family-pid.json"), "utf8")) as unknown;
    const parsed = comparisonSpecSchema.safeParse(example);
    expect(parsed.success).toBe(true);
  });
});
