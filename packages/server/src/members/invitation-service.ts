import {
  INVITATION_LIFETIME_DAYS,
  type InvitationAcceptedDto,
  type InvitationDto,
  type InvitationInput,
  type InvitationPreviewDto,
  type UserDto,
} from "@loopyard/core";
import type { Database } from "../db/database.js";
import { HttpError, notFound } from "../http/http-error.js";
import { parseIdParam } from "../http/validation.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { afterMembershipWrite } from "./member-service.js";
import { insertMembership } from "../workspaces/workspace-repository.js";
import { formatUtc, invitationMail, pageLinkWithSecret, type SendAccountMail } from "./account-mail.js";
import { appendAuditEvent } from "./audit-repository.js";
import {
  closeInvitation,
  countPendingInvitations,
  findPendingInvitationByEmail,
  insertInvitation,
  invitationDto,
  listPendingInvitations,
  lockInvitationById,
  lockInvitationByTokenHash,
  renewInvitationToken,
  type InvitationRecord,
} from "./invitation-repository.js";
import { createInvitationToken, hashInvitationToken } from "./invitation-token.js";
import { findMemberByEmail, markEmailVerified } from "./member-repository.js";

/** Most pending invitations one workspace may hold (a bound on the mail an admin's account can send). */
export const MAX_PENDING_INVITATIONS = 100;

const DAY_MS = 24 * 60 * 60 * 1000;

/** What the invitation service needs besides the database. */
export interface InvitationDeps {
  sendMail: SendAccountMail;
  /** The address people open the app at; the invitation link starts with it. */
  publicUrl: string;
  /** The clock (tests move it). */
  now?: () => Date;
}

/** The web app's page that opens an invitation; the token follows after "#". */
export const INVITATION_PAGE = "invitation";

function article(role: string): string {
  return /^[aeiou]/.test(role) ? "an" : "a";
}

function expiryOf(now: Date): Date {
  return new Date(now.getTime() + INVITATION_LIFETIME_DAYS * DAY_MS);
}

async function mailInvitation(deps: InvitationDeps, access: MemberAccess, record: InvitationRecord, token: string): Promise<void> {
  await deps.sendMail(
    invitationMail({
      to: record.email,
      workspace: access.workspace,
      role: record.role,
      inviterName: access.user.name,
      link: pageLinkWithSecret(deps.publicUrl, INVITATION_PAGE, token),
      expiresAt: record.expiresAt,
    }),
  );
}

/**
 * POST /invitations: records a pending invitation (only the token's hash), writes the audit entry,
 * then queues the mail with the link. Refused when the address is a member already or has a
 * pending invitation; neither answer tells whether the address has an account.
 */
export async function inviteMember(db: Database, access: MemberAccess, input: InvitationInput, deps: InvitationDeps): Promise<InvitationDto> {
  const { workspace } = access;
  const now = deps.now?.() ?? new Date();
  const { token, tokenHash } = createInvitationToken();
  const record = await db.transaction(async (tx) => {
    const member = await findMemberByEmail(tx, workspace.id, input.email);
    if (member) {
      throw new HttpError(409, `${member.user.name} (${input.email}) is already ${article(member.role)} ${member.role} of ${workspace.name}; change their role in the member list instead.`, { field: "email" });
    }
    const pending = await findPendingInvitationByEmail(tx, workspace.id, input.email);
    if (pending) {
      throw new HttpError(409, `${input.email} already has a pending invitation (sent ${formatUtc(pending.sentAt)}); re-send it, or revoke it and invite again with another role.`, { field: "email" });
    }
    if ((await countPendingInvitations(tx, workspace.id)) >= MAX_PENDING_INVITATIONS) {
      throw new HttpError(409, `${workspace.name} has ${MAX_PENDING_INVITATIONS} pending invitations, the most it may hold; revoke the ones nobody will answer, then invite again.`);
    }
    const inserted = await insertInvitation(tx, { workspaceId: workspace.id, email: input.email, role: input.role, tokenHash, invitedBy: access.user.id, expiresAt: expiryOf(now), sentAt: now });
    if (!inserted) throw new HttpError(409, `${input.email} was invited a moment ago by another admin; reload the list.`, { field: "email" });
    await appendAuditEvent(tx, { workspaceId: workspace.id, action: "invitation-sent", actor: access.user, subject: { name: null, email: input.email }, role: input.role });
    return inserted;
  });
  await mailInvitation(deps, access, record, token);
  return invitationDto(record, { name: access.user.name, email: access.user.email }, now);
}

