import type { AuditEventDto } from "@loopyard/core";
import { formatDateTime } from "../../components/format-date.js";
import { ListTable } from "../../components/list-table.js";
import { auditSentence } from "./audit-sentence.js";

/** The workspace's audit trail of membership changes, newest first. */
export function AuditTrail({ events }: { events: AuditEventDto[] }) {
  if (events.length === 0) {
    return <p className="text-sm text-ink-soft">No membership change yet. Invitations, answers, role changes and removals will be listed here.</p>;
  }
  return (
    <ListTable testId="audit-table" columns={[{ label: "When", className: "w-44" }, { label: "Who" }, { label: "What" }]}>
      {events.map((event) => (
        <tr key={event.id} data-testid="audit-row">
          <td className="px-4 py-2 text-ink-soft">{formatDateTime(event.at)}</td>
          <td className="px-4 py-2">{event.actor?.name ?? "—"}</td>
          <td className="px-4 py-2">{auditSentence(event)}</td>
        </tr>
      ))}
    </ListTable>
  );
}
