import { and, desc, eq, gt } from "drizzle-orm";
import type { Database } from "../db/database.js";
import { session } from "../db/schema.js";

/** A stored session without its token. */
export interface SessionRow {
  id: string;
  createdAt: Date;
  updatedAt: Date;
  expiresAt: Date;
  ipAddress: string | null;
  userAgent: string | null;
}

/** The user's sessions that have not expired, most recently used first. */
export async function listLiveSessions(db: Database, userId: string): Promise<SessionRow[]> {
  return db
    .select({
      id: session.id,
      createdAt: session.createdAt,
      updatedAt: session.updatedAt,
      expiresAt: session.expiresAt,
      ipAddress: session.ipAddress,
      userAgent: session.userAgent,
    })
    .from(session)
    .where(and(eq(session.userId, userId), gt(session.expiresAt, new Date())))
    .orderBy(desc(session.updatedAt));
}

/** Deletes one session of the user; false when the user has no such session. */
export async function deleteSession(db: Database, userId: string, sessionId: string): Promise<boolean> {
  const rows = await db.delete(session).where(and(eq(session.userId, userId), eq(session.id, sessionId))).returning({ id: session.id });
  return rows.length > 0;
}
