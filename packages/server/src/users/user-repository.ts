import { eq, inArray } from "drizzle-orm";
import type { UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { user } from "../db/schema.js";

/** Columns of `user` that make a UserDto, for selects and joins. */
export const userDtoColumns = { id: user.id, name: user.name, email: user.email };

/** The user with this email (case-insensitive as better-auth stores it lower-cased), or null. */
export async function findUserByEmail(db: Database, email: string): Promise<UserDto | null> {
  const rows = await db.select(userDtoColumns).from(user).where(eq(user.email, email.trim().toLowerCase())).limit(1);
  return rows[0] ?? null;
}

/** Users by id, as a map; unknown ids are absent. */
export async function findUsersByIds(db: Database, ids: readonly string[]): Promise<Map<string, UserDto>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = await db.select(userDtoColumns).from(user).where(inArray(user.id, unique));
  return new Map(rows.map((row) => [row.id, row]));
}

/** Whether the user's address is confirmed (false for an unknown id). */
export async function isEmailVerified(db: Database, userId: string): Promise<boolean> {
  const rows = await db.select({ verified: user.emailVerified }).from(user).where(eq(user.id, userId)).limit(1);
  return rows[0]?.verified ?? false;
}
