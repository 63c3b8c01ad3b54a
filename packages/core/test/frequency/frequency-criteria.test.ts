import { describe, expect, it } from "vitest";
import { evaluateBatch } from "../../src/batch/evaluate-batch.js";
import { STATUS_STABLE } from "../../src/batch/batch-status.js";
import { CRITERIA } from "../../src/criteria/registry.js";
import { gainMargin } from "../../src/criteria/gain-margin.js";
import { ms } from "../../src/criteria/ms.js";
import { performanceWeight } from "../../src/frequency/performance-weight.js";
import type { Plant } from "../../src/plants/plant.js";
import { evaluateCandidate } from "../../src/evaluation/evaluate-candidate.js";
import { loopTransferFunction } from "../../src/simulation/loop-transfer-function.js";
import { expectClose } from "../support/expect-close.js";

const scenario = { kind: "setpoint-step" as const, horizon: 60, dt: 0.01 };
const ember800: Plant = { kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 };

describe("frequency criteria through evaluateCandidate and evaluateBatch", () => {
  it("scores ms, mt, the margins, crossover, bandwidth and wsNorm from loopTransferFunction(plant, controller)", () => {
    // Same numbers as the criteria on the loop itself (definition: evaluateCandidate, step 3).
    const controller = { kind: "pid" as const, kp: 2, ki: 0.15, kd: 4, tf: 0.4 };
    const weight = performanceWeight({ M: 2, omegaB: 0.05, A: 1e-3 });
    const ids = ["iae", "ms", "mt", "gainMargin", "phaseMargin", "crossoverFrequency", "bandwidth", "wsNorm"] as const;
    const result = evaluateCandidate(ember800, controller, scenario, ids, { criterion: { weight } });
    expect(result.status).toBe("stable");
    const loop = loopTransferFunction(ember800, controller);
    for (const id of ids.slice(1)) expect(result.scores![id], id).toBe(CRITERIA[id].computeLoop!(loop, { weight }));
    expect(result.scores!.iae).toBeGreaterThan(0);
    // Åström & Hägglund 2006, §4.2: GM ≥ Ms/(Ms − 1), PM ≥ 2·arcsin(1/(2Ms)) (sanity on a real design).
    const s = result.scores!;
    expect(s.gainMargin).toBeGreaterThanOrEqual(s.ms / (s.ms - 1));
    expect(s.phaseMargin).toBeGreaterThanOrEqual((2 * Math.asin(1 / (2 * s.ms)) * 180) / Math.PI);
    // Skogestad & Postlethwaite 2005, §2.4.5: for a typical loop ωB < ωc.
    expect(s.bandwidth).toBeLessThan(s.crossoverFrequency);
  });

  it("gives the same Ms for a plant as transfer function and as state space, also on the fast delay-free path", () => {
    // Realisation invariance: G = 1/((s + 1)(2s + 1)) in both forms has the same L(jω) (closed form identity).
    const tf: Plant = { kind: "transfer-function", num: [0.5], den: [1, 1.5, 0.5], delay: 0 };
    const ss: Plant = { kind: "state-space", A: [[0, 1], [-0.5, -1.5]], B: [[0], [1]], C: [[0.5, 0]], D: [[0]] };
    const controller = { kind: "pi" as const, kp: 1.2, ki: 0.6 };
    const a = evaluateCandidate(tf, controller, scenario, ["iae", "ms"]);
    const b = evaluateCandidate(ss, controller, scenario, ["iae", "ms"]);
    expectClose(a.scores!.ms, b.scores!.ms, 0, 1e-10);
    expectClose(a.scores!.ms, ms(loopTransferFunction(tf, controller)), 0, 1e-15);
    expectClose(a.scores!.iae, b.scores!.iae, 0, 1e-8);
  });

  it("says NaN (does not apply) for a nonlinear plant and null scores for an unstable loop", () => {
    const tank: Plant = {
      kind: "nonlinear",
      states: ["h"],
      parameters: { a: 1 },
      derivatives: ["u - a*sqrt(h)"],
      output: "h",
      initial: [1],
      operatingInput: 1,
    };
    const stable = evaluateCandidate(tank, { kind: "pi", kp: 1, ki: 0.5 }, { ...scenario, horizon: 20 }, ["iae", "ms", "gainMargin"]);
    expect(stable.status).toBe("stable");
    expect(stable.scores!.ms).toBeNaN();
    expect(stable.scores!.gainMargin).toBeNaN();
    // K/(s + 1)³ with K = 10 > 8 is unstable (Routh): never scored.
    const cubic: Plant = { kind: "transfer-function", num: [10], den: [1, 3, 3, 1], delay: 0 };
    expect(evaluateCandidate(cubic, { kind: "p", kp: 1 }, scenario, ["ms"]).scores).toBeNull();
    // wsNorm without a weight is a bad argument, named.
    expect(() => evaluateCandidate(ember800, { kind: "pi", kp: 1, ki: 0.1 }, scenario, ["wsNorm"])).toThrow(/^weight/);
  });

  it("evaluateBatch passes the weight through and matches evaluateCandidate", () => {
    const weight = performanceWeight({ M: 1.8, omegaB: 0.04, A: 1e-3 });
    const structure = { kind: "pi" as const, tunable: ["kp", "ki"], fixed: {} };
    const candidates = Float64Array.from([0.8, 0.05, 1.5, 0.1, 2.5, 0.2]);
    const ids = ["ise", "ms", "gainMargin", "wsNorm"] as const;
    const batch = evaluateBatch([ember800], structure, candidates, scenario, ids, { evaluation: { criterion: { weight } } });
    for (let i = 0; i < 3; i++) {
      const single = evaluateCandidate(ember800, { kind: "pi", kp: candidates[2 * i], ki: candidates[2 * i + 1] }, scenario, ids, { poles: false, criterion: { weight } });
      expect(batch.status[i]).toBe(STATUS_STABLE);
      ids.forEach((id, c) => expect(batch.scores[i * ids.length + c], id).toBe(single.scores![id]));
    }
    expect(gainMargin(loopTransferFunction(ember800, { kind: "pi", kp: 0.8, ki: 0.05 }))).toBe(batch.scores[2]);
  });
});
