import { z } from "zod";
import { ROLES } from "../api/roles.js";

/** How long an invitation's link works after it was mailed (or re-sent) [days]. */
export const INVITATION_LIFETIME_DAYS = 7;

/** Longest e-mail address (RFC 5321, 4.5.3.1: a path of at most 256 octets, 254 for the address). */
const MAX_EMAIL_LENGTH = 254;

const roleSchema = z.enum(ROLES, { error: `choose one of the roles ${ROLES.join(", ")}` });

/** POST /api/workspaces/:slug/invitations — the address is trimmed and lower-cased, as accounts store it. */
export const invitationInputSchema = z.object({
  email: z
    .string({ error: "give the e-mail address to send the invitation to" })
    .trim()
    .max(MAX_EMAIL_LENGTH, `an e-mail address has at most ${MAX_EMAIL_LENGTH} characters`)
    .pipe(z.email("give an e-mail address like name@company.example"))
    .transform((email) => email.toLowerCase()),
  role: roleSchema,
});

/** PATCH /api/workspaces/:slug/members/:userId */
export const memberRoleInputSchema = z.object({ role: roleSchema });

/**
 * Shape of an invitation token: 32 random bytes in base64url (43 characters). Checked before any
 * database look-up, so that a mangled link gets its own sentence.
 */
export const INVITATION_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** POST /api/invitations/preview | accept | decline — the token from the invitation link. */
export const invitationTokenInputSchema = z.object({
  token: z
    .string({ error: "give the token from the invitation link" })
    .regex(INVITATION_TOKEN_PATTERN, "this is not the token of an invitation link; copy the whole link from the mail"),
});

export type InvitationInput = z.output<typeof invitationInputSchema>;
export type MemberRoleInput = z.output<typeof memberRoleInputSchema>;
export type InvitationTokenInput = z.output<typeof invitationTokenInputSchema>;
