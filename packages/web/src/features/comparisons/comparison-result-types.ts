import type { ComparisonAnalysis } from "@loopyard/core";

/** A number as the API sends it: finite as is, ±∞ as "inf" / "-inf", NaN (not scored) as null. */
export type WireNumber = number | "inf" | "-inf" | null;

/** T with every number as the API sends it (see WireNumber). */
export type Wire<T> = T extends number
  ? WireNumber
  : T extends readonly (infer U)[]
    ? Wire<U>[]
    : T extends object
      ? { [K in keyof T]: Wire<T[K]> }
      : T;

/** GET …/comparisons/:id/result: core's ComparisonAnalysis with numbers as the API sends them. */
export type ComparisonResultJson = Wire<ComparisonAnalysis>;

/** A wire number as a JavaScript number (null → NaN, "inf" → ∞). */
export function numberOf(value: WireNumber | undefined): number {
  if (value === "inf") return Number.POSITIVE_INFINITY;
  if (value === "-inf") return Number.NEGATIVE_INFINITY;
  return value === null || value === undefined ? Number.NaN : value;
}
