import type { SessionDto, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { notFound } from "../http/http-error.js";
import type { SessionCache } from "../auth/session-cache.js";
import { deleteSession, listLiveSessions } from "./session-repository.js";

export const SESSION_NOT_FOUND = "You have no such session; it may have ended already.";

/** The signed-in user's live sessions, the one in use marked `current`. */
export async function listMySessions(db: Database, user: UserDto, currentSessionId: string | undefined): Promise<SessionDto[]> {
  const rows = await listLiveSessions(db, user.id);
  return rows.map((row) => ({
    id: row.id,
    createdAt: row.createdAt.toISOString(),
    lastSeenAt: row.updatedAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    ipAddress: row.ipAddress,
    userAgent: row.userAgent,
    current: row.id === currentSessionId,
  }));
}

/** Ends one of the user's sessions (signs that browser out at once); 404 when it is not theirs. */
export async function revokeMySession(db: Database, cache: SessionCache, user: UserDto, sessionId: string): Promise<void> {
  if (!(await deleteSession(db, user.id, sessionId))) throw notFound(SESSION_NOT_FOUND);
  cache.forgetUser(user.id);
}
