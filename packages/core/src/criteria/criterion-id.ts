/**
 * Identifiers of the time-domain criteria, in display order. All but "quadratic", "undershoot" and
 * "steadyStateError" are also the criterion names of the `loopyard evaluate` spec.
 */
export const CRITERION_IDS = [
  "iae",
  "ise",
  "itae",
  "itse",
  "quadratic",
  "effort",
  "rawEffort",
  "tv",
  "upeak",
  "overshoot",
  "undershoot",
  "riseTime",
  "settlingTime",
  "steadyStateError",
] as const;

export type CriterionId = (typeof CRITERION_IDS)[number];
