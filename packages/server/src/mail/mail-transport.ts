import nodemailer, { type Transporter } from "nodemailer";
import { MAIL_HEADERS, type MailJobData } from "./mail-message.js";

/** Sends one queued message; rejects when the SMTP server cannot be reached or refuses it. */
export type SendMail = (data: MailJobData) => Promise<void>;

/** Seconds to wait for the SMTP server to answer before the attempt fails (and is retried). */
const SMTP_TIMEOUT_MS = 15_000;

/**
 * A nodemailer SMTP transport to `smtpUrl` (smtp:// on loopback speaks plain SMTP; other hosts
 * upgrade with STARTTLS when offered), and the function that sends a queued message through it with
 * the Loopyard headers (kind, link, workspace) that the outbox reads back.
 */
export function createMailTransport(smtpUrl: string, from: string): { send: SendMail; close(): void } {
  const transporter: Transporter = nodemailer.createTransport({
    url: smtpUrl,
    connectionTimeout: SMTP_TIMEOUT_MS,
    greetingTimeout: SMTP_TIMEOUT_MS,
    socketTimeout: SMTP_TIMEOUT_MS,
  } as never);
  return {
    async send(data) {
      await transporter.sendMail({
        from,
        to: data.to,
        subject: data.subject,
        text: data.text,
        html: data.html,
        headers: {
          [MAIL_HEADERS.kind]: data.kind,
          [MAIL_HEADERS.link]: data.link,
          ...(data.workspaceSlug ? { [MAIL_HEADERS.workspace]: data.workspaceSlug } : {}),
        },
        attachments: data.attachments.map((a) => ({ filename: a.filename, content: a.contentBase64, encoding: "base64", contentType: a.contentType })),
      });
    },
    close() {
      transporter.close();
    },
  };
}
