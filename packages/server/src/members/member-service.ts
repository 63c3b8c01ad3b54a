import type { AuditEventDto, MemberDto, MemberListDto, Role, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { HttpError, notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { appendAuditEvent, listAuditEvents } from "./audit-repository.js";
import { forgetMemberships } from "../workspaces/member-memo.js";
import { forgetWorkspaceDirectories } from "../workspaces/workspace-directory-cache.js";
import { countAdmins, deleteMembership, findMember, listMembersWithDates, lockWorkspace, updateMemberRole } from "./member-repository.js";

/** How many audit entries the Members page shows (newest first). */
export const AUDIT_PAGE_SIZE = 200;

/** Shape of a better-auth user id as it appears in a path; anything else is a 404 without a query. */
const USER_ID_PATTERN = /^[A-Za-z0-9_-]{1,64}$/;

function noSuchMember(workspaceName: string): HttpError {
  return notFound(`There is no such member of ${workspaceName}; reload the Members page to see who is in it now.`);
}

function name(user: UserDto, access: MemberAccess): string {
  return user.id === access.user.id ? "You are" : `${user.name} is`;
}

/** GET /members: every member with role and joining date, and the number of admins. */
export async function listWorkspaceMembers(db: Database, access: MemberAccess): Promise<MemberListDto> {
  const members = await listMembersWithDates(db, access.workspace.id);
  return { members, adminCount: members.filter((m) => m.role === "admin").length };
}

/**
 * Gives a member another role. The workspace's membership changes are serialised (the workspace row
 * is locked), so the last admin can never be demoted, even by two admins demoting each other at once.
 */
export async function changeMemberRole(db: Database, access: MemberAccess, userId: string, role: Role): Promise<MemberDto> {
  const { workspace } = access;
  if (!USER_ID_PATTERN.test(userId)) throw noSuchMember(workspace.name);
  return afterMembershipWrite(db.transaction(async (tx) => {
    await lockWorkspace(tx, workspace.id);
    const member = await findMember(tx, workspace.id, userId);
    if (!member) throw noSuchMember(workspace.name);
    if (member.role !== role) {
      if (member.role === "admin" && (await countAdmins(tx, workspace.id)) === 1) {
        throw new HttpError(
          409,
          `${name(member.user, access)} the last admin of ${workspace.name}, and a workspace needs at least one; make another member an admin first.`,
          { field: "role" },
        );
      }
      await updateMemberRole(tx, workspace.id, userId, role);
      await appendAuditEvent(tx, {
        workspaceId: workspace.id,
        action: "role-changed",
        actor: access.user,
        subject: { name: member.user.name, email: member.user.email },
        role,
        previousRole: member.role,
      });
    }
    return { user: member.user, role, joinedAt: member.joinedAt.toISOString() };
  }));
}

/**
 * Waits for a membership write's transaction and then, committed or not, makes this process forget
 * the memberships and workspace directories it keeps, so a changed role or a removal counts at once.
 */
export async function afterMembershipWrite<T>(write: Promise<T>): Promise<T> {
  try {
    return await write;
  } finally {
    forgetMemberships();
    forgetWorkspaceDirectories();
  }
}

/** Removes a member (an admin may remove themselves while another admin remains). */
export async function removeMember(db: Database, access: MemberAccess, userId: string): Promise<void> {
  const { workspace } = access;
  if (!USER_ID_PATTERN.test(userId)) throw noSuchMember(workspace.name);
  await afterMembershipWrite(db.transaction(async (tx) => {
    await lockWorkspace(tx, workspace.id);
    const member = await findMember(tx, workspace.id, userId);
    if (!member) throw noSuchMember(workspace.name);
    if (member.role === "admin" && (await countAdmins(tx, workspace.id)) === 1) {
      throw new HttpError(
        409,
        `${name(member.user, access)} the last admin of ${workspace.name} and cannot be removed; make another member an admin first.`,
      );
    }
    await deleteMembership(tx, workspace.id, userId);
    await appendAuditEvent(tx, {
      workspaceId: workspace.id,
      action: "member-removed",
      actor: access.user,
      subject: { name: member.user.name, email: member.user.email },
      previousRole: member.role,
    });
  }));
}

/** GET /audit: the newest entries of the workspace's audit trail. */
export async function listWorkspaceAudit(db: Database, access: MemberAccess): Promise<AuditEventDto[]> {
  return listAuditEvents(db, access.workspace.id, AUDIT_PAGE_SIZE);
}
