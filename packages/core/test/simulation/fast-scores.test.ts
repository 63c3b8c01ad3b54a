import { describe, expect, it } from "vitest";
import { CRITERIA } from "../../src/criteria/registry.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";
import { seededRandom } from "../support/seeded-random.js";

describe("scores-only fast path", () => {
  it("evaluateCandidate's in-recurrence IAE, ISE, ITAE and effort equal the trace criteria to rounding", () => {
    // Reference: the registry criteria on the trace of simulateLoop (the same recurrence, stored).
    const plant: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
    const scenario = { kind: "setpoint-step" as const, horizon: 30, dt: 0.01 };
    const random = seededRandom(11);
    let checked = 0;
    for (let i = 0; i < 20; i++) {
      const kp = 0.2 + 2 * random();
      const kd = random();
      const pid = { kind: "pid" as const, kp, ki: 0.1 + random(), kd, tf: kd / (10 * kp) };
      const fast = evaluateCandidate(plant, pid, scenario, ["iae", "ise", "itae", "effort"], { poles: false });
      if (fast.status !== "stable") continue;
      const trace = simulateLoop(plant, pid, scenario);
      for (const id of ["iae", "ise", "itae", "effort"] as const) expectClose(fast.scores![id], CRITERIA[id].compute(trace), 1e-12, 1e-10);
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });
});
