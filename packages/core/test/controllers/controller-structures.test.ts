import { describe, expect, it } from "vitest";
import { controllerSchema } from "../../src/controllers/controller.js";
import { antiWindupTrackingTime, controllerRealization } from "../../src/controllers/controller-realization.js";
import { controllerTransferFunction } from "../../src/controllers/controller-transfer-function.js";
import type { TransferFunctionPlant } from "../../src/plants/transfer-function.js";
import { simulateLoop } from "../../src/simulation/simulate-loop.js";
import { expectClose } from "../support/expect-close.js";

const cubic: TransferFunctionPlant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
const scenario = { kind: "setpoint-step" as const, horizon: 15, dt: 0.01 };

describe("controller structures", () => {
  it("pid2dof with b = c = 1 is the PID; with b = c = 0 it has no setpoint kick (u(0⁺) = 0)", () => {
    // Åström & Hägglund 2006, §3.4: setpoint weights only change the response to r.
    const gains = { kp: 1.2, ki: 0.5, kd: 0.8, tf: 0.08 };
    const pid = simulateLoop(cubic, { kind: "pid", ...gains }, scenario);
    const same = simulateLoop(cubic, { kind: "pid2dof", ...gains, b: 1, c: 1 }, scenario);
    for (let k = 0; k < pid.y.length; k++) expectClose(same.u[k], pid.u[k], 1e-12, 1e-12);
    const smooth = simulateLoop(cubic, { kind: "pid2dof", ...gains, b: 0, c: 0 }, scenario);
    expect(smooth.u[0]).toBe(0);
    expectClose(pid.u[0], gains.kp + gains.kd / gains.tf, 1e-12);
    expect(controllerTransferFunction({ kind: "pid2dof", ...gains, b: 0, c: 0 })).toEqual(controllerTransferFunction({ kind: "pid", ...gains }));
  });

  it("lead-lag k(tLead·s + 1)/(tLag·s + 1): u(0⁺) = k·tLead/tLag (initial value theorem) and the realisation has that transfer function", () => {
    const c = { kind: "lead-lag" as const, k: 2, tLead: 1.5, tLag: 0.3 };
    const trace = simulateLoop(cubic, c, scenario);
    expectClose(trace.u[0], (2 * 1.5) / 0.3, 1e-12);
    // C(s) = D + C_c B/(s − A) with A = −1/tLag: evaluate at s = 1 against the formula.
    const r = controllerRealization(c);
    const s = 1;
    expectClose(-r.dy + (-r.c[0] * r.by[0]) / (s - r.a[0]), (2 * (1.5 * s + 1)) / (0.3 * s + 1), 1e-12);
    expect(controllerTransferFunction(c)).toEqual({ num: [3, 2], den: [0.3, 1] });
  });

  it("antiWindupTrackingTime is √(Ti·Td), or Ti without derivative action (Åström & Hägglund 2006, §3.5)", () => {
    expectClose(antiWindupTrackingTime(2, 0.5, 1), Math.sqrt(4 * 0.5), 1e-15);
    expectClose(antiWindupTrackingTime(2, 0.5, 0), 4, 1e-15);
    expect(Number.isNaN(antiWindupTrackingTime(2, 0, 1))).toBe(true);
  });

  it("controllerSchema names the missing filter and a bad sample time", () => {
    const noFilter = controllerSchema.safeParse({ kind: "pid", kp: 1, ki: 1, kd: 1, tf: 0 });
    expect(noFilter.error?.issues[0].path).toEqual(["tf"]);
    const badTs = controllerSchema.safeParse({ kind: "pi", kp: 1, ki: 1, sampleTime: -1 });
    expect(badTs.error?.issues[0].path).toEqual(["sampleTime"]);
    expect(controllerSchema.safeParse({ kind: "state-feedback", k: [1, 2], n: 1, antiWindup: { kind: "conditional" } }).success).toBe(true);
  });

  it("controllerTransferFunction refuses state feedback, naming controller.kind", () => {
    expect(() => controllerTransferFunction({ kind: "state-feedback", k: [1], n: 1 })).toThrow(/controller\.kind/);
  });
});
