import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { CORE_DIR, ensureDist } from "../support/ensure-dist.js";
import { expectClose } from "../support/expect-close.js";
import { runLoopyard as loopyard } from "../support/run-loopyard.js";

// These tests spawn the built CLI (building dist first when it is stale).
beforeAll(() => ensureDist(), 200_000);

describe("loopyard bound", () => {
  it("loopyard bound on the double-integrator example prints K = [1, √3], P = [[√3, 1], [1, √3]] and cost √3", async () => {
    // Closed form (Anderson & Moore 1990; common practice): see test/optimal/solve-care.test.ts; x0 = [1, 0] ⇒ cost = P₁₁.
    const run = await loopyard(["bound", join(CORE_DIR, "examples", "bound-double-integrator.json")]);
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout) as { K: number[][]; P: number[][]; poles: { re: number; im: number }[]; cost: number };
    expectClose(out.K[0][1], Math.sqrt(3), 1e-12);
    expectClose(out.P[0][0], Math.sqrt(3), 1e-12);
    expectClose(out.cost, Math.sqrt(3), 1e-12);
    expect(out.poles).toHaveLength(2);
  });

  it("loopyard bound reads standard input and answers a bad R with exit 2 and one sentence naming R", async () => {
    const run = await loopyard(["bound", "-"], JSON.stringify({ A: [[0, 1], [0, 0]], B: [[0], [1]], Q: [[1, 0], [0, 1]], R: [[1, 2]], x0: [1, 0] }));
    expect(run.code).toBe(2);
    expect(run.stderr.trimEnd().split("\n")).toHaveLength(1);
    expect(run.stderr).toMatch(/^loopyard: R: .*\.\n$/);
  });

  it("loopyard bound answers an unstabilisable problem with exit 2 and the reason", async () => {
    const run = await loopyard(["bound", "-"], JSON.stringify({ A: [[1, 0], [0, 2]], B: [[1], [0]], Q: [[1, 0], [0, 1]], R: [[1]], x0: [1, 1] }));
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/not stabilisable/);
  });

  it("loopyard bound names a missing x0", async () => {
    const run = await loopyard(["bound", "-"], JSON.stringify({ A: [[0]], B: [[1]], Q: [[1]], R: [[1]] }));
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^loopyard: x0: /);
  });
});
