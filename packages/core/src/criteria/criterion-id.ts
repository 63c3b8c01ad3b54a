/** Identifiers of the criteria this version computes, in display order. */
export const CRITERION_IDS = ["iae", "ise", "itae", "effort"] as const;

export type CriterionId = (typeof CRITERION_IDS)[number];
