import type { Controller } from "./controller.js";
import { assertValidController } from "./controller-realization.js";
import { pidTransferFunction } from "./pid-transfer-function.js";

/**
 * The feedback transfer function C(s) = num/den (from −y to u) of the rational controller kinds,
 * descending powers of s:
 * - p: kp;  pi, pid: see pidTransferFunction;  pid2dof: its feedback part C_y = kp + ki/s + kd·s/(tf·s + 1)
 *   (the setpoint weights b, c only shape the response to r);
 * - lead-lag: k(tLead·s + 1)/(tLag·s + 1).
 * A sampled controller is described by its continuous counterpart. State feedback has no such
 * function of y alone: throws a RangeError naming `controller.kind`.
 */
export function controllerTransferFunction(controller: Controller): { num: number[]; den: number[] } {
  assertValidController(controller);
  switch (controller.kind) {
    case "p":
      return { num: [controller.kp], den: [1] };
    case "pi":
      return pidTransferFunction({ kind: "pid", kp: controller.kp, ki: controller.ki, kd: 0, tf: 0 });
    case "pid":
    case "pid2dof":
      return pidTransferFunction({ kind: "pid", kp: controller.kp, ki: controller.ki, kd: controller.kd, tf: controller.tf });
    case "lead-lag": {
      const { k, tLead, tLag } = controller;
      if (!(tLag > 0)) return { num: [k], den: [1] };
      return { num: [k * tLead, k], den: [tLag, 1] };
    }
    case "state-feedback":
      throw new RangeError("controller.kind: state feedback has no transfer function from y to u; use the loop transfer function");
  }
}
