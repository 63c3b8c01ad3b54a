import type { ControllerKind } from "./controller.js";

/**
 * Which values a parameter may take: "any" finite number, "non-negative" (≥ 0) or "positive" (> 0).
 */
export type ParameterSign = "any" | "non-negative" | "positive";

/** One named parameter of a controller kind. */
export interface ControllerParameter {
  /** Field name on the controller and in a sweep's ranges/fixed, e.g. "ki". */
  name: string;
  /** What it is, in words, e.g. "integral gain". */
  description: string;
  /** Unit in SI brackets notation without the brackets, e.g. "1/s"; "" for a dimensionless gain. */
  unit: string;
  /** The controller's own check (assertValidController, controllerSchema). */
  sign: ParameterSign;
  /** What a sweep may range over (parameterSign); defaults to `sign`. Sweeps keep gains ≥ 0. */
  sweepSign?: ParameterSign;
}

/** Kinds whose parameters are a fixed list (state feedback has one gain per plant state). */
export type FixedParameterKind = Exclude<ControllerKind, "state-feedback">;

const kp: ControllerParameter = { name: "kp", description: "proportional gain", unit: "", sign: "any", sweepSign: "non-negative" };
const ki: ControllerParameter = { name: "ki", description: "integral gain", unit: "1/s", sign: "any", sweepSign: "non-negative" };
const kd: ControllerParameter = { name: "kd", description: "derivative gain", unit: "s", sign: "any", sweepSign: "non-negative" };
const tf: ControllerParameter = { name: "tf", description: "derivative filter time", unit: "s", sign: "non-negative" };

/**
 * The parameter table of every controller kind with a fixed list, in the kind's order: the
 * controller's TypeScript fields, the checks of assertValidController and controllerSchema, the
 * batch structure's names (STRUCTURE_PARAMETERS), the sweep's sign rules (parameterSign) and the
 * web form's rows all read it.
 */
export const CONTROLLER_PARAMETERS: Readonly<Record<FixedParameterKind, readonly ControllerParameter[]>> = {
  p: [kp],
  pi: [kp, ki],
  pid: [kp, ki, kd, tf],
  pid2dof: [
    kp,
    ki,
    kd,
    tf,
    { name: "b", description: "setpoint weight on P", unit: "", sign: "any", sweepSign: "non-negative" },
    { name: "c", description: "setpoint weight on D", unit: "", sign: "any", sweepSign: "non-negative" },
  ],
  "lead-lag": [
    { name: "k", description: "gain", unit: "", sign: "any", sweepSign: "non-negative" },
    { name: "tLead", description: "lead time", unit: "s", sign: "non-negative", sweepSign: "positive" },
    { name: "tLag", description: "lag time", unit: "s", sign: "non-negative", sweepSign: "positive" },
  ],
};

/** The state-feedback gain k[i] (i from 0) on the plant's state i. */
export const STATE_GAIN_PARAMETER: ControllerParameter = { name: "k[i]", description: "gain on state i", unit: "", sign: "any" };
/** The state-feedback reference gain n (u = −K·x + n·r). */
export const REFERENCE_GAIN_PARAMETER: ControllerParameter = { name: "n", description: "reference gain", unit: "", sign: "any" };
/** The sample time every kind may take (a sampled controller with zero-order hold). */
export const SAMPLE_TIME_PARAMETER: ControllerParameter = { name: "sampleTime", description: "sample time", unit: "s", sign: "positive" };

/**
 * The table entry of a parameter name of a kind (k[i] of state feedback included), or undefined
 * for a name the kind does not have.
 */
export function controllerParameter(kind: ControllerKind, name: string): ControllerParameter | undefined {
  if (name === "sampleTime") return SAMPLE_TIME_PARAMETER;
  if (kind === "state-feedback") {
    if (name === "n") return REFERENCE_GAIN_PARAMETER;
    return /^k\[\d+\]$/.test(name) ? STATE_GAIN_PARAMETER : undefined;
  }
  return CONTROLLER_PARAMETERS[kind]?.find((p) => p.name === name);
}

/** True when `value` obeys `sign`. */
export function satisfiesSign(value: number, sign: ParameterSign): boolean {
  if (sign === "positive") return value > 0;
  if (sign === "non-negative") return value >= 0;
  return true;
}
