import type { Role } from "@loopyard/core";
import type { MailMessage } from "../mail/mail-message.js";
import { renderMail } from "../mail/templates/mail-layout.js";
import { emailVerificationMail, invitationMail as renderInvitation, passwordResetMail as renderPasswordReset } from "../mail/templates/account-mails.js";

/** A mail about someone's account or an invitation: a mail-queue message of an account kind. */
export type AccountMailMessage = MailMessage & { kind: "invitation" | "password-reset" | "email-verification" };

/** Puts a mail on the queue (never rejects for the queue's sake: a failure is logged there). */
export type SendAccountMail = (message: AccountMailMessage) => Promise<void>;

/** Page links carry their secret after "#": the fragment never reaches a server, so no log line holds it. */
export function pageLinkWithSecret(publicUrl: string, page: string, secret: string): string {
  return `${publicUrl.replace(/\/+$/, "")}/${page}#${secret}`;
}

/** "2026-12-12 22:17 UTC" */
export function formatUtc(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** The invitation mail: who invites, to which workspace, with which role, and the single-use link. */
export function invitationMail(input: { to: string; workspace: { slug: string; name: string }; role: Role; inviterName: string; link: string; expiresAt: Date }): AccountMailMessage {
  const rendered = renderInvitation({ workspaceName: input.workspace.name, inviterName: input.inviterName, role: input.role, link: input.link, expiresAt: formatUtc(input.expiresAt) });
  return { ...rendered, to: [input.to], kind: "invitation", link: input.link, workspaceSlug: input.workspace.slug };
}

/** The password-reset mail (better-auth's reset flow). */
export function passwordResetMail(input: { to: string; name: string; link: string; expiresInMinutes: number }): AccountMailMessage {
  const rendered = renderPasswordReset({ name: input.name, link: input.link, expiresInMinutes: input.expiresInMinutes });
  return { ...rendered, to: [input.to], kind: "password-reset", link: input.link };
}

/** The address-check mail sent on sign-up (better-auth's verification flow). */
export function verificationMail(input: { to: string; name: string; link: string }): AccountMailMessage {
  const rendered = emailVerificationMail({ name: input.name, link: input.link });
  return { ...rendered, to: [input.to], kind: "email-verification", link: input.link };
}

/**
 * Sent instead of an address check when someone signs up with an address that has an account
 * already: the sign-up answers exactly as for a fresh address, and only the mailbox's owner learns.
 */
export function existingAccountMail(input: { to: string; name: string; signInLink: string; resetLink: string }): AccountMailMessage {
  const rendered = renderMail(
    "Someone tried to sign up with your address on Loopyard",
    {
      heading: `Hello ${input.name}, someone tried to create a Loopyard account with this address, which already has one.`,
      blocks: [
        { paragraph: "If that was you, sign in with your password. Forgot it? Ask for a new one from the sign-in page:" },
        { paragraph: input.resetLink },
        { paragraph: "If it was not you, ignore this mail: nothing was changed." },
      ],
      action: { label: "Sign in", href: input.signInLink },
    },
    { accountMail: true },
  );
  return { ...rendered, to: [input.to], kind: "email-verification", link: input.signInLink };
}
