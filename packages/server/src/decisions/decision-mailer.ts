import type { WorkspaceDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import type { MailAttachment } from "../mail/mail-message.js";
import type { MailSystem } from "../mail/mail-system.js";
import { listMembers } from "../workspaces/workspace-repository.js";
import { listEvents } from "./decision-repository.js";
import { decisionPagePath, type DecisionNotice } from "./decision-notice.js";

/**
 * The record PDF attached to the approval mail: filename and bytes of a decision's record, or null
 * when there is none to attach. Wired to the deployment sheet's PDF renderer in app.ts
 * (decisionRecordPdfForMail); without it the approval mail goes without attachment.
 */
export type DecisionPdfForMail = (workspace: WorkspaceDto, decisionId: string) => Promise<MailAttachment | null>;

/**
 * Turns decision notices into mail through the mail queue (never blocking or failing the request:
 * notify resolves to how many messages were queued, and never rejects):
 * - proposed (and proposed again after a revision) → every lead of the workspace but the proposer;
 * - approved → the proposer, with the record's PDF attached when `recordPdf` gives one;
 * - returned → the proposer, with the lead's comment;
 * - commented → the proposer and everyone else who took part in the thread, but the author.
 * Each mail links to the decision's page (publicUrl + /w/:slug/decisions/:id).
 */
export function createDecisionMailer(db: Database, mail: Pick<MailSystem, "notify">, publicUrl: string, recordPdf: DecisionPdfForMail | null) {
  return async function send(notice: DecisionNotice): Promise<number> {
    const link = `${publicUrl.replace(/\/+$/, "")}${decisionPagePath(notice.workspace.slug, notice.decisionId)}`;
    const base = { workspaceName: notice.workspace.name, title: notice.title, link };
    const workspaceSlug = notice.workspace.slug;
    switch (notice.kind) {
      case "proposed": {
        const leads = (await listMembers(db, notice.workspace.id)).filter((m) => m.role === "lead" && m.user.id !== notice.proposer.id).map((m) => m.user.id);
        return mail.notify({
          userIds: leads,
          kind: "proposal-submitted",
          data: { ...base, proposerName: notice.proposer.name, familyName: notice.familyName, rationale: notice.rationale },
          workspaceSlug,
        });
      }
      case "approved": {
        const attachment = recordPdf ? await recordPdf(notice.workspace, notice.decisionId).catch(() => null) : null;
        return mail.notify({
          userIds: [notice.proposer.id],
          kind: "decision-approved",
          data: { ...base, leadName: notice.actor.name, ...(attachment ? { recordFilename: attachment.filename } : {}) },
          workspaceSlug,
          ...(attachment ? { attachments: [attachment] } : {}),
        });
      }
      case "returned":
        return mail.notify({ userIds: [notice.proposer.id], kind: "decision-returned", data: { ...base, leadName: notice.actor.name, comment: notice.comment ?? "" }, workspaceSlug });
      case "commented": {
        const thread = (await listEvents(db, notice.decisionId)).filter((e) => e.comment !== null).map((e) => e.actor.id);
        const userIds = [notice.proposer.id, ...thread].filter((id) => id !== notice.actor.id);
        return mail.notify({ userIds, kind: "decision-commented", data: { ...base, authorName: notice.actor.name, comment: notice.comment ?? "" }, workspaceSlug });
      }
    }
  };
}
