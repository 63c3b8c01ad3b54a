import { CONTROLLER_KINDS, parameterSign, type ControllerKind } from "@loopyard/core";

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

const UNITS: Record<string, string> = {
  kp: "proportional gain",
  ki: "integral gain [1/s]",
  kd: "derivative gain [s]",
  b: "setpoint weight on P",
  c: "setpoint weight on D",
  k: "gain",
  tLead: "lead time [s]",
  tLag: "lag time [s]",
  n: "reference gain",
};

const PARAMETERS: Readonly<Record<Exclude<ControllerKind, "state-feedback">, readonly string[]>> = {
  p: ["kp"],
  pi: ["kp", "ki"],
  pid: ["kp", "ki", "kd"],
  pid2dof: ["kp", "ki", "kd", "b", "c"],
  "lead-lag": ["k", "tLead", "tLag"],
};

/**
 * The swept parameters of a structure, in the structure's order. PID kinds leave tf to the
 * derivative filter. State feedback has one gain per plant state (`stateNames` label them) and n.
 */
export function parameterRows(kind: ControllerKind, stateNames: readonly string[]): ParameterRow[] {
  const names =
    kind === "state-feedback" ? [...stateNames.map((_, i) => `k[${i}]`), "n"] : [...PARAMETERS[kind]];
  return names.map((name) => {
    const gain = /^k\[(\d+)\]$/.exec(name);
    const unit = gain ? `gain on ${stateNames[Number(gain[1])]}` : (UNITS[name] ?? "");
    return { name, key: parameterKey(name), unit, sign: parameterSign(kind, name) };
  });
}

/** Every form key a sweep form may hold a range for (all structures, up to 10 state gains). */
export const ALL_PARAMETER_KEYS: readonly string[] = [
  ...new Set([...Object.values(PARAMETERS).flat(), "n", ...Array.from({ length: 10 }, (_, i) => `k${i}`)]),
];
