import { CONTROLLER_KINDS, CONTROLLER_PARAMETERS, MAX_STATE_FEEDBACK_GAINS, parameterSign, REFERENCE_GAIN_PARAMETER } from "@loopyard/core";
import type { ControllerKind, ControllerParameter, FixedParameterKind } from "@loopyard/core";

/** How each controller structure is named in the sweep form, with its law. */
export const STRUCTURES: Readonly<Record<ControllerKind, { label: string; law: string }>> = {
  p: { label: "P", law: "C(s) = kp" },
  pi: { label: "PI", law: "C(s) = kp + ki/s" },
  pid: { label: "PID with derivative filter", law: "C(s) = kp + ki/s + kd·s/(tf·s + 1)" },
  pid2dof: { label: "Two-degree-of-freedom PID", law: "u = kp(b·r − y) + ki∫(r − y)dt + kd·s/(tf·s + 1)·(c·r − y)" },
  "lead-lag": { label: "Lead–lag", law: "C(s) = k(tLead·s + 1)/(tLag·s + 1)" },
  "state-feedback": { label: "State feedback", law: "u = −(k[0]·x₀ + … + k[n−1]·xₙ₋₁) + n·r" },
};

export const STRUCTURE_ORDER: readonly ControllerKind[] = CONTROLLER_KINDS;

/** One row of the parameter grid: the API name, the form key (no brackets), a label and unit, and its sign rule. */
export interface ParameterRow {
  name: string;
  key: string;
  unit: string;
  sign: "non-negative" | "positive" | "any";
}

/** Form key of a parameter name: "k[2]" → "k2" (react-hook-form reads brackets as array indices). */
export function parameterKey(name: string): string {
  return name.replace(/\[(\d+)\]/g, "$1");
}

/** "integral gain [1/s]": a table parameter's description with its unit. */
function describe(p: ControllerParameter): string {
  return p.unit ? `${p.description} [${p.unit}]` : p.description;
}

/** The form's rows per kind: core's parameter table; PID kinds leave tf to the derivative filter. */
const PARAMETERS: Readonly<Record<FixedParameterKind, readonly ControllerParameter[]>> = Object.fromEntries(
  Object.entries(CONTROLLER_PARAMETERS).map(([kind, table]) => [kind, table.filter((p) => p.name !== "tf")]),
) as unknown as Record<FixedParameterKind, readonly ControllerParameter[]>;

/**
 * The swept parameters of a structure, in the structure's order. PID kinds leave tf to the
 * derivative filter. State feedback has one gain per plant state (`stateNames` label them) and n.
 */
export function parameterRows(kind: ControllerKind, stateNames: readonly string[]): ParameterRow[] {
  if (kind === "state-feedback") {
    const names = [...stateNames.map((_, i) => `k[${i}]`), REFERENCE_GAIN_PARAMETER.name];
    return names.map((name, i) => ({
      name,
      key: parameterKey(name),
      unit: i < stateNames.length ? `gain on ${stateNames[i]}` : describe(REFERENCE_GAIN_PARAMETER),
      sign: parameterSign(kind, name),
    }));
  }
  return PARAMETERS[kind].map((p) => ({ name: p.name, key: parameterKey(p.name), unit: describe(p), sign: parameterSign(kind, p.name) }));
}

/** Every form key a sweep form may hold a range for (all structures, up to MAX_STATE_FEEDBACK_GAINS state gains). */
export const ALL_PARAMETER_KEYS: readonly string[] = [
  ...new Set([
    ...Object.values(PARAMETERS).flatMap((table) => table.map((p) => p.name)),
    REFERENCE_GAIN_PARAMETER.name,
    ...Array.from({ length: MAX_STATE_FEEDBACK_GAINS }, (_, i) => `k${i}`),
  ]),
];
