import type PgBoss from "pg-boss";
import type { MailKind } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { mailRecipients } from "./mail-recipients.js";
import type { MailAttachment } from "./mail-message.js";
import { queueMail } from "./mail-queue.js";
import { renderMailOf, type MailTemplateData } from "./templates/mail-templates.js";

/** What notifyUsers needs: who, which kind, the template's data (its `link` is the mail's link). */
export interface NotifyUsersInput<K extends MailKind> {
  userIds: readonly string[];
  kind: K;
  data: MailTemplateData[K];
  workspaceSlug?: string;
  attachments?: MailAttachment[];
}

/**
 * Resolves the users who want this kind (mailRecipients), renders the kind's template and queues
 * one message per recipient (nobody sees the others' addresses). Returns how many were queued.
 * Never rejects for mail's sake: failures are logged and count as not queued.
 */
export async function notifyUsers<K extends MailKind>(db: Database, boss: PgBoss, input: NotifyUsersInput<K>): Promise<number> {
  try {
    const recipients = await mailRecipients(db, input.userIds, input.kind);
    if (recipients.length === 0) return 0;
    const rendered = renderMailOf(input.kind, input.data);
    const link = (input.data as { link: string }).link;
    let queued = 0;
    for (const recipient of recipients) {
      const id = await queueMail(boss, {
        to: [recipient.email],
        kind: input.kind,
        ...rendered,
        link,
        ...(input.workspaceSlug === undefined ? {} : { workspaceSlug: input.workspaceSlug }),
        ...(input.attachments === undefined ? {} : { attachments: input.attachments }),
      });
      if (id !== null) queued += 1;
    }
    return queued;
  } catch (error) {
    console.error(`[loopyard] ${input.kind} mail not queued: ${error instanceof Error ? error.message : String(error)}`);
    return 0;
  }
}
