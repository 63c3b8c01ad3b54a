/**
 * Identifiers of the criteria, in display order: the time-domain ones, then the frequency-domain
 * ones (ms … wsNorm, kind "frequency", linear plants only). All are accepted by the
 * `loopyard evaluate` spec.
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
  "loadRecoveryTime",
  "ms",
  "mt",
  "gainMargin",
  "phaseMargin",
  "crossoverFrequency",
  "bandwidth",
  "wsNorm",
] as const;

export type CriterionId = (typeof CRITERION_IDS)[number];
