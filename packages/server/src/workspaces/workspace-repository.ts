import { and, asc, eq, sql } from "drizzle-orm";
import type { Role, UserDto, WorkspaceDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { membership, plant, user, workspace } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";
import { forgetMemberships, memberMemo } from "./member-memo.js";
import { forgetWorkspaceDirectories } from "./workspace-directory-cache.js";

const workspaceDtoColumns = { id: workspace.id, slug: workspace.slug, name: workspace.name };

export async function findWorkspaceBySlug(db: Database, slug: string): Promise<WorkspaceDto | null> {
  const rows = await db.select(workspaceDtoColumns).from(workspace).where(eq(workspace.slug, slug)).limit(1);
  return rows[0] ?? null;
}

function prepareMemberWorkspace(db: Database) {
  return db
    .select({ workspace: workspaceDtoColumns, role: membership.role })
    .from(workspace)
    .innerJoin(membership, and(eq(membership.workspaceId, workspace.id), eq(membership.userId, sql.placeholder("userId"))))
    .where(eq(workspace.slug, sql.placeholder("slug")))
    .limit(1)
    .prepare("loopyard_member_workspace");
}

/** The prepared membership query, once per database handle (its SQL is built once, not per request). */
const memberWorkspaceQueries = new WeakMap<Database, ReturnType<typeof prepareMemberWorkspace>>();

/**
 * The workspace with this slug and the user's role in it, in one prepared query (every workspace
 * request makes it; remembered for a few seconds, see memberMemo): null when there is no such
 * workspace or the user is not a member of it.
 */
export async function findMemberWorkspace(db: Database, slug: string, userId: string): Promise<{ workspace: WorkspaceDto; role: Role } | null> {
  const remembered = memberMemo.get(userId, slug);
  if (remembered) return remembered;
  let query = memberWorkspaceQueries.get(db);
  if (!query) {
    query = prepareMemberWorkspace(db);
    memberWorkspaceQueries.set(db, query);
  }
  const rows = await query.execute({ slug, userId });
  const found = rows[0] ?? null;
  if (found) memberMemo.set(userId, slug, found);
  return found;
}

/** Inserts a workspace unless its slug is taken; returns null when it is. */
export async function insertWorkspace(db: Database, values: { slug: string; name: string }): Promise<WorkspaceDto | null> {
  const rows = await db.insert(workspace).values(values).onConflictDoNothing({ target: workspace.slug }).returning(workspaceDtoColumns);
  forgetMemberships();
  return rows[0] ?? null;
}

/** The role of `userId` in the workspace, or null when not a member. */
export async function findRole(db: Database, workspaceId: string, userId: string): Promise<Role | null> {
  const rows = await db
    .select({ role: membership.role })
    .from(membership)
    .where(and(eq(membership.workspaceId, workspaceId), eq(membership.userId, userId)))
    .limit(1);
  return rows[0]?.role ?? null;
}

/** Adds a member; returns false (and changes nothing) when the user already is one. */
export async function insertMembership(db: Database, workspaceId: string, userId: string, role: Role): Promise<boolean> {
  const rows = await db
    .insert(membership)
    .values({ workspaceId, userId, role })
    .onConflictDoNothing({ target: [membership.workspaceId, membership.userId] })
    .returning({ userId: membership.userId });
  forgetMemberships();
  forgetWorkspaceDirectories();
  return rows.length > 0;
}

/** Every workspace the user belongs to, with the user's role, by workspace name. */
export async function listMembershipsOfUser(db: Database, userId: string): Promise<{ workspace: WorkspaceDto; role: Role }[]> {
  const rows = await db
    .select({ workspace: workspaceDtoColumns, role: membership.role })
    .from(membership)
    .innerJoin(workspace, eq(workspace.id, membership.workspaceId))
    .where(eq(membership.userId, userId))
    .orderBy(asc(workspace.name));
  return rows;
}

/** Members of a workspace with their roles, by name. */
export async function listMembers(db: Database, workspaceId: string): Promise<{ user: UserDto; role: Role }[]> {
  return db
    .select({ user: userDtoColumns, role: membership.role })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(eq(membership.workspaceId, workspaceId))
    .orderBy(asc(user.name));
}

/** How many plants a workspace's library holds. */
export async function countPlants(db: Database, workspaceId: string): Promise<number> {
  const rows = await db.select({ n: sql<number>`count(*)::int` }).from(plant).where(eq(plant.workspaceId, workspaceId));
  return rows[0]?.n ?? 0;
}
