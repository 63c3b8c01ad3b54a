import { renderMail, type RenderedMail } from "./mail-layout.js";

export interface InvitationData {
  workspaceName: string;
  inviterName: string;
  role: string;
  link: string;
  /** When the invitation stops working (ISO 8601 or a readable date). */
  expiresAt: string;
}

/** To an invited address: an offer to join a workspace with a role, single use, expiring. */
export function invitationMail(data: InvitationData): RenderedMail {
  return renderMail(
    `${data.inviterName} invites you to ${data.workspaceName} on Loopyard`,
    {
      heading: `${data.inviterName} invites you to join ${data.workspaceName} as ${/^[aeiou]/i.test(data.role) ? "an" : "a"} ${data.role}.`,
      blocks: [{ paragraph: `The invitation works once and until ${data.expiresAt}. Sign in or create an account with this address to accept it.` }],
      action: { label: "Accept the invitation", href: data.link },
    },
    { accountMail: true },
  );
}

export interface PasswordResetData {
  name: string;
  link: string;
  /** Minutes the link stays valid. */
  expiresInMinutes: number;
}

/** To the account's address: a link to choose a new password. */
export function passwordResetMail(data: PasswordResetData): RenderedMail {
  return renderMail(
    "Reset your Loopyard password",
    {
      heading: `Hello ${data.name}, someone asked to reset the password of your Loopyard account.`,
      blocks: [{ paragraph: `The link below works once, for ${data.expiresInMinutes} minutes. If you did not ask, ignore this mail; your password stays as it is.` }],
      action: { label: "Choose a new password", href: data.link },
    },
    { accountMail: true },
  );
}

export interface EmailVerificationData {
  name: string;
  link: string;
}

/** To a new or changed address: a link that proves it is yours. */
export function emailVerificationMail(data: EmailVerificationData): RenderedMail {
  return renderMail(
    "Confirm your address for Loopyard",
    {
      heading: `Hello ${data.name}, please confirm that this address is yours.`,
      blocks: [{ paragraph: "Open the link below to confirm it. If you did not sign up for Loopyard, ignore this mail." }],
      action: { label: "Confirm the address", href: data.link },
    },
    { accountMail: true },
  );
}