/** GET /invitations: the pending invitations, expired ones flagged. */
export async function listInvitations(db: Database, access: MemberAccess, deps: Pick<InvitationDeps, "now">): Promise<InvitationDto[]> {
  return listPendingInvitations(db, access.workspace.id, deps.now?.() ?? new Date());
}

function noSuchInvitation(workspaceName: string): HttpError {
  return notFound(`There is no such invitation in ${workspaceName}; reload the Members page to see the pending ones.`);
}

/** The sentence for an invitation that is no longer pending, for the admin who tries to change it. */
function notPendingForAdmin(record: InvitationRecord): HttpError {
  const when = record.respondedAt ? ` on ${formatUtc(record.respondedAt)}` : "";
  return new HttpError(409, `The invitation to ${record.email} was ${record.status}${when}, so it can no longer be changed; invite the address again if needed.`);
}

async function lockPendingForAdmin(tx: Database, access: MemberAccess, invitationId: string): Promise<InvitationRecord> {
  const id = parseIdParam(invitationId, noSuchInvitation(access.workspace.name).message);
  const record = await lockInvitationById(tx, access.workspace.id, id);
  if (!record) throw noSuchInvitation(access.workspace.name);
  if (record.status !== "pending") throw notPendingForAdmin(record);
  return record;
}

/** POST /invitations/:id/resend: a new token and a new 7-day expiry, mailed again; the older link stops working. */
export async function resendInvitation(db: Database, access: MemberAccess, invitationId: string, deps: InvitationDeps): Promise<InvitationDto> {
  const now = deps.now?.() ?? new Date();
  const { token, tokenHash } = createInvitationToken();
  const record = await db.transaction(async (tx) => {
    const pending = await lockPendingForAdmin(tx, access, invitationId);
    const renewed = await renewInvitationToken(tx, pending.id, { tokenHash, sentAt: now, expiresAt: expiryOf(now) });
    await appendAuditEvent(tx, { workspaceId: access.workspace.id, action: "invitation-resent", actor: access.user, subject: { name: null, email: renewed.email }, role: renewed.role });
    return renewed;
  });
  await mailInvitation(deps, access, record, token);
  return invitationDto(record, { name: access.user.name, email: access.user.email }, now);
}

/** POST /invitations/:id/revoke: the link stops working at once. */
export async function revokeInvitation(db: Database, access: MemberAccess, invitationId: string, deps: Pick<InvitationDeps, "now">): Promise<void> {
  const now = deps.now?.() ?? new Date();
  await db.transaction(async (tx) => {
    const pending = await lockPendingForAdmin(tx, access, invitationId);
    await closeInvitation(tx, pending.id, { status: "revoked", respondedAt: now, respondedBy: access.user.id });
    await appendAuditEvent(tx, { workspaceId: access.workspace.id, action: "invitation-revoked", actor: access.user, subject: { name: null, email: pending.email }, role: pending.role });
  });
}

type LockedInvitation = NonNullable<Awaited<ReturnType<typeof lockInvitationByTokenHash>>>;

/**
 * The invitation of a link's token, checked for the signed-in user: 404 for a token no invitation
 * has, 410 for one that was used, revoked or has expired, 403 for an account with another address —
 * each with a sentence saying what to do.
 */
