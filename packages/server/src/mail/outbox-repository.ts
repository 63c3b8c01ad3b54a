import { readdir, readFile, stat } from "node:fs/promises";
import path from "node:path";
import type { AddressObject, ParsedMail } from "mailparser";
import { isMailKind, type OutboxMessageDto } from "@loopyard/core";
import { MAIL_HEADERS } from "./mail-message.js";

/** Newest messages the outbox reads from the sink's folder. */
export const OUTBOX_LIMIT = 500;
/** Shape of a sink file's id (its name without .eml; see sinkFileName). */
export const OUTBOX_ID = /^\d{8}T\d{9}Z-[0-9a-f]{8}$/;

/** A parsed sink message plus the workspace header the outbox filters on. */
export interface StoredMail extends OutboxMessageDto {
  workspaceSlug: string | null;
}

const parsed = new Map<string, { mtimeMs: number; mail: StoredMail }>();

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return list.flatMap((group) => group.value.flatMap((a) => (a.address ? [a.address] : (a.group ?? []).flatMap((g) => (g.address ? [g.address] : [])))));
}

function header(mail: ParsedMail, name: string): string | null {
  const value = mail.headers.get(name.toLowerCase());
  return typeof value === "string" && value !== "" ? value : null;
}

/** Reads one .eml file of the sink (parsed once per file version). */
async function readStoredMail(folder: string, id: string): Promise<StoredMail | null> {
  const file = path.join(folder, `${id}.eml`);
  let info;
  try {
    info = await stat(file);
  } catch {
    return null;
  }
  const cached = parsed.get(file);
  if (cached && cached.mtimeMs === info.mtimeMs) return cached.mail;
  // Loaded on the first outbox read, not at start-up.
  const { simpleParser } = await import("mailparser");
  const mail = await simpleParser(await readFile(file));
  const kind = header(mail, MAIL_HEADERS.kind);
  // The file name holds the receipt time: 20261205T221503123Z → 2026-12-05T22:15:03.123Z.
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})(\d{3})Z/.exec(id);
  const receivedAt = m ? `${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}.${m[7]}Z` : info.mtime.toISOString();
  const stored: StoredMail = {
    id,
    receivedAt,
    from: addresses(mail.from)[0] ?? "",
    to: addresses(mail.to),
    subject: mail.subject ?? "",
    kind: isMailKind(kind) ? kind : null,
    link: header(mail, MAIL_HEADERS.link),
    workspaceSlug: header(mail, MAIL_HEADERS.workspace),
    attachments: mail.attachments.map((a) => ({ filename: a.filename ?? "attachment", contentType: a.contentType, size: a.size })),
    text: mail.text ?? "",
    html: typeof mail.html === "string" ? mail.html : null,
  };
  parsed.set(file, { mtimeMs: info.mtimeMs, mail: stored });
  if (parsed.size > OUTBOX_LIMIT * 2) parsed.delete(parsed.keys().next().value as string);
  return stored;
}

/** The newest OUTBOX_LIMIT messages of the sink's folder, newest first ([] when the folder does not exist yet). */
export async function listStoredMail(folder: string): Promise<StoredMail[]> {
  let names: string[];
  try {
    names = await readdir(folder);
  } catch (error) {
    if ((error as { code?: string }).code === "ENOENT") return [];
    throw error;
  }
  const ids = names
    .filter((name) => name.endsWith(".eml"))
    .map((name) => name.slice(0, -4))
    .filter((id) => OUTBOX_ID.test(id))
    .sort()
    .reverse()
    .slice(0, OUTBOX_LIMIT);
  const result: StoredMail[] = [];
  for (const id of ids) {
    const mail = await readStoredMail(folder, id).catch(() => null);
    if (mail) result.push(mail);
  }
  return result;
}

/** One message by id, or null (an id of another shape never touches the file system). */
export async function findStoredMail(folder: string, id: string): Promise<StoredMail | null> {
  if (!OUTBOX_ID.test(id)) return null;
  return readStoredMail(folder, id).catch(() => null);
}
