import { describe, expect, it, vi } from "vitest";

// Count the builds of a loop transfer function: controllerTransferFunction is called only when one is
// built (through its module, so the mock sees every call). Realisations are checked by identity.
const counts = vi.hoisted(() => ({ transferFunction: 0 }));
vi.mock("../../src/controllers/controller-transfer-function.js", async (importOriginal) => {
  const original = await importOriginal<typeof import("../../src/controllers/controller-transfer-function.js")>();
  return {
    ...original,
    controllerTransferFunction: (...args: Parameters<typeof original.controllerTransferFunction>) => {
      counts.transferFunction++;
      return original.controllerTransferFunction(...args);
    },
  };
});

const { controllerRealization } = await import("../../src/controllers/controller-realization.js");
const { evaluateCandidate } = await import("../../src/evaluation/evaluate-candidate.js");
const { loopTransferFunction } = await import("../../src/simulation/loop-transfer-function.js");

describe("per-candidate work is done once", () => {
  const family = [
    { kind: "transfer-function" as const, num: [1], den: [1, 3, 3, 1], delay: 0 },
    { kind: "transfer-function" as const, num: [1.2], den: [1, 2.5, 2, 0.5], delay: 0 },
    { kind: "transfer-function" as const, num: [1], den: [2, 1], delay: 0.5 },
  ];
  const criteria = ["iae", "ise", "overshoot", "ms", "mt", "gainMargin", "phaseMargin"] as const;
  const scenario = { kind: "setpoint-step" as const, horizon: 30, dt: 0.01 };

  it("one loop transfer function per variant, one realisation per candidate, whatever asks for them", () => {
    // Reference: the structure itself (common practice: build once, share) — poles, verdict and four
    // frequency criteria all read L(s); verdict, simulation and exact costs all read the realisation.
    const controller = { kind: "pid" as const, kp: 1, ki: 0.4, kd: 0.3, tf: 0.05 };
    counts.transferFunction = 0;
    const results = family.map((plant) => evaluateCandidate(plant, controller, scenario, [...criteria], { criterion: { horizon: "infinite" } }));
    expect(results.every((r) => r.status === "stable")).toBe(true);
    expect(counts.transferFunction).toBe(family.length);
    const first = controllerRealization(controller, 3);
    expect(controllerRealization(controller, 1)).toBe(first);
    family.forEach((plant) => expect(loopTransferFunction(plant, controller)).toBe(loopTransferFunction(plant, controller)));
    expect(counts.transferFunction).toBe(family.length);
  });

  it("the shared objects change no figure: a fresh copy of the controller scores the same bytes", () => {
    const controller = { kind: "pid" as const, kp: 1.3, ki: 0.5, kd: 0.2, tf: 0.04 };
    for (const plant of family) {
      const once = evaluateCandidate(plant, controller, scenario, [...criteria]);
      const again = evaluateCandidate(plant, controller, scenario, [...criteria]);
      const fresh = evaluateCandidate(plant, { ...controller }, scenario, [...criteria]);
      expect(again).toEqual(once);
      expect(fresh).toEqual(once);
    }
  });
});
