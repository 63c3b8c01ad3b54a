/**
 * Reading what the local mail sink received, for tests: each .eml in a folder parsed with
 * mailparser, looked up by recipient and kind (the X-Loopyard-Kind header every Loopyard mail carries).
 */
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import pg from "pg";

export interface ReceivedMail {
  file: string;
  to: string[];
  kind: string;
  subject: string;
  text: string;
  html: string;
  /** The X-Loopyard-Link header: the link the mail is about. */
  link: string;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((group) => group.value.map((entry) => (entry.address ?? "").toLowerCase()));
}

/** Every message in `folder`, oldest first (the sink names files by receipt time). */
export async function readInbox(folder: string): Promise<ReceivedMail[]> {
  let names: string[];
  try {
    names = (await readdir(folder)).filter((name) => name.endsWith(".eml")).sort();
  } catch {
    return [];
  }
  const mails: ReceivedMail[] = [];
  for (const file of names) {
    const parsed = await simpleParser(await readFile(path.join(folder, file)));
    mails.push({
      file,
      to: addresses(parsed.to),
      kind: String(parsed.headers.get("x-loopyard-kind") ?? ""),
      subject: parsed.subject ?? "",
      text: parsed.text ?? "",
      html: typeof parsed.html === "string" ? parsed.html : "",
      link: String(parsed.headers.get("x-loopyard-link") ?? ""),
    });
  }
  return mails;
}

/**
 * Waits until the sink holds a mail of `kind` to `to` that is not among `seen` files, and returns
 * the newest such mail (its file goes into `seen`).
 */
export async function waitForMail(folder: string, to: string, kind: string, seen: Set<string> = new Set(), timeoutMs = 45_000): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await readInbox(folder)).filter((mail) => mail.kind === kind && mail.to.includes(to.toLowerCase()) && !seen.has(mail.file));
    const newest = found.at(-1);
    if (newest) {
      seen.add(newest.file);
      return newest;
    }
    if (Date.now() > deadline) throw new Error(`no ${kind} mail to ${to} reached ${folder} within ${timeoutMs / 1000} s`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/** The secret after "#" of a mailed page link (Loopyard keeps link secrets out of request URLs). */
export function secretOf(link: string): string {
  const hash = new URL(link).hash;
  if (hash.length < 2) throw new Error(`the link ${link} carries no secret after #`);
  return decodeURIComponent(hash.slice(1));
}

/**
 * Drops the mail that earlier test files' servers queued and never sent (they run without a
 * sender), so that a server started with a sink sends only this file's mail and does not spend
 * minutes on a backlog first (the mail worker takes one message per poll).
 */
export async function dropQueuedMail(databaseUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    // The demo workspace's mails stay: the seed queued them and demo-seed.test.ts reads them.
    await client.query("delete from pgboss.job where name = 'mail-send' and state in ('created', 'retry') and coalesce(data->>'workspaceSlug', '') <> 'halvard-thermal'");
  } catch (error) {
    // No pg-boss schema yet: nothing was queued.
    if (!/does not exist/.test(String(error))) throw error;
  } finally {
    await client.end();
  }
}
