import { SECRET_MAIL_KINDS, type MailKind, type OutboxDto, type OutboxMessageDto } from "@loopyard/core";
import { notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import type { MailConfig } from "./mail-config.js";
import { findStoredMail, listStoredMail, type StoredMail } from "./outbox-repository.js";

/**
 * Whether a sink message belongs in this workspace's outbox: it is about the workspace (its
 * X-Loopyard-Workspace header) and carries no sign-in secret (password-reset and address-check
 * mails are never shown to an admin; they stay in the sink's folder).
 */
export function belongsToOutbox(mail: Pick<StoredMail, "workspaceSlug" | "kind">, slug: string): boolean {
  if (mail.workspaceSlug !== slug) return false;
  return mail.kind === null || !(SECRET_MAIL_KINDS as readonly MailKind[]).includes(mail.kind);
}

function summary(mail: StoredMail) {
  const { text: _text, html: _html, workspaceSlug: _slug, ...rest } = mail;
  return rest;
}

/** The outbox of a workspace (admins only; the route checks the role): what the local sink received about it, newest first. */
export async function listOutbox(access: MemberAccess, mail: MailConfig | null): Promise<OutboxDto> {
  const folder = mail?.sink?.folder ?? null;
  if (!folder) return { localSink: false, folder: null, messages: [] };
  const messages = (await listStoredMail(folder)).filter((m) => belongsToOutbox(m, access.workspace.slug)).map(summary);
  return { localSink: true, folder, messages };
}

/** One message of the outbox with its text and HTML parts; 404 when it is not this workspace's. */
export async function getOutboxMessage(access: MemberAccess, mail: MailConfig | null, id: string): Promise<OutboxMessageDto> {
  const folder = mail?.sink?.folder ?? null;
  const found = folder ? await findStoredMail(folder, id) : null;
  if (!found || !belongsToOutbox(found, access.workspace.slug)) {
    throw notFound(`There is no message “${id}” in the outbox of ${access.workspace.name}; it may have been deleted from the sink's folder.`);
  }
  const { workspaceSlug: _slug, ...dto } = found;
  return dto;
}
