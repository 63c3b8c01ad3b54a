import type { Controller, Pid2dofController } from "../controllers/controller.js";
import { assertValidPid } from "../controllers/assert-valid-pid.js";

/**
 * A PID ready for deployment, in parallel form with set-point weights:
 *
 *   u = kp·(b·r − y) + ki·∫(r − y)dt + kd·s/(tf·s + 1)·(c·r − y)
 *
 * kp [u/y], ki [u/(y·s)], kd [u·s/y], tf [s] (> 0 when kd ≠ 0), b and c dimensionless
 * (b = c = 1: the one-degree-of-freedom PID on e = r − y).
 */
export interface DeployablePid {
  kp: number;
  ki: number;
  kd: number;
  tf: number;
  b: number;
  c: number;
}

/**
 * The PID a controller of kind p, pi, pid or pid2dof stands for (missing terms zero, weights 1
 * for one degree of freedom). Throws a RangeError naming the field for another kind or a bad gain.
 */
export function deployablePid(controller: Controller): DeployablePid {
  let pid: DeployablePid;
  switch (controller.kind) {
    case "p":
      pid = { kp: controller.kp, ki: 0, kd: 0, tf: 0, b: 1, c: 1 };
      break;
    case "pi":
      pid = { kp: controller.kp, ki: controller.ki, kd: 0, tf: 0, b: 1, c: 1 };
      break;
    case "pid":
      pid = { kp: controller.kp, ki: controller.ki, kd: controller.kd, tf: controller.tf, b: 1, c: 1 };
      break;
    case "pid2dof":
      pid = { kp: controller.kp, ki: controller.ki, kd: controller.kd, tf: controller.tf, b: controller.b, c: controller.c };
      break;
    default:
      throw new RangeError(`controller.kind must be p, pi, pid or pid2dof for a deployment sheet, got "${(controller as Controller).kind}"`);
  }
  assertValidPid({ kind: "pid", kp: pid.kp, ki: pid.ki, kd: pid.kd, tf: pid.tf });
  for (const name of ["b", "c"] as const) if (!Number.isFinite(pid[name])) throw new RangeError(`${name} must be a finite number, got ${pid[name]}`);
  return pid;
}

/** The continuous two-degree-of-freedom controller of a DeployablePid (for simulateLoop and evaluateCandidate). */
export function continuousController(pid: DeployablePid): Pid2dofController {
  return { kind: "pid2dof", kp: pid.kp, ki: pid.ki, kd: pid.kd, tf: pid.tf, b: pid.b, c: pid.c };
}
