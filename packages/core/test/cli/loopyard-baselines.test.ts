import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { CORE_DIR, ensureDist } from "../support/ensure-dist.js";
import { expectOneSentence, runLoopyard as loopyard } from "../support/run-loopyard.js";
import { expectClose } from "../support/expect-close.js";

// These tests spawn the built CLI (node packages/core/dist/cli/main.js), building dist first when it is stale.
beforeAll(() => ensureDist(), 200_000);

const dir = mkdtempSync(join(tmpdir(), "loopyard-baselines-"));
function specFile(name: string, spec: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, JSON.stringify(spec));
  return path;
}

const EXAMPLE = join(CORE_DIR, "examples", "baselines-ember-800.json");

interface Line {
  rule: string;
  variant: string;
  applies: boolean;
  model?: { kind: string; k?: number; tau?: number; theta?: number; ku?: number };
  controller?: { kp: number; ki: number; kd: number; tf: number };
  ideal?: { K: number; Ti: number | string; Td: number };
  status?: string;
  criteria?: Record<string, number | string | null> | null;
  reason?: string;
}

describe("loopyard baselines", () => {
  it("loopyard baselines on the Ember 800 example prints nine rules, each stable and scored, with the half-rule fit", async () => {
    const run = await loopyard(["baselines", EXAMPLE]);
    expect(run.code).toBe(0);
    const { baselines } = JSON.parse(run.stdout) as { baselines: Line[] };
    expect(baselines).toHaveLength(9);
    for (const b of baselines) {
      expect(b.applies).toBe(true);
      expect(b.status).toBe("stable");
      expect(Object.keys(b.criteria ?? {})).toEqual(["iae", "ise", "effort", "overshoot", "settlingTime"]);
    }
    // 1.5e^(−s)/((20s+1)(4s+1)): half rule τ = 20 + 2 = 22, θ = 1 + 2 = 3 (Skogestad 2003);
    // SIMC PI (τc = θ): K = 22/(1.5·(3 + 3)) = 2.444…, Ti = min(22, 24) = 22.
    const simc = baselines.find((b) => b.rule === "simc" && b.variant === "pi")!;
    expect(simc.model).toMatchObject({ kind: "fopdt", k: expect.closeTo(1.5, 9), tau: expect.closeTo(22, 9), theta: expect.closeTo(3, 9) });
    expectClose(simc.ideal!.K, 22 / 9, 1e-9);
    expectClose(simc.controller!.ki, 22 / 9 / 22, 1e-9);
    // The P variant has no integral action: Ti printed as "inf".
    expect(baselines.find((b) => b.rule === "ziegler-nichols" && b.variant === "p")!.ideal!.Ti).toBe("inf");
  });

  it("loopyard baselines - reads standard input and lists rules that do not apply with their reason", async () => {
    // 1/((8s+1)(2s+1)): the phase of two lags never reaches −180° (closed form), so Ziegler–Nichols does not apply.
    const spec = { plant: { kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 0 }, scenario: { kind: "setpoint-step", horizon: 60, dt: 0.01 }, criteria: ["iae"] };
    const run = await loopyard(["baselines", "-"], JSON.stringify(spec));
    expect(run.code).toBe(0);
    const { baselines } = JSON.parse(run.stdout) as { baselines: Line[] };
    const zn = baselines.filter((b) => b.rule === "ziegler-nichols");
    expect(zn).toHaveLength(3);
    for (const b of zn) {
      expect(b.applies).toBe(false);
      expect(b.reason).toMatch(/−180°/);
    }
    expect(baselines.filter((b) => b.applies)).toHaveLength(6);
  });

  it("loopyard baselines applies the options (λ for lambda PI)", async () => {
    // Lambda PI on the Ember 800 fit with λ = 11: K = 22/(1.5·(11 + 3)) = 1.0476… (Dahlin 1968 form).
    const spec = { ...JSON.parse(readFileSync(EXAMPLE, "utf8")), options: { lambda: 11 } };
    const run = await loopyard(["baselines", specFile("lambda.json", spec)]);
    expect(run.code).toBe(0);
    const lambda = (JSON.parse(run.stdout) as { baselines: Line[] }).baselines.find((b) => b.rule === "lambda")!;
    expectClose(lambda.ideal!.K, 22 / 21, 1e-9);
  });

  it("loopyard baselines exits 2 with one sentence naming the field of a bad spec", async () => {
    const base = JSON.parse(readFileSync(EXAMPLE, "utf8")) as Record<string, unknown>;
    const cases: [string, unknown, string][] = [
      ["den.json", { ...base, plant: { kind: "transfer-function", num: [1], den: [0, 1], delay: 0 } }, "plant.den"],
      ["controller.json", { ...base, controller: { kind: "p", kp: 1 } }, "controller"],
      ["criteria.json", { ...base, criteria: ["iae", "nope"] }, "criteria[1]"],
      ["lambda.json", { ...base, options: { lambda: -1 } }, "options.lambda"],
    ];
    for (const [name, spec, field] of cases) {
      const run = await loopyard(["baselines", specFile(name, spec)]);
      expect(run.code, name).toBe(2);
      expectOneSentence(run.stderr, field);
    }
    const { scenario: _omitted, ...noScenario } = base;
    const missing = await loopyard(["baselines", specFile("no-scenario.json", noScenario)]);
    expect(missing.code).toBe(2);
    expectOneSentence(missing.stderr, "scenario");
  });
});
