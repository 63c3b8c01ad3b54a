import { CRITERION_IDS, type CriterionId } from "@loopyard/core";

/** The criteria of the sweep form in three groups; any id not listed here lands in a last group. */
const GROUPS: readonly { title: string; ids: readonly CriterionId[] }[] = [
  { title: "Integral of error", ids: ["iae", "ise", "itae", "itse", "quadratic"] },
  { title: "Effort", ids: ["effort", "rawEffort", "tv", "upeak"] },
  { title: "Step response", ids: ["overshoot", "undershoot", "riseTime", "settlingTime", "steadyStateError"] },
];

/** Every registered criterion, grouped for the form; nothing registered is left out. */
export function criterionGroups(): { title: string; ids: CriterionId[] }[] {
  const listed = new Set(GROUPS.flatMap((g) => g.ids));
  const known = new Set<CriterionId>(CRITERION_IDS);
  const groups = GROUPS.map((g) => ({ title: g.title, ids: g.ids.filter((id) => known.has(id)) }));
  const rest = CRITERION_IDS.filter((id) => !listed.has(id));
  return rest.length > 0 ? [...groups, { title: "Other", ids: rest }] : groups;
}

/** The step-response figures: they need a setpoint change and do not apply to a load step alone. */
export const STEP_RESPONSE_CRITERIA: readonly CriterionId[] = GROUPS[2].ids;
