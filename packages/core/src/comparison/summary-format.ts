import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { ComparisonColumn } from "./comparison-plan.js";

/** How the summary names a registry criterion in running text (acronyms and symbols keep their label). */
const PHRASES: Readonly<Partial<Record<string, string>>> = {
  effort: "effort",
  rawEffort: "raw effort",
  tv: "total variation of u",
  upeak: "peak |u|",
  overshoot: "overshoot",
  undershoot: "undershoot",
  riseTime: "rise time",
  settlingTime: "settling time",
  steadyStateError: "steady-state error",
  gainMargin: "gain margin",
  phaseMargin: "phase margin",
  crossoverFrequency: "crossover frequency",
  bandwidth: "bandwidth",
  quadratic: "quadratic J",
};

/** Units printed after a value in the summary; the others (y·s, u²·s, …) depend on the plant's units and are left out. */
const SHOWN_UNITS = new Set(["%", "°", "s", "rad/s"]);

/** A column in running text: "overshoot", "IAE", or a quadratic contender's label. */
export function columnPhrase(column: ComparisonColumn): string {
  if (column.key !== column.criterion) return column.label;
  return PHRASES[column.criterion] ?? column.label;
}

/** A value with its unit when the unit is absolute (%, °, s, rad/s): "4.1 %", "0.412". */
export function formatValue(column: ComparisonColumn, value: number): string {
  const text = formatNumber(value, 3);
  return SHOWN_UNITS.has(column.unit) ? `${text}${column.unit === "°" ? "°" : ` ${column.unit}`}` : text;
}

/** A number to `digits` significant digits without trailing zeros; "∞" for infinity, "n/a" for NaN. */
export function formatNumber(value: number, digits: number): string {
  if (Number.isNaN(value)) return "n/a";
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "−∞";
  if (value === 0) return "0";
  const text = Number(value.toPrecision(digits)).toString();
  return text.replace("-", "−");
}

/** The aggregate as an adjective: "worst-case", "mean", "90th-percentile". */
export function aggregatePhrase(aggregate: Aggregate): string {
  if (aggregate.kind === "worst") return "worst-case";
  if (aggregate.kind === "mean") return "mean";
  const p = aggregate.p;
  const suffix = p % 10 === 1 && p % 100 !== 11 ? "st" : p % 10 === 2 && p % 100 !== 12 ? "nd" : p % 10 === 3 && p % 100 !== 13 ? "rd" : "th";
  return `${p}${suffix}-percentile`;
}

/** "v1", "v1 and v2", "v1, v2 and v3". */
export function listPhrase(items: readonly string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}
