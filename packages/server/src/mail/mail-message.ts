import { isMailKind, type MailKind } from "@loopyard/core";

/** A file attached to a mail, e.g. a decision record's PDF on the approval mail. */
export interface MailAttachment {
  /** File name the reader sees, e.g. "decision-ember-200.pdf". */
  filename: string;
  /** The bytes, or the bytes as a base64 string. */
  content: Buffer | Uint8Array | string;
  /** MIME type, e.g. "application/pdf". */
  contentType: string;
}

/** One outgoing message, as callers of queueMail build it (most often from a template). */
export interface MailMessage {
  /** Recipients' addresses (at least one); resolve user ids with mailRecipients first. */
  to: string[];
  kind: MailKind;
  subject: string;
  /** Plain-text part. */
  text: string;
  /** HTML part (its text escaped: build it with the templates or renderMail). */
  html: string;
  /** Absolute link into the app that the mail is about (config.publicUrl + page path). */
  link: string;
  /** Slug of the workspace the mail is about: its admins see it in their outbox (absent for account mails). */
  workspaceSlug?: string;
  attachments?: MailAttachment[];
}

/** A message as it travels through the queue: JSON only (attachments as base64). */
export interface MailJobData {
  to: string[];
  kind: MailKind;
  subject: string;
  text: string;
  html: string;
  link: string;
  workspaceSlug: string | null;
  attachments: { filename: string; contentBase64: string; contentType: string }[];
}

/** Headers every Loopyard mail carries, read back by the outbox. */
export const MAIL_HEADERS = {
  kind: "X-Loopyard-Kind",
  link: "X-Loopyard-Link",
  workspace: "X-Loopyard-Workspace",
} as const;

/** Loose address check (something@something.tld-ish, no spaces or angle brackets): enough to refuse typos early. */
const ADDRESS = /^[^\s@<>,;"]+@[^\s@<>,;"]+$/;

/**
 * Checks a message and turns it into queue data. Throws TypeError naming the field for a message no
 * mail server would take (no recipient, a malformed address, an unknown kind, an empty subject,
 * a link that is not absolute): those are programming mistakes, not conditions of the moment.
 */
export function toMailJobData(message: MailMessage): MailJobData {
  if (!Array.isArray(message.to) || message.to.length === 0) throw new TypeError("mail.to: give at least one address");
  for (const address of message.to) {
    if (typeof address !== "string" || !ADDRESS.test(address)) throw new TypeError(`mail.to: "${String(address)}" is not an e-mail address`);
  }
  if (!isMailKind(message.kind)) throw new TypeError(`mail.kind: "${String(message.kind)}" is not a mail kind`);
  if (typeof message.subject !== "string" || message.subject.trim() === "") throw new TypeError("mail.subject: give a subject");
  if (/[\r\n]/.test(message.subject)) throw new TypeError("mail.subject: a subject is one line");
  if (typeof message.text !== "string" || typeof message.html !== "string") throw new TypeError("mail.text and mail.html: give both parts");
  if (typeof message.link !== "string" || !URL.canParse(message.link)) throw new TypeError(`mail.link: "${String(message.link)}" is not an absolute URL`);
  const attachments = (message.attachments ?? []).map((attachment, i) => {
    if (!attachment.filename || /[\r\n/\\]/.test(attachment.filename)) throw new TypeError(`mail.attachments[${i}].filename: give a plain file name`);
    if (!attachment.contentType) throw new TypeError(`mail.attachments[${i}].contentType: give a MIME type`);
    const contentBase64 =
      typeof attachment.content === "string" ? attachment.content : Buffer.from(attachment.content).toString("base64");
    return { filename: attachment.filename, contentBase64, contentType: attachment.contentType };
  });
  return {
    to: [...new Set(message.to)],
    kind: message.kind,
    subject: message.subject,
    text: message.text,
    html: message.html,
    link: message.link,
    workspaceSlug: message.workspaceSlug ?? null,
    attachments,
  };
}
