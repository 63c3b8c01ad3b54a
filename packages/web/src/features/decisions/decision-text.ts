import type { DecisionEventDto, DecisionSource, DecisionState } from "@loopyard/core";
import { formatNumber } from "../../components/format-number.js";

/** Each state in a few words, as lists and badges show it. */
export const DECISION_STATE_LABEL: Record<DecisionState, string> = {
  proposed: "proposed",
  returned: "returned",
  approved: "approved",
  superseded: "superseded",
  withdrawn: "withdrawn",
};

/** What each state means for the reader, one sentence. */
export const DECISION_STATE_MEANING: Record<DecisionState, string> = {
  proposed: "Waiting for a lead to approve it or return it with a comment.",
  returned: "Returned by a lead with a comment; the proposer can revise it (it is then proposed again) or withdraw it.",
  approved: "Approved: the family's current decision. Frozen — nothing in it changes, and the revisions and sweeps it points at cannot be deleted.",
  superseded: "Superseded by a later approved decision of the same family; kept, frozen, as history.",
  withdrawn: "Withdrawn; kept as history.",
};

/**
 * The page of the app a decision's design came from, relative to the workspace's base path
 * (`/w/:slug`): the sweep (its front, with the candidate chosen) or the comparison.
 */
export function sourcePath(base: string, source: DecisionSource): string {
  switch (source.kind) {
    case "sweep-candidate":
      return `${base}/sweeps/${encodeURIComponent(source.sweepId)}?candidate=${source.candidateIndex}`;
    case "baseline":
      return `${base}/sweeps/${encodeURIComponent(source.sweepId)}`;
    case "comparison-pick":
      return `${base}/comparisons/${encodeURIComponent(source.comparisonId)}`;
  }
}

/** What kind of design a source names, in words: "a sweep candidate", "a comparison pick", "a baseline". */
export function sourceKindLabel(source: DecisionSource): string {
  return source.kind === "sweep-candidate" ? "a sweep candidate" : source.kind === "comparison-pick" ? "a comparison pick" : "a published tuning rule (baseline)";
}

/** A controller's parameters on one line, in their order: "kp = 1.2 · ki = 0.35 · kd = 0". */
export function formatParameters(parameters: Record<string, number>): string {
  return Object.entries(parameters)
    .map(([name, value]) => `${name} = ${formatNumber(value)}`)
    .join(" · ");
}

/** One line of the audit trail in words, without who and when: "proposed it", "returned it", "approved it (replacing an earlier decision)". */
export function eventSentence(event: Pick<DecisionEventDto, "kind" | "supersedes" | "supersededBy" | "revised">): string {
  switch (event.kind) {
    case "proposed":
      return "proposed it";
    case "revised": {
      const changed = [event.revised?.title !== undefined ? "the title" : null, event.revised?.rationale ? "the rationale" : null, event.revised?.source ? "the design" : null].filter(Boolean);
      return changed.length > 0 ? `revised ${joinWords(changed as string[])} and proposed it again` : "proposed it again";
    }
    case "returned":
      return "returned it";
    case "commented":
      return "commented";
    case "approved":
      return event.supersedes ? "approved it, superseding the family's earlier decision" : "approved it";
    case "superseded":
      return "superseded it by approving a later decision of the family";
    case "withdrawn":
      return "withdrew it";
  }
}

/** "a", "a and b", "a, b and c". */
export function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words[0] ?? "";
  return `${words.slice(0, -1).join(", ")} and ${words[words.length - 1]}`;
}

/** The title a proposal starts with: what it is and where it came from, within the title limit. */
export function defaultProposalTitle(what: string, from: string, max = 120): string {
  const title = `${what} from ${from}`;
  return title.length <= max ? title : `${title.slice(0, max - 1)}…`;
}

/** The families of a list of decisions, each once (first seen first), for a filter. */
export function familyOptions(decisions: readonly { family: { key: string; name: string } }[]): { key: string; name: string }[] {
  const seen = new Map<string, string>();
  for (const d of decisions) if (!seen.has(d.family.key)) seen.set(d.family.key, d.family.name);
  return [...seen].map(([key, name]) => ({ key, name }));
}

/** A record's score for a cell: a number formatted, "∞"/"−∞" for the record's "inf"/"-inf", "—" where the criterion does not apply (null). */
export function scoreText(value: number | "inf" | "-inf" | null, format: (v: number) => string): string {
  if (value === null) return "—";
  if (value === "inf") return "∞";
  if (value === "-inf") return "−∞";
  return format(value);
}

/**
 * The address of a decision's deployment sheet (`base` is the decision's API address) at the sample time
 * typed (seconds; a number above 0, else null: no link), the discretisation and the optional fixed-point format.
 */
export function sheetHref(base: string, sampleTime: string, method: "tustin" | "backward-euler", format: "" | "q15" | "q31"): string | null {
  const seconds = Number(sampleTime.trim());
  if (sampleTime.trim() === "" || !Number.isFinite(seconds) || seconds <= 0) return null;
  const query = new URLSearchParams({ sampleTime: String(seconds), method });
  if (format) query.set("format", format);
  return `${base}/sheet?${query.toString()}`;
}

/** A pick's regret [%] against its column's best: "best" at 0, whole per cent from 100 % up ("+180 %"), else two significant digits ("+43 %", "+6.7 %"). */
export function regretText(regret: number | "inf" | "-inf" | null): string {
  if (regret === null) return "—";
  if (regret === "inf") return "+∞ %";
  if (regret === "-inf") return "—";
  if (regret === 0) return "best";
  return `+${Math.abs(regret) >= 100 ? String(Math.round(regret)) : formatNumber(regret, 2)} %`;
}
