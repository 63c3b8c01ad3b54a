import { Link } from "react-router";
import type { DecisionListItemDto } from "@loopyard/core";
import { useWaitingDecisions } from "../../api/use-decisions.js";
import { formatDateTime } from "../../components/format-date.js";
import { Section } from "../../components/section.js";
import { DecisionStateBadge } from "./decision-state-badge.js";

/**
 * The workspace home's "Waiting for you" card: for a lead, the proposals they may approve; for a proposer,
 * their proposals a lead returned. Says so when nothing waits.
 */
export function WaitingCard({ slug }: { slug: string }) {
  const waiting = useWaitingDecisions(slug);
  const base = `/w/${slug}`;
  const toApprove = waiting.data?.toApprove ?? [];
  const returned = waiting.data?.returnedToMe ?? [];
  return (
    <Section title="Waiting for you" aside={<Link to={`${base}/decisions`} className="hover:text-moss">All decisions →</Link>} testId="waiting-card">
      {waiting.isPending ? (
        <p className="text-sm text-ink-soft">Looking for proposals…</p>
      ) : waiting.isError ? (
        <p className="text-sm text-rust">Could not load what waits for you ({waiting.error.message}).</p>
      ) : toApprove.length === 0 && returned.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="waiting-nothing">
          Nothing waits for you: no proposal to approve and none of yours returned.
        </p>
      ) : (
        <div className="space-y-4">
          {toApprove.length > 0 ? <WaitingList title={`${toApprove.length} to approve or return`} rows={toApprove} base={base} testId="waiting-approve" /> : null}
          {returned.length > 0 ? <WaitingList title={`${returned.length} returned to you — revise or withdraw`} rows={returned} base={base} testId="waiting-returned" /> : null}
        </div>
      )}
    </Section>
  );
}

function WaitingList({ title, rows, base, testId }: { title: string; rows: DecisionListItemDto[]; base: string; testId: string }) {
  return (
    <div data-testid={testId}>
      <div className="mb-1 text-xs font-medium text-ink-soft">{title}</div>
      <ul className="divide-y divide-line-soft">
        {rows.map((d) => (
          <li key={d.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2">
            <div className="min-w-0 flex-1 basis-56">
              <Link to={`${base}/decisions/${d.id}`} className="font-medium hover:text-moss" data-testid="waiting-link">
                {d.title}
              </Link>
              <div className="text-xs text-ink-soft">
                {d.family.name} · {d.proposedBy.name} · {formatDateTime(d.updatedAt)}
              </div>
            </div>
            <DecisionStateBadge state={d.state} />
          </li>
        ))}
      </ul>
    </div>
  );
}
