import { beforeAll, describe, expect, it } from "vitest";
import { ensureDist, CORE_DIR } from "../support/ensure-dist.js";
import type { BatchResult, Plant, Scenario, Structure, CriterionId } from "../../src/index.js";

// The pool runs the built worker file (dist/pool/evaluate-chunk-worker.js), so this test imports
// the built entries, building dist first when it is missing or stale.
type PoolModule = typeof import("../../src/pool/index.js");
type CoreModule = typeof import("../../src/index.js");
let pool: PoolModule;
let core: CoreModule;

beforeAll(async () => {
  ensureDist();
  pool = (await import(`${CORE_DIR}/dist/pool/index.js`)) as PoolModule;
  core = (await import(`${CORE_DIR}/dist/index.js`)) as CoreModule;
}, 200_000);

const FAMILY: Plant[] = [
  { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 },
  { kind: "transfer-function", num: [1.2], den: [18, 13.5, 1], delay: 0.5 },
];
const STRUCTURE: Structure = { kind: "pid", tunable: ["kp", "ki", "kd"], fixed: {}, filter: { mode: "ratio", n: 10 } };
const SCENARIO: Scenario = { kind: "setpoint-step", horizon: 15, dt: 0.02 };
const CRITERIA: CriterionId[] = ["iae", "ise", "itae", "effort", "overshoot"];

function bytes(result: BatchResult): Buffer {
  return Buffer.concat([Buffer.from(result.status.buffer, result.status.byteOffset, result.status.byteLength), Buffer.from(result.scores.buffer, result.scores.byteOffset, result.scores.byteLength)]);
}

describe("createEvaluationPool", () => {
  it("pool.evaluate gives the same bytes on 1, 2 and 3 workers as evaluateBatch in process", async () => {
    // Reference: evaluateBatch in this thread; the invariant is bit-for-bit equality of the
    // Float64Array and Uint8Array bytes, NaN payloads included (chunks are slices fixed by n alone).
    const candidates = core.latinHypercube(
      [
        { name: "kp", min: 0.1, max: 10, scale: "log" },
        { name: "ki", min: 0, max: 2 },
        { name: "kd", min: 0, max: 4 },
      ],
      403,
      2026,
    );
    const reference = core.evaluateBatch(FAMILY, STRUCTURE, candidates, SCENARIO, CRITERIA);
    expect(reference.status.includes(core.STATUS_UNSTABLE)).toBe(true);
    for (const workers of [1, 2, 3]) {
      const p = pool.createEvaluationPool({ workers });
      try {
        const progress: number[] = [];
        const result = await p.evaluate(
          { family: FAMILY, structure: STRUCTURE, candidates, scenario: SCENARIO, criteria: CRITERIA },
          { onProgress: (done) => progress.push(done) },
        );
        expect(bytes(result).equals(bytes(reference))).toBe(true);
        expect(progress.at(-1)).toBe(403);
        // An odd chunk size cuts differently and still gives the same bytes.
        const odd = await p.evaluate({ family: FAMILY, structure: STRUCTURE, candidates, scenario: SCENARIO, criteria: CRITERIA }, { chunkSize: 37 });
        expect(bytes(odd).equals(bytes(reference))).toBe(true);
      } finally {
        await p.close();
      }
    }
    // The caller's candidates are copied into chunks, never detached by the transfer.
    expect(candidates.length).toBe(403 * 3);
  }, 120_000);

  it("pool.evaluate at niceness 10 gives the same bytes as at 0; a niceness outside 0…19 is refused naming it", async () => {
    // Niceness changes only the threads' scheduling (setpriority(2), per thread on Linux), never a result.
    const candidates = core.latinHypercube([{ name: "kp", min: 0.1, max: 10 }, { name: "ki", min: 0, max: 2 }, { name: "kd", min: 0, max: 4 }], 60, 11);
    const reference = core.evaluateBatch(FAMILY, STRUCTURE, candidates, SCENARIO, CRITERIA);
    const p = pool.createEvaluationPool({ workers: 1, niceness: 10 });
    try {
      const result = await p.evaluate({ family: FAMILY, structure: STRUCTURE, candidates, scenario: SCENARIO, criteria: CRITERIA });
      expect(bytes(result).equals(bytes(reference))).toBe(true);
    } finally {
      await p.close();
    }
    expect(() => pool.createEvaluationPool({ workers: 1, niceness: 20 })).toThrow(/niceness/);
    expect(() => pool.createEvaluationPool({ workers: 1, niceness: -1 })).toThrow(/niceness/);
  }, 120_000);

  it("createEvaluationPool rejects a bad worker count naming it", () => {
    expect(() => pool.createEvaluationPool({ workers: 0 })).toThrow(/workers/);
    expect(() => pool.createEvaluationPool({ workers: 1.5 })).toThrow(/workers/);
  });
});
