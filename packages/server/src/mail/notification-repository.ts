import { and, eq, inArray } from "drizzle-orm";
import type { MailKind } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { notificationSetting, user } from "../db/schema.js";

/** The kinds this person turned off or on explicitly (kinds without a row are on). */
export async function findNotificationSettings(db: Database, userId: string): Promise<Map<string, boolean>> {
  const rows = await db
    .select({ kind: notificationSetting.kind, enabled: notificationSetting.enabled })
    .from(notificationSetting)
    .where(eq(notificationSetting.userId, userId));
  return new Map(rows.map((row) => [row.kind, row.enabled]));
}

/** Stores each (kind, enabled) for this person, replacing what was there. */
export async function saveNotificationSettings(db: Database, userId: string, settings: readonly { kind: MailKind; enabled: boolean }[]): Promise<void> {
  if (settings.length === 0) return;
  const now = new Date();
  for (const setting of settings) {
    await db
      .insert(notificationSetting)
      .values({ userId, kind: setting.kind, enabled: setting.enabled, updatedAt: now })
      .onConflictDoUpdate({ target: [notificationSetting.userId, notificationSetting.kind], set: { enabled: setting.enabled, updatedAt: now } });
  }
}

/** A person a mail can go to. */
export interface MailRecipient {
  userId: string;
  name: string;
  email: string;
}

/** These users (unknown ids left out) with whether each turned `kind` off. */
export async function findRecipientCandidates(
  db: Database,
  userIds: readonly string[],
  kind: MailKind,
): Promise<(MailRecipient & { turnedOff: boolean })[]> {
  const unique = [...new Set(userIds)];
  if (unique.length === 0) return [];
  const rows = await db
    .select({ userId: user.id, name: user.name, email: user.email, enabled: notificationSetting.enabled })
    .from(user)
    .leftJoin(notificationSetting, and(eq(notificationSetting.userId, user.id), eq(notificationSetting.kind, kind)))
    .where(inArray(user.id, unique));
  return rows.map((row) => ({ userId: row.userId, name: row.name, email: row.email, turnedOff: row.enabled === false }));
}
