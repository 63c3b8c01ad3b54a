import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import { CLI_MAIN, CORE_DIR, ensureDist } from "../support/ensure-dist.js";
import { expectClose } from "../support/expect-close.js";

// Spawns the built CLI (node packages/core/dist/cli/main.js), building dist first when stale.
beforeAll(() => ensureDist(), 200_000);

function evaluate(spec: unknown): { code: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [CLI_MAIN, "evaluate", "-"], { cwd: CORE_DIR, input: JSON.stringify(spec), encoding: "utf8" });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}

const base = {
  plant: { kind: "transfer-function", num: [1], den: [1, 1, 0], delay: 0 },
  controller: { kind: "p", kp: 1 },
  scenario: { kind: "setpoint-step", horizon: 20, dt: 0.01 },
};

describe("loopyard evaluate with frequency criteria", () => {
  it("prints ms and gainMargin, Infinity as \"inf\"", () => {
    // L = 1/(s(s + 1)): no phase crossover (phase > −180°) ⇒ GM = ∞ (Åström & Hägglund 2006, §4.2);
    // PM = 90° − atan ωc, ωc² = (√5 − 1)/2 (closed form).
    const run = evaluate({ ...base, criteria: ["ms", "gainMargin", "phaseMargin"] });
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout);
    expect(out.status).toBe("stable");
    expect(out.criteria.gainMargin).toBe("inf");
    expect(out.criteria.ms).toBeGreaterThan(1);
    expectClose(out.criteria.phaseMargin, 90 - (Math.atan(Math.sqrt((Math.sqrt(5) - 1) / 2)) * 180) / Math.PI, 1e-9);
  });

  it("takes the weight of wsNorm as { num, den } or the performance preset", () => {
    // L = k/s, W = (s/M + ωB)/s (A = 0) ⇒ ‖W·S‖∞ = max(ωB/k, 1/M) (closed form, see weighted-sensitivity.test.ts).
    const loop = { ...base, plant: { kind: "transfer-function", num: [1], den: [1, 0], delay: 0 }, controller: { kind: "p", kp: 4 } };
    const preset = evaluate({ ...loop, criteria: ["wsNorm"], weight: { preset: "performance", M: 1.5, omegaB: 1, A: 0 } });
    expect(preset.code).toBe(0);
    expectClose(JSON.parse(preset.stdout).criteria.wsNorm, 1 / 1.5, 0, 1e-6);
    const rational = evaluate({ ...loop, criteria: ["wsNorm"], weight: { num: [1 / 1.5, 1], den: [1, 0] } });
    expectClose(JSON.parse(rational.stdout).criteria.wsNorm, 1 / 1.5, 0, 1e-6);
  });

  it("exits 2 with one sentence naming the weight when it is missing or bad", () => {
    const missing = evaluate({ ...base, criteria: ["wsNorm"] });
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/^loopyard: weight: wsNorm needs a sensitivity weight/);
    const improper = evaluate({ ...base, criteria: ["wsNorm"], weight: { num: [1, 0, 0], den: [1] } });
    expect(improper.code).toBe(2);
    expect(improper.stderr).toMatch(/^loopyard: weight\.num: the weight must be proper/);
    const badPreset = evaluate({ ...base, criteria: ["wsNorm"], weight: { preset: "performance", M: -2, omegaB: 1, A: 0 } });
    expect(badPreset.code).toBe(2);
    expect(badPreset.stderr).toMatch(/^loopyard: weight\.M: M must be > 0/);
  });
});
