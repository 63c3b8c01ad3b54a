/**
 * Shapes of the members, invitations and audit-trail answers of the HTTP API (server builds, web reads).
 */
import type { Role } from "./roles.js";
import type { UserDto, WorkspaceDto } from "./dto.js";

/** One member of a workspace (GET /api/workspaces/:slug/members). */
export interface MemberDto {
  user: UserDto;
  role: Role;
  /** ISO 8601: when they joined. */
  joinedAt: string;
}

/** GET /api/workspaces/:slug/members */
export interface MemberListDto {
  members: MemberDto[];
  /** How many admins the workspace has (the last one can be neither demoted nor removed). */
  adminCount: number;
}

/** One pending invitation, as its workspace's admins see it (never its token). */
export interface InvitationDto {
  id: string;
  email: string;
  role: Role;
  invitedBy: { name: string; email: string } | null;
  /** ISO 8601 times. */
  createdAt: string;
  sentAt: string;
  expiresAt: string;
  /** How often the link was mailed (1 + re-sends). */
  sendCount: number;
  /** True once expiresAt has passed: the link no longer works until an admin re-sends it. */
  expired: boolean;
}

/** POST /api/invitations/preview — what the invitee is offered, read with the token of the link. */
export interface InvitationPreviewDto {
  workspace: Pick<WorkspaceDto, "slug" | "name">;
  role: Role;
  /** The invited address (only an account with it may accept). */
  email: string;
  invitedBy: string | null;
  expiresAt: string;
}

/** Answer of POST /api/invitations/accept: the workspace joined and the role it gives. */
export interface InvitationAcceptedDto {
  workspace: WorkspaceDto;
  role: Role;
}

/** Kinds of entries in a workspace's audit trail. */
export type AuditAction =
  | "invitation-sent"
  | "invitation-resent"
  | "invitation-revoked"
  | "invitation-accepted"
  | "invitation-declined"
  | "role-changed"
  | "member-removed";

/** One entry of GET /api/workspaces/:slug/audit (newest first). */
export interface AuditEventDto {
  id: number;
  /** ISO 8601. */
  at: string;
  action: AuditAction;
  /** Who made the change (null when the change was made by no one signed in, e.g. the demo seed). */
  actor: { name: string; email: string } | null;
  /** Whom it is about: the invited address or the member. */
  subject: { name: string | null; email: string };
  role: Role | null;
  previousRole: Role | null;
}
