import { useState } from "react";
import { ROLES, type MemberDto, type Role } from "@loopyard/core";
import { useChangeRole, useRemoveMember } from "../../api/use-members.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { inputClass } from "../../components/field.js";
import { ListTable } from "../../components/list-table.js";

/**
 * The members with their roles. Admins get a role picker and a remove button per row; the last
 * admin's controls are disabled with the reason (the server refuses it too).
 */
export function MemberTable({ slug, members, adminCount, canManage, myId }: { slug: string; members: MemberDto[]; adminCount: number; canManage: boolean; myId: string }) {
  const changeRole = useChangeRole(slug);
  const remove = useRemoveMember(slug);
  const [confirming, setConfirming] = useState<string | null>(null);
  const error = changeRole.error ?? remove.error;
  const columns = [
    { label: "Name" },
    { label: "Address" },
    { label: "Role", className: "w-40" },
    { label: "Joined", className: "w-44" },
    ...(canManage ? [{ label: "", className: "w-48" }] : []),
  ];
  return (
    <div className="space-y-3">
      {error ? <ErrorNote error={error} title={changeRole.error ? "Could not change the role" : "Could not remove the member"} /> : null}
      <ListTable testId="member-table" columns={columns}>
        {members.map((member) => {
          const lastAdmin = member.role === "admin" && adminCount === 1;
          const you = member.user.id === myId;
          return (
            <tr key={member.user.id} data-testid="member-row">
              <td className="px-4 py-2 font-medium">
                {member.user.name}
                {you ? <span className="ml-2 text-xs font-normal text-ink-faint">you</span> : null}
              </td>
              <td className="px-4 py-2 text-ink-soft">{member.user.email}</td>
              <td className="px-4 py-2">
                {canManage ? (
                  <select
                    aria-label={`Role of ${member.user.name}`}
                    className={inputClass}
                    value={member.role}
                    disabled={changeRole.isPending || lastAdmin}
                    title={lastAdmin ? "The last admin keeps the role: make another member an admin first." : undefined}
                    data-testid="member-role"
                    onChange={(event) => changeRole.mutate({ userId: member.user.id, role: event.target.value as Role })}
                  >
                    {ROLES.map((role) => (
                      <option key={role} value={role}>
                        {role}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="rounded border border-line px-1.5 py-px font-mono text-[11px] text-ink-soft">{member.role}</span>
                )}
              </td>
              <td className="px-4 py-2 text-ink-soft">{formatDateTime(member.joinedAt)}</td>
              {canManage ? (
                <td className="px-4 py-2 text-right">
                  {confirming === member.user.id ? (
                    <span className="inline-flex gap-2">
                      <Button tone="danger" disabled={remove.isPending} onClick={() => remove.mutate(member.user.id, { onSettled: () => setConfirming(null) })} data-testid="member-remove-confirm">
                        {you ? "Leave" : "Remove"}
                      </Button>
                      <Button tone="plain" onClick={() => setConfirming(null)}>
                        Keep
                      </Button>
                    </span>
                  ) : (
                    <Button
                      tone="plain"
                      disabled={lastAdmin}
                      title={lastAdmin ? "The last admin cannot be removed: make another member an admin first." : undefined}
                      onClick={() => setConfirming(member.user.id)}
                      data-testid="member-remove"
                    >
                      {you ? "Leave…" : "Remove…"}
                    </Button>
                  )}
                </td>
              ) : null}
            </tr>
          );
        })}
      </ListTable>
    </div>
  );
}
