import type { ScoreValue } from "@loopyard/core";
import { formatNumber } from "../../components/format-number.js";

/** Fewest and most significant digits a table column is printed with. */
export const MIN_DIGITS = 4;
export const MAX_DIGITS = 10;

/**
 * The significant digits a column needs so that neighbouring rows with different values print
 * differently: the least d in [MIN_DIGITS, MAX_DIGITS] with formatNumber(a, d) ≠ formatNumber(b, d)
 * for every pair of adjacent finite values a ≠ b (non-numbers, such as "inf" or null, are skipped).
 * Values that differ only beyond MAX_DIGITS keep MAX_DIGITS. A front sorted by one criterion moves
 * in small steps along it, so 4 digits can print two rows alike (common practice: print as many
 * digits as it takes to tell adjacent entries apart, no more).
 */
export function distinguishingDigits(values: readonly (ScoreValue | number | undefined)[], min = MIN_DIGITS, max = MAX_DIGITS): number {
  let digits = min;
  let previous: number | null = null;
  for (const value of values) {
    if (typeof value !== "number" || !Number.isFinite(value)) continue;
    if (previous !== null && previous !== value) {
      while (digits < max && formatNumber(previous, digits) === formatNumber(value, digits)) digits++;
    }
    previous = value;
  }
  return digits;
}
