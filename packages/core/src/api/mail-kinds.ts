import { z } from "zod";

/**
 * Every kind of mail Loopyard sends. Each outgoing message carries exactly one kind; people turn
 * kinds off one by one in their notification settings, except the account kinds.
 */
export const MAIL_KINDS = [
  "proposal-submitted",
  "decision-approved",
  "decision-returned",
  "decision-commented",
  "sweep-finished",
  "sweep-failed",
  "comparison-finished",
  "comparison-failed",
  "invitation",
  "password-reset",
  "email-verification",
] as const;

export type MailKind = (typeof MAIL_KINDS)[number];

/** Kinds about the account itself: always sent, never listed as something to turn off. */
export const ACCOUNT_MAIL_KINDS = ["invitation", "password-reset", "email-verification"] as const satisfies readonly MailKind[];

export type AccountMailKind = (typeof ACCOUNT_MAIL_KINDS)[number];

/** Kinds that carry a sign-in secret (a reset or verification link): never shown in a workspace's outbox. */
export const SECRET_MAIL_KINDS = ["password-reset", "email-verification"] as const satisfies readonly MailKind[];

/** Whether `kind` is an account kind (cannot be turned off). */
export function isAccountMailKind(kind: MailKind): kind is AccountMailKind {
  return (ACCOUNT_MAIL_KINDS as readonly MailKind[]).includes(kind);
}

/** Whether `value` names a mail kind. */
export function isMailKind(value: unknown): value is MailKind {
  return typeof value === "string" && (MAIL_KINDS as readonly string[]).includes(value);
}

/** What the settings page shows for each kind: a short label and when it is sent. */
export const MAIL_KIND_LABELS: Record<MailKind, { label: string; when: string }> = {
  "proposal-submitted": { label: "New proposal", when: "an engineer proposes a design you can approve" },
  "decision-approved": { label: "Proposal approved", when: "a lead approves your proposal" },
  "decision-returned": { label: "Proposal returned", when: "a lead returns your proposal with a comment" },
  "decision-commented": { label: "Comment on a proposal", when: "someone comments on a proposal you take part in" },
  "sweep-finished": { label: "Sweep finished", when: "a sweep you started has finished" },
  "sweep-failed": { label: "Sweep failed", when: "a sweep you started has failed" },
  "comparison-finished": { label: "Comparison finished", when: "a comparison you started has finished" },
  "comparison-failed": { label: "Comparison failed", when: "a comparison you started has failed" },
  invitation: { label: "Invitation", when: "someone invites you to a workspace" },
  "password-reset": { label: "Password reset", when: "you ask to reset your password" },
  "email-verification": { label: "Address check", when: "you sign up or change your address" },
};

const mailKindSchema = z.enum(MAIL_KINDS, { error: () => `choose one of: ${MAIL_KINDS.join(", ")}` });

/**
 * Body of `PUT /api/me/notifications`: the kinds to change, each on or off; kinds left out keep
 * their setting. Account kinds are refused (they cannot be turned off).
 */
export const notificationSettingsInputSchema = z
  .object({
    settings: z
      .array(z.object({ kind: mailKindSchema, enabled: z.boolean({ error: () => "enabled must be true or false" }) }).strict())
      .min(1, "list at least one kind to change")
      .max(MAIL_KINDS.length * 2, `list each kind at most once (${MAIL_KINDS.length} kinds)`),
  })
  .strict();

export type NotificationSettingsInput = z.infer<typeof notificationSettingsInputSchema>;

/** One row of `GET /api/me/notifications`. */
export interface NotificationSettingDto {
  kind: MailKind;
  label: string;
  when: string;
  enabled: boolean;
  /** True for account kinds: always on. */
  locked: boolean;
}

/** `GET /api/me/notifications`. */
export interface NotificationSettingsDto {
  email: string;
  settings: NotificationSettingDto[];
}

/** One message in `GET /api/workspaces/:slug/outbox`. */
export interface OutboxMessageSummaryDto {
  /** The .eml file's name without extension: the id of `GET …/outbox/:id`. */
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  kind: MailKind | null;
  link: string | null;
  attachments: { filename: string; contentType: string; size: number }[];
}

/** `GET /api/workspaces/:slug/outbox`. */
export interface OutboxDto {
  /** False when SMTP_URL sends mail to a real server: nothing arrives in the local sink then. */
  localSink: boolean;
  /** Where the sink writes its .eml files (null without a local sink). */
  folder: string | null;
  messages: OutboxMessageSummaryDto[];
}

/** `GET /api/workspaces/:slug/outbox/:id`: one message with its plain text and HTML parts. */
export interface OutboxMessageDto extends OutboxMessageSummaryDto {
  text: string;
  html: string | null;
}
