import { INVITATION_LIFETIME_DAYS, type Role } from "@loopyard/core";

/** A mail about someone's account or an invitation, in the shape the mail queue takes. */
export interface AccountMailMessage {
  to: string[];
  kind: "invitation" | "password-reset" | "email-verification";
  subject: string;
  text: string;
  html: string;
  /** The absolute link the mail is about. */
  link: string;
  /** The workspace the mail is about (its admins see invitations in their outbox). */
  workspaceSlug?: string;
}

/** Puts a mail on the queue (never throws for the queue's sake: a failure is logged there). */
export type SendAccountMail = (message: AccountMailMessage) => Promise<void>;

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c);
}

/** Plain paragraphs and one link as both parts of a mail. */
function mailBody(paragraphs: string[], link: { label: string; url: string }, after: string[]): { text: string; html: string } {
  const text = [...paragraphs, `${link.label}: ${link.url}`, ...after].join("\n\n") + "\n";
  const html = [
    ...paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`,
    ...after.map((p) => `<p style="color:#555">${escapeHtml(p)}</p>`),
  ].join("\n");
  return { text, html: `<!doctype html><html><body>${html}</body></html>` };
}

/** Page links carry their secret after "#": the fragment never reaches a server, so no log line holds it. */
export function pageLinkWithSecret(publicUrl: string, page: string, secret: string): string {
  return `${publicUrl.replace(/\/+$/, "")}/${page}#${secret}`;
}

/** The invitation mail: who invites, to which workspace, with which role, and the single-use link. */
export function invitationMail(input: {
  to: string;
  workspace: { slug: string; name: string };
  role: Role;
  inviterName: string;
  link: string;
  expiresAt: Date;
}): AccountMailMessage {
  const { text, html } = mailBody(
    [
      `${input.inviterName} invites you to the Loopyard workspace “${input.workspace.name}” as ${input.role === "admin" || input.role === "engineer" ? "an" : "a"} ${input.role}.`,
      `Open the link below, sign in — or create an account with this address, ${input.to} — and accept or decline the invitation. Nobody is added to the workspace until they accept.`,
    ],
    { label: "Open the invitation", url: input.link },
    [
      `The link works once and until ${formatUtc(input.expiresAt)} (${INVITATION_LIFETIME_DAYS} days); only an account with the address ${input.to} can accept it.`,
      "If you did not expect this mail, ignore it: nothing happens unless you accept.",
    ],
  );
  return { to: [input.to], kind: "invitation", subject: `Invitation to ${input.workspace.name} on Loopyard`, text, html, link: input.link, workspaceSlug: input.workspace.slug };
}

/** The password-reset mail (better-auth's reset flow; its token expires after `expiresInMinutes`). */
export function passwordResetMail(input: { to: string; name: string; link: string; expiresInMinutes: number }): AccountMailMessage {
  const { text, html } = mailBody(
    [`Hello ${input.name},`, "someone — hopefully you — asked to reset the password of your Loopyard account. Open the link below and choose a new password."],
    { label: "Choose a new password", url: input.link },
    [
      `The link works once and for ${input.expiresInMinutes} minutes. Choosing a new password signs you out everywhere else.`,
      "If you did not ask for this, ignore this mail: your password stays as it is.",
    ],
  );
  return { to: [input.to], kind: "password-reset", subject: "Reset your Loopyard password", text, html, link: input.link };
}

/** The address-check mail sent on sign-up. */
export function verificationMail(input: { to: string; name: string; link: string; expiresInHours: number }): AccountMailMessage {
  const { text, html } = mailBody(
    [`Hello ${input.name},`, "please confirm that this address belongs to your new Loopyard account by opening the link below."],
    { label: "Confirm my address", url: input.link },
    [`The link works for ${input.expiresInHours} hours.`, "If you did not create an account, ignore this mail."],
  );
  return { to: [input.to], kind: "email-verification", subject: "Confirm your address for Loopyard", text, html, link: input.link };
}

/**
 * Sent instead of an address check when someone signs up with an address that has an account
 * already: the sign-up answers exactly as for a fresh address, and only the mailbox's owner learns.
 */
export function existingAccountMail(input: { to: string; name: string; signInLink: string; resetLink: string }): AccountMailMessage {
  const { text, html } = mailBody(
    [
      `Hello ${input.name},`,
      "someone tried to create a Loopyard account with this address, which already has one. If that was you, sign in with your password — or, if you forgot it, ask for a new one from the sign-in page.",
    ],
    { label: "Sign in", url: input.signInLink },
    [`Forgot the password? ${input.resetLink}`, "If it was not you, ignore this mail: nothing was changed."],
  );
  return { to: [input.to], kind: "email-verification", subject: "Someone tried to sign up with your address on Loopyard", text, html, link: input.signInLink };
}

/** "2026-12-12 22:17 UTC" */
export function formatUtc(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}
