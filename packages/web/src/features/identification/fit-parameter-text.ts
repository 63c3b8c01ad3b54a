import type { StepModelKind } from "@loopyard/core";
import { formatCoefficient } from "../plants/format-transfer-function.js";

/** How each model is named in the app, with its transfer function in words. */
export const STEP_MODEL_LABELS: Record<StepModelKind, { label: string; formula: string }> = {
  fopdt: { label: "First order + dead time", formula: "k·e^(−θs) / (τs + 1)" },
  sopdt: { label: "Second order + dead time", formula: "k·e^(−θs) / ((τ₁s + 1)(τ₂s + 1))" },
  ipdt: { label: "Integrating + dead time", formula: "k·e^(−θs) / s" },
};

/** Symbols of the fitted parameters. */
const SYMBOLS: Record<string, string> = { k: "k", tau: "τ", tau1: "τ₁", tau2: "τ₂", theta: "θ" };

/** The symbol of a fitted parameter: "tau1" → "τ₁". */
export function parameterSymbol(name: string): string {
  return SYMBOLS[name] ?? name;
}

/**
 * The unit of a fitted parameter: times in s; the gain in output unit per input unit (per second
 * too for an integrating model). Blank units read "y" and "u".
 */
export function parameterUnit(name: string, model: StepModelKind, units: { input: string; output: string }): string {
  if (name !== "k") return "s";
  const y = units.output.trim() || "y";
  const u = units.input.trim() || "u";
  return model === "ipdt" ? `${y}/(${u}·s)` : `${y}/${u}`;
}

/** A value with its 95 % interval: "0.6 [0.59, 0.61]"; an interval that could not be computed reads "[—]". */
export function formatWithInterval(value: number, interval: readonly [number, number] | undefined): string {
  const bounds = interval && Number.isFinite(interval[0]) && Number.isFinite(interval[1]) ? `[${formatCoefficient(interval[0])}, ${formatCoefficient(interval[1])}]` : "[—]";
  return `${formatCoefficient(value)} ${bounds}`;
}

/** R² to four decimals, or more when the fit is nearly exact (0.99999…). */
export function formatR2(r2: number): string {
  if (!Number.isFinite(r2)) return "—";
  if (r2 > 0.9999 && r2 < 1) return r2.toFixed(6);
  return r2.toFixed(4);
}

/** A units note for the saved plant from the chosen columns and units: "u: heater_pct [%]; y: plate_degC [°C]". */
export function identifiedUnitsNote(columns: { input: string; output: string }, units: { time: string; input: string; output: string }): string {
  const part = (symbol: string, name: string, unit: string) => `${symbol}: ${name}${unit.trim() ? ` [${unit.trim()}]` : ""}`;
  return `${part("u", columns.input, units.input)}; ${part("y", columns.output, units.output)}; t [s]`;
}
