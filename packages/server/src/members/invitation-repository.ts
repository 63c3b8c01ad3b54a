import { and, asc, eq, sql } from "drizzle-orm";
import type { InvitationDto, Role } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { invitation, user, workspace } from "../db/schema.js";

/** An invitation row as the services use it. */
export interface InvitationRecord {
  id: string;
  workspaceId: string;
  email: string;
  role: Role;
  status: "pending" | "accepted" | "declined" | "revoked";
  invitedBy: string | null;
  createdAt: Date;
  sentAt: Date;
  sendCount: number;
  expiresAt: Date;
  respondedAt: Date | null;
}

const recordColumns = {
  id: invitation.id,
  workspaceId: invitation.workspaceId,
  email: invitation.email,
  role: invitation.role,
  status: invitation.status,
  invitedBy: invitation.invitedBy,
  createdAt: invitation.createdAt,
  sentAt: invitation.sentAt,
  sendCount: invitation.sendCount,
  expiresAt: invitation.expiresAt,
  respondedAt: invitation.respondedAt,
};

/**
 * Inserts a pending invitation; returns null (and inserts nothing) when the address already has a
 * pending one in this workspace (the partial unique index invitation_pending_unique).
 */
export async function insertInvitation(
  db: Database,
  values: { workspaceId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date; sentAt: Date },
): Promise<InvitationRecord | null> {
  const rows = await db
    .insert(invitation)
    .values({ ...values, createdAt: values.sentAt })
    .onConflictDoNothing({ target: [invitation.workspaceId, invitation.email], where: sql`${invitation.status} = 'pending'` })
    .returning(recordColumns);
  return rows[0] ?? null;
}

/** The pending invitation of this address in this workspace, or null. */
export async function findPendingInvitationByEmail(db: Database, workspaceId: string, email: string): Promise<InvitationRecord | null> {
  const rows = await db
    .select(recordColumns)
    .from(invitation)
    .where(and(eq(invitation.workspaceId, workspaceId), eq(invitation.email, email), eq(invitation.status, "pending")))
    .limit(1);
  return rows[0] ?? null;
}

/** How many invitations of the workspace are pending (expired ones included, until revoked). */
export async function countPendingInvitations(db: Database, workspaceId: string): Promise<number> {
  const rows = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(invitation)
    .where(and(eq(invitation.workspaceId, workspaceId), eq(invitation.status, "pending")));
  return rows[0]?.count ?? 0;
}

/** One invitation of this workspace by id, locked for the rest of the transaction; null when there is none. */
export async function lockInvitationById(tx: Database, workspaceId: string, id: string): Promise<InvitationRecord | null> {
  const rows = await tx
    .select(recordColumns)
    .from(invitation)
    .where(and(eq(invitation.workspaceId, workspaceId), eq(invitation.id, id)))
    .limit(1)
    .for("update");
  return rows[0] ?? null;
}

/**
 * The invitation whose token hashes to `tokenHash`, with its workspace and inviter's name, locked
 * for the rest of the transaction (so that one link is used once even when clicked twice at once).
 */
export async function lockInvitationByTokenHash(
  tx: Database,
  tokenHash: string,
): Promise<(InvitationRecord & { workspace: { id: string; slug: string; name: string }; inviterName: string | null }) | null> {
  const rows = await tx
    .select({ ...recordColumns, workspace: { id: workspace.id, slug: workspace.slug, name: workspace.name }, inviterName: user.name })
    .from(invitation)
    .innerJoin(workspace, eq(workspace.id, invitation.workspaceId))
    .leftJoin(user, eq(user.id, invitation.invitedBy))
    .where(eq(invitation.tokenHash, tokenHash))
    .limit(1)
    .for("update", { of: invitation });
  return rows[0] ?? null;
}

/** Gives a pending invitation a new token and a new expiry (a re-send: the older link stops working). */
export async function renewInvitationToken(db: Database, id: string, values: { tokenHash: string; sentAt: Date; expiresAt: Date }): Promise<InvitationRecord> {
  const rows = await db
    .update(invitation)
    .set({ ...values, sendCount: sql`${invitation.sendCount} + 1` })
    .where(eq(invitation.id, id))
    .returning(recordColumns);
  const row = rows[0];
  if (!row) throw new Error(`invitation ${id} vanished inside its transaction`);
  return row;
}

/** Ends a pending invitation: accepted, declined or revoked, when and by whom. */
export async function closeInvitation(
  db: Database,
  id: string,
  values: { status: "accepted" | "declined" | "revoked"; respondedAt: Date; respondedBy: string },
): Promise<void> {
  await db.update(invitation).set(values).where(eq(invitation.id, id));
}

/** The workspace's pending invitations (expired ones flagged), oldest first, with the inviter's name. */
export async function listPendingInvitations(db: Database, workspaceId: string, now: Date): Promise<InvitationDto[]> {
  const rows = await db
    .select({ ...recordColumns, inviterName: user.name, inviterEmail: user.email })
    .from(invitation)
    .leftJoin(user, eq(user.id, invitation.invitedBy))
    .where(and(eq(invitation.workspaceId, workspaceId), eq(invitation.status, "pending")))
    .orderBy(asc(invitation.createdAt));
  return rows.map((row) => invitationDto(row, row.inviterName === null || row.inviterEmail === null ? null : { name: row.inviterName, email: row.inviterEmail }, now));
}

/** The DTO of an invitation (never its token). */
export function invitationDto(record: InvitationRecord, invitedBy: InvitationDto["invitedBy"], now: Date): InvitationDto {
  return {
    id: record.id,
    email: record.email,
    role: record.role,
    invitedBy,
    createdAt: record.createdAt.toISOString(),
    sentAt: record.sentAt.toISOString(),
    expiresAt: record.expiresAt.toISOString(),
    sendCount: record.sendCount,
    expired: record.expiresAt.getTime() <= now.getTime(),
  };
}
