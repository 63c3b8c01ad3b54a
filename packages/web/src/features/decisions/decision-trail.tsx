import type { DecisionDetailDto } from "@loopyard/core";
import { formatDateTime } from "../../components/format-date.js";
import { eventSentence } from "./decision-text.js";

/** The audit trail: every change of state and every comment with who and when, oldest first, as the server keeps it (append-only). */
export function DecisionTrail({ decision }: { decision: DecisionDetailDto }) {
  return (
    <ol className="space-y-2 border-l border-line pl-4" data-testid="decision-trail">
      {decision.events.map((e) => (
        <li key={e.id} className="relative text-sm" data-testid="decision-event" data-kind={e.kind}>
          <span aria-hidden className="absolute top-1.5 -left-[1.3rem] size-2 rounded-full border border-line bg-sheet" />
          <span className="font-medium">{e.actor.name}</span> {eventSentence(e)}
          {e.fromState && e.toState ? (
            <span className="font-mono text-[11px] text-ink-faint">
              {" "}
              {e.fromState} → {e.toState}
            </span>
          ) : null}
          <div className="text-xs text-ink-soft">{formatDateTime(e.at)}</div>
        </li>
      ))}
    </ol>
  );
}
