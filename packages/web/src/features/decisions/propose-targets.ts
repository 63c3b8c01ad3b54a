import { BASELINE_RULE_IDS, BASELINE_VARIANT_IDS } from "@loopyard/core";
import type { ProposeTarget } from "./propose-dialog.js";
import { defaultProposalTitle } from "./decision-text.js";

/** Candidate `index` of a finished sweep, as a proposal. */
export function candidateTarget(sweep: { id: string; name: string }, index: number): ProposeTarget {
  return {
    source: { kind: "sweep-candidate", sweepId: sweep.id, candidateIndex: index },
    what: `Candidate #${index} of “${sweep.name}”`,
    title: defaultProposalTitle(`Candidate #${index}`, `“${sweep.name}”`),
  };
}

/**
 * A published tuning rule's controller scored beside a sweep's front, as a proposal; null when the
 * rule or its p/pi/pid variant is not one a proposal may name (decisionSourceSchema).
 */
export function baselineTarget(sweep: { id: string; name: string }, baseline: { rule: string; variant: string; label: string }): ProposeTarget | null {
  const rule = BASELINE_RULE_IDS.find((r) => r === baseline.rule);
  const variant = BASELINE_VARIANT_IDS.find((v) => v === baseline.variant);
  if (!rule || !variant) return null;
  return {
    source: { kind: "baseline", sweepId: sweep.id, rule, variant },
    what: `${baseline.label} beside “${sweep.name}”`,
    title: defaultProposalTitle(baseline.label, `“${sweep.name}”`),
  };
}

/** The pick of contender `contender` (its column key) of a finished comparison, as a proposal; `label` names the contender for people. */
export function pickTarget(comparison: { id: string; name: string }, contender: string, label: string): ProposeTarget {
  return {
    source: { kind: "comparison-pick", comparisonId: comparison.id, contender },
    what: `${label}'s pick in “${comparison.name}”`,
    title: defaultProposalTitle(`${label}'s pick`, `“${comparison.name}”`),
  };
}

/** The candidate a sweep page opens with from its ?candidate= parameter: a whole number below the sweep's total, else none. */
export function initialCandidate(text: string | null, total: number): number | null {
  if (text === null || !/^\d{1,10}$/.test(text)) return null;
  const index = Number(text);
  return index < total ? index : null;
}
