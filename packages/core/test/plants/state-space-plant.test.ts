import { describe, expect, it } from "vitest";
import { transferFunctionToStateSpace } from "../../src/plants/transfer-function-to-state-space.js";
import { stateSpaceToTransferFunction } from "../../src/plants/state-space-to-transfer-function.js";
import type { StateSpacePlant } from "../../src/plants/state-space.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { plantModelSchema } from "../../src/plants/plant.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

function toStateSpacePlant(tf: TransferFunctionPlant): StateSpacePlant {
  const ss = transferFunctionToStateSpace(tf);
  const n = ss.n;
  return {
    kind: "state-space",
    A: [...Array(n).keys()].map((i) => [...Array(n).keys()].map((j) => ss.a[i * n + j])),
    B: [...Array(n).keys()].map((i) => [ss.b[i]]),
    C: [Array.from(ss.c)],
    D: [[ss.d]],
  };
}

describe("state-space plants", () => {
  it("stateSpaceToTransferFunction inverts transferFunctionToStateSpace (TF → SS → TF round trip)", () => {
    // Closed form: the canonical realisation of (2s² + 3s + 1)/(s³ + 4s² + 5s + 2) has exactly that
    // transfer function (Franklin, Powell & Emami-Naeini 2002, §7.4); Faddeev–LeVerrier recovers it.
    const tf = stateSpaceToTransferFunction(transferFunctionToStateSpace({ num: [2, 3, 1], den: [1, 4, 5, 2] }));
    [1, 4, 5, 2].forEach((v, i) => expectClose(tf.den[i], v, 1e-12));
    [0, 2, 3, 1].forEach((v, i) => expectClose(tf.num[i], v, 1e-12));
  });

  it("simulateLoop on a state-space plant equals the same transfer function under PID in a combined setpoint and load scenario", () => {
    // Reference: the same system in two forms must give the same closed loop (exact discretisation of both).
    const tf: TransferFunctionPlant = { kind: "transfer-function", num: [0.5, 1], den: [1, 3, 3, 1], delay: 0 };
    const ss = toStateSpacePlant(tf);
    expect(plantModelSchema.safeParse(ss).success).toBe(true);
    const pid = { kind: "pid" as const, kp: 1.2, ki: 0.6, kd: 0.4, tf: 0.04 };
    const scenario = { kind: "combined" as const, horizon: 20, dt: 0.01, load: { size: 0.3, time: 7.005 } };
    const a = simulateLoop(tf, pid, scenario);
    const b = simulateLoop(ss, pid, scenario);
    for (let k = 0; k < a.y.length; k++) {
      expectClose(b.y[k], a.y[k], 1e-10);
      expectClose(b.u[k], a.u[k], 1e-9);
    }
    expectClose(b.uInfinity, a.uInfinity, 1e-12);
  });

  it("plantModelSchema names the matrix whose dimensions are wrong", () => {
    const bad = plantModelSchema.safeParse({ kind: "state-space", A: [[0, 1], [0, 0]], B: [[0]], C: [[1, 0]], D: [[0]] });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["B"]);
  });
});
