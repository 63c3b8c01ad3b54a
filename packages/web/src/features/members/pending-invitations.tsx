import type { InvitationDto } from "@loopyard/core";
import { useResendInvitation, useRevokeInvitation } from "../../api/use-members.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListTable } from "../../components/list-table.js";

/** The pending invitations with re-send (a new link, 7 more days) and revoke. */
export function PendingInvitations({ slug, invitations }: { slug: string; invitations: InvitationDto[] }) {
  const resend = useResendInvitation(slug);
  const revoke = useRevokeInvitation(slug);
  const error = resend.error ?? revoke.error;
  if (invitations.length === 0) {
    return <p className="text-sm text-ink-soft" data-testid="no-invitations">No invitation is waiting for an answer. Invite someone with the form above.</p>;
  }
  return (
    <div className="space-y-3">
      {error ? <ErrorNote error={error} title={resend.error ? "Could not re-send the invitation" : "Could not revoke the invitation"} /> : null}
      <ListTable
        testId="invitation-table"
        columns={[{ label: "Address" }, { label: "Role", className: "w-24" }, { label: "Invited by" }, { label: "Sent", className: "w-44" }, { label: "Expires", className: "w-48" }, { label: "", className: "w-48" }]}
      >
        {invitations.map((invitation) => (
          <tr key={invitation.id} data-testid="invitation-row">
            <td className="px-4 py-2 font-medium">{invitation.email}</td>
            <td className="px-4 py-2 font-mono text-xs text-ink-soft">{invitation.role}</td>
            <td className="px-4 py-2 text-ink-soft">{invitation.invitedBy?.name ?? "—"}</td>
            <td className="px-4 py-2 text-ink-soft">
              {formatDateTime(invitation.sentAt)}
              {invitation.sendCount > 1 ? <span className="ml-1 text-xs text-ink-faint">({invitation.sendCount}×)</span> : null}
            </td>
            <td className={`px-4 py-2 ${invitation.expired ? "text-rust" : "text-ink-soft"}`}>
              {invitation.expired ? `expired ${formatDateTime(invitation.expiresAt)}` : formatDateTime(invitation.expiresAt)}
            </td>
            <td className="px-4 py-2 text-right">
              <span className="inline-flex gap-2">
                <Button tone="quiet" disabled={resend.isPending} onClick={() => resend.mutate(invitation.id)} data-testid="invitation-resend">
                  Re-send
                </Button>
                <Button tone="plain" disabled={revoke.isPending} onClick={() => revoke.mutate(invitation.id)} data-testid="invitation-revoke">
                  Revoke
                </Button>
              </span>
            </td>
          </tr>
        ))}
      </ListTable>
    </div>
  );
}
