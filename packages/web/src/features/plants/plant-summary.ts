import type { Plant } from "@loopyard/core";
import { formatTransferFunction } from "./format-transfer-function.js";

export type ActuatorLimitsView = Plant["actuator"];

/** One line describing a plant model for the library table: the fraction, the order, or the formulas. */
export function plantModelSummary(model: Plant): string {
  switch (model.kind) {
    case "transfer-function":
      return formatTransferFunction({ ...model, delay: 0 }).replace("G(s) = ", "");
    case "identified":
      return `${model.identification.fit.model.toUpperCase()} fit: ${formatTransferFunction({ ...model, delay: 0 }).replace("G(s) = ", "")}`;
    case "state-space":
      return `order n = ${model.A.length}`;
    case "nonlinear":
      return model.states.map((name, i) => `d${name}/dt = ${model.derivatives[i]}`).join("; ");
  }
}

/** The number of states a plant's state-feedback gains refer to: state-space n, TF den degree, nonlinear states. */
export function plantStateCount(model: Plant): number {
  switch (model.kind) {
    case "transfer-function":
    case "identified": {
      const first = model.den.findIndex((c) => c !== 0);
      return first < 0 ? 0 : model.den.length - 1 - first;
    }
    case "state-space":
      return model.A.length;
    case "nonlinear":
      return model.states.length;
  }
}

/** Dead time of a plant, 0 for the kinds without one. */
export function plantDelay(model: Plant): number | null {
  return model.kind === "transfer-function" || model.kind === "identified" ? model.delay : null;
}

/** True when the plant has any actuator limit. */
export function hasLimits(model: Plant): boolean {
  const a = model.actuator;
  return a !== undefined && (a.min !== undefined || a.max !== undefined || a.rate !== undefined);
}

const SUBSCRIPT_DIGITS = "₀₁₂₃₄₅₆₇₈₉";

/** Names of the states a state-feedback gain acts on: the nonlinear plant's names, else x₀, x₁, … */
export function plantStateNames(model: Plant): string[] {
  if (model.kind === "nonlinear") return [...model.states];
  return Array.from({ length: plantStateCount(model) }, (_, i) => `x${String(i).replace(/\d/g, (d) => SUBSCRIPT_DIGITS[Number(d)])}`);
}
