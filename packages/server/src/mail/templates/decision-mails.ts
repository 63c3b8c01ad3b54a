import { renderMail, type RenderedMail } from "./mail-layout.js";

/** The line every decision mail carries: a simulated design is not a validated one. */
export const DECISION_MAIL_CAUTION =
  "A design chosen in simulation does not replace validation on the real machine: try it there with its safety interlocks in place before it goes into firmware.";

export interface ProposalSubmittedData {
  workspaceName: string;
  proposerName: string;
  title: string;
  /** The family the design is proposed for (its name). */
  familyName?: string;
  rationale: string;
  link: string;
}

/** To the workspace's leads: an engineer proposed a design that waits for their approval. */
export function proposalSubmittedMail(data: ProposalSubmittedData): RenderedMail {
  return renderMail(`Proposal waiting: ${data.title}`, {
    heading: `${data.proposerName} proposed “${data.title}” in ${data.workspaceName}.`,
    blocks: [
      ...(data.familyName ? [{ facts: [["Family", data.familyName] as [string, string]] }] : []),
      { quote: data.rationale, by: data.proposerName },
      { paragraph: "It waits for a lead: approve it, or return it with a comment." },
    ],
    action: { label: "Review the proposal", href: data.link },
    note: DECISION_MAIL_CAUTION,
  });
}

export interface DecisionApprovedData {
  workspaceName: string;
  leadName: string;
  title: string;
  link: string;
  /** File name of the attached record, when the PDF goes with the mail. */
  recordFilename?: string;
}

/** To the proposer: a lead approved the proposal; it is now the family's decision. */
export function decisionApprovedMail(data: DecisionApprovedData): RenderedMail {
  return renderMail(`Approved: ${data.title}`, {
    heading: `${data.leadName} approved “${data.title}” in ${data.workspaceName}.`,
    blocks: [
      { paragraph: "It is now the family's decision, frozen as it stands; the previous decision stays readable as history." },
      ...(data.recordFilename ? [{ paragraph: `The decision record is attached (${data.recordFilename}).` }] : []),
    ],
    action: { label: "Open the decision", href: data.link },
    note: DECISION_MAIL_CAUTION,
  });
}

export interface DecisionReturnedData {
  workspaceName: string;
  leadName: string;
  title: string;
  comment: string;
  link: string;
}

/** To the proposer: a lead returned the proposal with a comment. */
export function decisionReturnedMail(data: DecisionReturnedData): RenderedMail {
  return renderMail(`Returned: ${data.title}`, {
    heading: `${data.leadName} returned “${data.title}” in ${data.workspaceName}.`,
    blocks: [{ quote: data.comment, by: data.leadName }, { paragraph: "Revise the proposal or answer in its thread." }],
    action: { label: "Open the proposal", href: data.link },
    note: DECISION_MAIL_CAUTION,
  });
}

export interface DecisionCommentedData {
  workspaceName: string;
  authorName: string;
  title: string;
  comment: string;
  link: string;
}

/** To the others in a proposal's thread: someone commented. */
export function decisionCommentedMail(data: DecisionCommentedData): RenderedMail {
  return renderMail(`New comment: ${data.title}`, {
    heading: `${data.authorName} commented on “${data.title}” in ${data.workspaceName}.`,
    blocks: [{ quote: data.comment, by: data.authorName }],
    action: { label: "Open the thread", href: data.link },
    note: DECISION_MAIL_CAUTION,
  });
}