async function lockUsableInvitation(tx: Database, user: UserDto, token: string, now: Date): Promise<LockedInvitation> {
  const record = await lockInvitationByTokenHash(tx, hashInvitationToken(token));
  if (!record) {
    throw notFound("This invitation link is not valid: no invitation has this token. Copy the whole link from the newest invitation mail (a re-sent invitation replaces the older link).");
  }
  // The address first: someone signed in with another account learns nothing of the workspace.
  if (record.email !== user.email.toLowerCase()) {
    throw new HttpError(403, `This invitation was sent to ${record.email}, and you are signed in as ${user.email}. Sign out, then sign in — or create an account — with ${record.email} to answer it.`);
  }
  const where = record.workspace.name;
  const on = record.respondedAt ? ` on ${formatUtc(record.respondedAt)}` : "";
  switch (record.status) {
    case "accepted":
      throw new HttpError(410, `This invitation to ${where} was already accepted${on}; each invitation link works once. Open the workspace from your list of workspaces, or ask one of its admins for a new invitation.`);
    case "declined":
      throw new HttpError(410, `This invitation to ${where} was declined${on}; each invitation link works once. Ask one of its admins to invite you again.`);
    case "revoked":
      throw new HttpError(410, `An admin of ${where} revoked this invitation${on}; ask one of its admins to invite you again if you should join.`);
    case "pending":
      break;
  }
  if (record.expiresAt.getTime() <= now.getTime()) {
    throw new HttpError(410, `This invitation to ${where} expired on ${formatUtc(record.expiresAt)} (invitations work for ${INVITATION_LIFETIME_DAYS} days); ask one of its admins to re-send it.`);
  }
  return record;
}

/** POST /api/invitations/preview: what the link offers, for the invited account only. */
export async function previewInvitation(db: Database, user: UserDto, token: string, deps: Pick<InvitationDeps, "now">): Promise<InvitationPreviewDto> {
  const now = deps.now?.() ?? new Date();
  return db.transaction(async (tx) => {
    const record = await lockUsableInvitation(tx, user, token, now);
    return {
      workspace: { slug: record.workspace.slug, name: record.workspace.name },
      role: record.role,
      email: record.email,
      invitedBy: record.inviterName,
      expiresAt: record.expiresAt.toISOString(),
    };
  });
}

/**
 * POST /api/invitations/accept: the signed-in invitee joins with the invited role, the link is used
 * up, and the address counts as checked (the token reached this mailbox).
 */
export async function acceptInvitation(db: Database, user: UserDto, token: string, deps: Pick<InvitationDeps, "now">): Promise<InvitationAcceptedDto> {
  const now = deps.now?.() ?? new Date();
  return afterMembershipWrite(db.transaction(async (tx) => {
    const record = await lockUsableInvitation(tx, user, token, now);
    const added = await insertMembership(tx, record.workspace.id, user.id, record.role);
    if (!added) {
      throw new HttpError(409, `You are already a member of ${record.workspace.name}; open it from your list of workspaces (an admin can change your role there).`);
    }
    await closeInvitation(tx, record.id, { status: "accepted", respondedAt: now, respondedBy: user.id });
    await markEmailVerified(tx, user.id);
    await appendAuditEvent(tx, { workspaceId: record.workspace.id, action: "invitation-accepted", actor: user, subject: { name: user.name, email: user.email }, role: record.role });
    return { workspace: record.workspace, role: record.role };
  }));
}

/** POST /api/invitations/decline: the link is used up and nobody is added. */
export async function declineInvitation(db: Database, user: UserDto, token: string, deps: Pick<InvitationDeps, "now">): Promise<void> {
  const now = deps.now?.() ?? new Date();
  await db.transaction(async (tx) => {
    const record = await lockUsableInvitation(tx, user, token, now);
    await closeInvitation(tx, record.id, { status: "declined", respondedAt: now, respondedBy: user.id });
    await appendAuditEvent(tx, { workspaceId: record.workspace.id, action: "invitation-declined", actor: user, subject: { name: user.name, email: user.email }, role: record.role });
  });
}
