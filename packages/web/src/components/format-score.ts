import type { ScoreValue } from "@loopyard/core";
import { formatNumber } from "./format-number.js";

/** Tooltip of a score that does not apply (the API's null). */
export const NOT_APPLICABLE_NOTE = "does not apply to this scenario";

/**
 * A score as the API sends it, for a table cell: a finite number to 4 significant digits,
 * "inf" as ∞ (e.g. a settling time not reached within the horizon), "-inf" as −∞, null as "—".
 */
export function formatScore(value: ScoreValue | undefined, digits = 4): string {
  if (value === "inf") return "∞";
  if (value === "-inf") return "−∞";
  if (value === null || value === undefined) return "—";
  return formatNumber(value, digits);
}

/** The hover text of a score cell: the full number, what ∞ means, or why there is no value. */
export function scoreTitle(value: ScoreValue | undefined): string | undefined {
  if (value === "inf") return "infinite: not reached within the horizon";
  if (value === "-inf") return "minus infinity";
  if (value === null || value === undefined) return NOT_APPLICABLE_NOTE;
  return String(value);
}

/** The score as a plain number when it is finite, else null (fronts and charts ignore the rest). */
export function finiteScore(value: ScoreValue | undefined): number | null {
  return typeof value === "number" && Number.isFinite(value) ? value : null;
}
