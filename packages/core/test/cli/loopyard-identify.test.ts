import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { stepCsv } from "../identification/step-data.js";
import { ensureDist } from "../support/ensure-dist.js";
import { expectClose } from "../support/expect-close.js";
import { expectOneSentence, runLoopyard as loopyard } from "../support/run-loopyard.js";

// These tests spawn the built CLI (building dist first when it is stale).
beforeAll(() => ensureDist(), 200_000);

const dir = mkdtempSync(join(tmpdir(), "loopyard-identify-"));
// FOPDT k = 2, τ = 5 s, θ = 1.5 s, input step 4 at t = 3 s: Δy = kΔu(1 − e^(−(s−θ)/τ)) (closed form, Seborg et al. 2016, §5.2).
const response = (s: number) => (s > 1.5 ? 8 * (1 - Math.exp(-(s - 1.5) / 5)) : 0);
const file = join(dir, "ember-step.csv");
writeFileSync(file, stepCsv({ h: 0.25, horizon: 60, stepTime: 3, u0: 10, du: 4, y0: 21, response }));

describe("loopyard identify", () => {
  it("loopyard identify FILE --model fopdt prints the model, parameters, intervals and R² of the noise-free test", async () => {
    const run = await loopyard(["identify", file, "--model", "fopdt", "--time", "time", "--input", "power", "--output", "3"]);
    expect(run.stderr).toBe("");
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout) as {
      model: { kind: string; num: number[]; den: number[]; delay: number };
      parameters: Record<string, number>;
      intervals: Record<string, [number, number]>;
      r2: number;
    };
    expect(Object.keys(out)).toEqual(["model", "parameters", "intervals", "r2"]);
    expect(out.model.kind).toBe("transfer-function");
    expectClose(out.parameters.k, 2, 0, 1e-4);
    expectClose(out.parameters.tau, 5, 0, 1e-4);
    expectClose(out.parameters.theta, 1.5, 0, 1e-4);
    // G(s) = k·e^(−θs)/(τs + 1).
    expectClose(out.model.num[0], 2, 0, 1e-4);
    expectClose(out.model.den[0], 5, 0, 1e-4);
    expect(out.model.den[1]).toBe(1);
    expectClose(out.model.delay, 1.5, 0, 1e-4);
    expect(out.intervals.tau[0]).toBeLessThan(5 + 1e-9);
    expect(out.intervals.tau[1]).toBeGreaterThan(5 - 1e-9);
    expectClose(out.r2, 1, 1e-10);
  });

  it("loopyard identify reads standard input and answers a bad cell with exit 2 and one sentence naming row and column", async () => {
    const text = stepCsv({ h: 0.5, horizon: 20, stepTime: 3, u0: 10, du: 4, y0: 21, response }).replace(/\n2,10,[^\n]*\n/, "\n2,10,warm\n");
    const run = await loopyard(["identify", "-", "--model", "ipdt"], text);
    expect(run.code).toBe(2);
    expectOneSentence(run.stderr, "row 6, column 3");
  });

  it("loopyard identify answers a missing --model and an unknown model with exit 2 and one sentence naming --model", async () => {
    const noModel = await loopyard(["identify", file]);
    expect(noModel.code).toBe(2);
    expectOneSentence(noModel.stderr, "--model");
    const badModel = await loopyard(["identify", file, "--model", "arx"]);
    expect(badModel.code).toBe(2);
    expectOneSentence(badModel.stderr, "--model");
  });

  it("loopyard identify answers a missing file and an unknown column with exit 2 and one sentence", async () => {
    const missing = await loopyard(["identify", join(dir, "absent.csv"), "--model", "fopdt"]);
    expect(missing.code).toBe(2);
    expectOneSentence(missing.stderr, "no such file");
    const badColumn = await loopyard(["identify", file, "--model", "fopdt", "--output", "flow"]);
    expect(badColumn.code).toBe(2);
    expectOneSentence(badColumn.stderr, '"flow"');
  });
});
