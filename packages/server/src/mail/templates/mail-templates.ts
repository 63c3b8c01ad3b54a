import type { MailKind } from "@loopyard/core";
import type { RenderedMail } from "./mail-layout.js";
import {
  decisionApprovedMail,
  decisionCommentedMail,
  decisionReturnedMail,
  proposalSubmittedMail,
  type DecisionApprovedData,
  type DecisionCommentedData,
  type DecisionReturnedData,
  type ProposalSubmittedData,
} from "./decision-mails.js";
import { comparisonFailedMail, comparisonFinishedMail, sweepFailedMail, sweepFinishedMail, type RunFailedData, type RunFinishedData } from "./run-mails.js";
import { emailVerificationMail, invitationMail, passwordResetMail, type EmailVerificationData, type InvitationData, type PasswordResetData } from "./account-mails.js";

/** The data each kind's template takes. */
export interface MailTemplateData {
  "proposal-submitted": ProposalSubmittedData;
  "decision-approved": DecisionApprovedData;
  "decision-returned": DecisionReturnedData;
  "decision-commented": DecisionCommentedData;
  "sweep-finished": RunFinishedData;
  "sweep-failed": RunFailedData;
  "comparison-finished": RunFinishedData;
  "comparison-failed": RunFailedData;
  invitation: InvitationData;
  "password-reset": PasswordResetData;
  "email-verification": EmailVerificationData;
}

/** One template per kind: a Record over MailKind, so a new kind does not compile without its template. */
export const MAIL_TEMPLATES: { [K in MailKind]: (data: MailTemplateData[K]) => RenderedMail } = {
  "proposal-submitted": proposalSubmittedMail,
  "decision-approved": decisionApprovedMail,
  "decision-returned": decisionReturnedMail,
  "decision-commented": decisionCommentedMail,
  "sweep-finished": sweepFinishedMail,
  "sweep-failed": sweepFailedMail,
  "comparison-finished": comparisonFinishedMail,
  "comparison-failed": comparisonFailedMail,
  invitation: invitationMail,
  "password-reset": passwordResetMail,
  "email-verification": emailVerificationMail,
};

/** Renders the mail of `kind` from its data. */
export function renderMailOf<K extends MailKind>(kind: K, data: MailTemplateData[K]): RenderedMail {
  return (MAIL_TEMPLATES[kind] as (data: MailTemplateData[K]) => RenderedMail)(data);
}
