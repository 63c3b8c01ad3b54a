import type { DeploymentSheetDto, WorkspaceDto } from "@loopyard/core";
import { decisionSheet, type SheetQuery } from "../deployment/sheet-service.js";
import { decisionRecordPdf } from "../exports/decision-record-pdf.js";
import type { MailAttachment } from "../mail/mail-message.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findDecision, listEvents } from "./decision-repository.js";
import { decisionRecord, eventDto, getDecision, getDecisionRecord, type DecisionDeps } from "./decision-service.js";

/** GET …/decisions/:id/sheet?sampleTime=&method=&format= — the deployment sheet of the design the decision's record holds, on the compute pool. */
export async function getDecisionSheet(deps: DecisionDeps, access: MemberAccess, decisionId: string, query: SheetQuery): Promise<DeploymentSheetDto> {
  return decisionSheet(deps.compute, await getDecisionRecord(deps, access, decisionId), query);
}

/** The file name of a decision's PDF: its title in lower-case words, e.g. decision-ember-line-tune-the-pid-by-itae.pdf. */
export function decisionPdfFilename(title: string): string {
  const words = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/g, "");
  return `decision-${words || "record"}.pdf`;
}

/** GET …/decisions/:id/record.pdf — the record with its curves (drawn on the compute pool) and its audit trail. */
export async function getDecisionPdf(deps: DecisionDeps, access: MemberAccess, decisionId: string): Promise<{ filename: string; pdf: Buffer }> {
  const detail = await getDecision(deps, access, decisionId);
  return { filename: decisionPdfFilename(detail.title), pdf: await decisionRecordPdf(deps.compute, detail.record, detail.events) };
}

/**
 * The record's PDF for the approval mail (DecisionPdfForMail): the same document as record.pdf.
 * Null when the decision is gone; a PDF that cannot be drawn rejects (the mail then goes without it).
 */
export function decisionPdfForMail(deps: Pick<DecisionDeps, "db" | "compute">) {
  return async (workspace: WorkspaceDto, decisionId: string): Promise<MailAttachment | null> => {
    const row = await findDecision(deps.db, workspace.id, decisionId);
    if (!row) return null;
    const audit = (await listEvents(deps.db, row.id)).map(eventDto);
    return { filename: decisionPdfFilename(row.title), content: await decisionRecordPdf(deps.compute, decisionRecord(row, workspace), audit), contentType: "application/pdf" };
  };
}
