import { and, asc, eq, sql } from "drizzle-orm";
import type { MemberDto, Role, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { membership, user, workspace } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";

/** Members of a workspace with their roles and when they joined, by name. */
export async function listMembersWithDates(db: Database, workspaceId: string): Promise<MemberDto[]> {
  const rows = await db
    .select({ user: userDtoColumns, role: membership.role, joinedAt: membership.createdAt })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(eq(membership.workspaceId, workspaceId))
    .orderBy(asc(user.name), asc(user.email));
  return rows.map((row) => ({ user: row.user, role: row.role, joinedAt: row.joinedAt.toISOString() }));
}

/**
 * Locks the workspace row until the transaction ends, so that membership changes of one workspace
 * run one after another (two admins demoting each other at once cannot leave it without an admin).
 */
export async function lockWorkspace(tx: Database, workspaceId: string): Promise<void> {
  await tx.select({ id: workspace.id }).from(workspace).where(eq(workspace.id, workspaceId)).for("update");
}

/** One member with their role, or null when the user is not a member of the workspace. */
export async function findMember(db: Database, workspaceId: string, userId: string): Promise<{ user: UserDto; role: Role; joinedAt: Date } | null> {
  const rows = await db
    .select({ user: userDtoColumns, role: membership.role, joinedAt: membership.createdAt })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.workspaceId, workspaceId), eq(membership.userId, userId)))
    .limit(1);
  return rows[0] ?? null;
}

/** How many admins the workspace has. */
export async function countAdmins(db: Database, workspaceId: string): Promise<number> {
  const rows = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(membership)
    .where(and(eq(membership.workspaceId, workspaceId), eq(membership.role, "admin")));
  return rows[0]?.count ?? 0;
}

export async function updateMemberRole(db: Database, workspaceId: string, userId: string, role: Role): Promise<void> {
  await db.update(membership).set({ role }).where(and(eq(membership.workspaceId, workspaceId), eq(membership.userId, userId)));
}

export async function deleteMembership(db: Database, workspaceId: string, userId: string): Promise<void> {
  await db.delete(membership).where(and(eq(membership.workspaceId, workspaceId), eq(membership.userId, userId)));
}

/** Marks the user's address as checked (accepting an invitation mailed to it proves the mailbox). */
export async function markEmailVerified(db: Database, userId: string): Promise<void> {
  await db.update(user).set({ emailVerified: true }).where(eq(user.id, userId));
}

/** The member of the workspace with this address, or null (addresses are stored lower-cased). */
export async function findMemberByEmail(db: Database, workspaceId: string, email: string): Promise<{ user: UserDto; role: Role } | null> {
  const rows = await db
    .select({ user: userDtoColumns, role: membership.role })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.workspaceId, workspaceId), eq(user.email, email)))
    .limit(1);
  return rows[0] ?? null;
}
