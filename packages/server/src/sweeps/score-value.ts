import type { ScoreValue } from "@loopyard/core";

/**
 * A stored score (double precision, NaN and ±Infinity kept) as it goes out in JSON (ScoreValue):
 * finite numbers as they are, ±Infinity as "inf"/"-inf", NaN (the criterion does not apply) as null.
 */
export function toScoreValue(value: number): ScoreValue {
  if (Number.isFinite(value)) return value;
  if (value === Number.POSITIVE_INFINITY) return "inf";
  if (value === Number.NEGATIVE_INFINITY) return "-inf";
  return null;
}

/** A ScoreValue back as a number (NaN for null), e.g. to compute a front. */
export function fromScoreValue(value: ScoreValue | undefined): number {
  if (typeof value === "number") return value;
  if (value === "inf") return Number.POSITIVE_INFINITY;
  if (value === "-inf") return Number.NEGATIVE_INFINITY;
  return Number.NaN;
}
