import { isAccountMailKind, type MailKind } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRecipientCandidates, type MailRecipient } from "./notification-repository.js";

export type { MailRecipient } from "./notification-repository.js";

/**
 * The people among `userIds` who get a mail of this kind: unknown ids and people who turned the
 * kind off are dropped; account kinds (invitation, password reset, address check) reach everyone.
 * Order follows `userIds`, duplicates removed.
 */
export async function mailRecipients(db: Database, userIds: readonly string[], kind: MailKind): Promise<MailRecipient[]> {
  const candidates = await findRecipientCandidates(db, userIds, kind);
  const byId = new Map(candidates.map((c) => [c.userId, c]));
  const result: MailRecipient[] = [];
  for (const id of new Set(userIds)) {
    const candidate = byId.get(id);
    if (!candidate) continue;
    if (candidate.turnedOff && !isAccountMailKind(kind)) continue;
    result.push({ userId: candidate.userId, name: candidate.name, email: candidate.email });
  }
  return result;
}
