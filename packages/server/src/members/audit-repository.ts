import { desc, eq } from "drizzle-orm";
import type { AuditAction, AuditEventDto, Role } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { workspaceAuditEvent } from "../db/schema.js";

/** One new entry of a workspace's audit trail; names and addresses are copied in as they are now. */
export interface AuditEntry {
  workspaceId: string;
  action: AuditAction;
  actor: { id: string; name: string; email: string } | null;
  subject: { name: string | null; email: string };
  role?: Role | null;
  previousRole?: Role | null;
}

/** Appends an entry (the trail is append-only: nothing in the app updates or deletes one). */
export async function appendAuditEvent(db: Database, entry: AuditEntry): Promise<void> {
  await db.insert(workspaceAuditEvent).values({
    workspaceId: entry.workspaceId,
    action: entry.action,
    actorId: entry.actor?.id ?? null,
    actorName: entry.actor?.name ?? null,
    actorEmail: entry.actor?.email ?? null,
    subjectEmail: entry.subject.email,
    subjectName: entry.subject.name,
    role: entry.role ?? null,
    previousRole: entry.previousRole ?? null,
  });
}

/** The newest `limit` entries of a workspace's trail, newest first. */
export async function listAuditEvents(db: Database, workspaceId: string, limit: number): Promise<AuditEventDto[]> {
  const rows = await db
    .select()
    .from(workspaceAuditEvent)
    .where(eq(workspaceAuditEvent.workspaceId, workspaceId))
    .orderBy(desc(workspaceAuditEvent.id))
    .limit(limit);
  return rows.map((row) => ({
    id: row.id,
    at: row.at.toISOString(),
    action: row.action,
    actor: row.actorEmail === null ? null : { name: row.actorName ?? row.actorEmail, email: row.actorEmail },
    subject: { name: row.subjectName, email: row.subjectEmail },
    role: row.role,
    previousRole: row.previousRole,
  }));
}
