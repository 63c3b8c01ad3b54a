import { CRITERIA, CRITERION_IDS, type CriterionId } from "@loopyard/core";

/** The criteria of the sweep form in three groups; any id not listed here lands in a last group. */
const GROUPS: readonly { title: string; ids: readonly CriterionId[] }[] = [
  { title: "Integral of error", ids: ["iae", "ise", "itae", "itse", "quadratic"] },
  { title: "Effort", ids: ["effort", "rawEffort", "tv", "upeak"] },
  { title: "Step response", ids: ["overshoot", "undershoot", "riseTime", "settlingTime", "steadyStateError"] },
];

/** True for criteria computed from the loop's frequency response (linear plants only). */
export function isFrequencyCriterion(id: CriterionId): boolean {
  return (CRITERIA[id] as { kind?: string } | undefined)?.kind === "frequency";
}

/**
 * Every registered criterion, grouped for the form: the three time-domain groups, then the
 * frequency-response criteria (linear plants only), then anything else; nothing registered is left out.
 */
export function criterionGroups(): { title: string; ids: CriterionId[]; wide: boolean }[] {
  const listed = new Set(GROUPS.flatMap((g) => g.ids));
  const known = new Set<CriterionId>(CRITERION_IDS);
  const groups = GROUPS.map((g) => ({ title: g.title, ids: g.ids.filter((id) => known.has(id)), wide: false }));
  const rest = CRITERION_IDS.filter((id) => !listed.has(id));
  const frequency = rest.filter(isFrequencyCriterion);
  const other = rest.filter((id) => !isFrequencyCriterion(id));
  if (frequency.length > 0) groups.push({ title: "Frequency response (linear plants)", ids: frequency, wide: true });
  if (other.length > 0) groups.push({ title: "Other", ids: other, wide: true });
  return groups;
}

/** The step-response figures: they need a setpoint change and do not apply to a load step alone. */
export const STEP_RESPONSE_CRITERIA: readonly CriterionId[] = GROUPS[2].ids;
