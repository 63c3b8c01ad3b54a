import type { DecisionState } from "@loopyard/core";
import { DECISION_STATE_LABEL, DECISION_STATE_MEANING } from "./decision-text.js";

const STYLE: Record<DecisionState, string> = {
  proposed: "border-amber/50 bg-amber-wash text-amber",
  returned: "border-rust/50 bg-rust-wash text-rust",
  approved: "border-moss/60 bg-moss-wash text-moss",
  superseded: "border-line text-ink-soft",
  withdrawn: "border-line text-ink-faint",
};

/** The state of a proposal or decision as a small label; its meaning on hover. */
export function DecisionStateBadge({ state }: { state: DecisionState }) {
  return (
    <span
      data-testid="decision-state"
      data-state={state}
      title={DECISION_STATE_MEANING[state]}
      className={`inline-flex items-center whitespace-nowrap rounded border px-1.5 py-px font-mono text-[11px] ${STYLE[state]}`}
    >
      {DECISION_STATE_LABEL[state]}
    </span>
  );
}
