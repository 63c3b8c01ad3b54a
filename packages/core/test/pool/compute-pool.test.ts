import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureDist, CORE_DIR } from "../support/ensure-dist.js";
import type { Plant } from "../../src/index.js";

// The pool runs the built worker file (dist/pool/compute-worker.js), so this test imports the built
// entry, building dist first when it is missing or stale.
type PoolModule = typeof import("../../src/pool/index.js");
let pool: ReturnType<PoolModule["createComputePool"]>;

beforeAll(async () => {
  ensureDist();
  const module = (await import(`${CORE_DIR}/dist/pool/index.js`)) as PoolModule;
  pool = module.createComputePool({ workers: 1 });
}, 200_000);

afterAll(async () => {
  await pool?.close();
});

const TWO_LAGS: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 };
/** dx/dt = z − x, dz/dt = 10⁷·(u − z): some 10⁸ evaluations for an explicit solver over the slow pole's horizon. */
const STIFF: Plant = { kind: "nonlinear", states: ["x", "z"], parameters: { g: 1e7 }, derivatives: ["z - x", "g*(u - z)"], output: "x", initial: [0, 0] };

describe("createComputePool", () => {
  it("when a task passes its time limit, then it answers kind time with a sentence and the pool keeps working", async () => {
    const stopped = await pool.run("plantPreview", { model: STIFF, samples: 600 }, { budget: { evaluations: 1e12 }, timeLimitMs: 300 });
    expect(stopped).toEqual({ ok: false, kind: "time", reason: "it takes longer than 0.3 s" });
    const next = await pool.run("plantPreview", { model: TWO_LAGS, samples: 600 }, { budget: { evaluations: 1 } });
    expect(next.ok).toBe(true);
    // Poles of 1/((s+1)(s+2)) are −1 and −2 (closed form).
    if (next.ok) expect(next.value.poles.map((p) => Math.round(p.re * 1e9) / 1e9).sort()).toEqual([-1, -2]);
  }, 30_000);

  it("when a task passes its work budget, then it answers kind budget across the thread with the sentence", async () => {
    const outcome = await pool.run("plantPreview", { model: STIFF, samples: 600 }, { budget: { evaluations: 20_000 }, timeLimitMs: 20_000 });
    expect(outcome).toEqual({ ok: false, kind: "budget", reason: "it needs more than 20,000 right-hand-side evaluations" });
  }, 30_000);
});
