/**
 * Status codes of a batch result (one byte per candidate and variant), the index in this list:
 * 0 stable, 1 unstable, 2 diverged (the verdicts of evaluateCandidate), 3 invalid (the candidate's
 * controller was rejected before evaluation, e.g. a derivative without a filter, tf < 0).
 */
export const BATCH_STATUSES = ["stable", "unstable", "diverged", "invalid"] as const;

export type BatchStatus = (typeof BATCH_STATUSES)[number];

export const STATUS_STABLE = 0;
export const STATUS_UNSTABLE = 1;
export const STATUS_DIVERGED = 2;
export const STATUS_INVALID = 3;

/** The name of a status code; throws a RangeError for an unknown code. */
export function batchStatusName(code: number): BatchStatus {
  const name = BATCH_STATUSES[code];
  if (name === undefined) throw new RangeError(`status code ${code} is not one of 0…${BATCH_STATUSES.length - 1}`);
  return name;
}
