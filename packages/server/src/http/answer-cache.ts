import { createHash } from "node:crypto";
import type { Request, Response } from "express";

/** A serialised answer kept in memory: its bytes, their media type and their entity tag. */
export interface CachedAnswer {
  body: Buffer;
  type: string;
  /** Strong entity tag: a digest of the bytes (RFC 9110 §8.8.3), so equal bytes have equal tags. */
  etag: string;
  /** When the answer stops being used [ms since epoch]; never when absent. */
  expires?: number;
}

/** The entity tag of some bytes: the first 128 bits of their SHA-256, base64url, quoted. */
export function entityTag(body: Buffer): string {
  return `"${createHash("sha256").update(body).digest("base64url").slice(0, 22)}"`;
}

/** Builds a CachedAnswer from bytes or text. */
export function cachedAnswer(body: Buffer | string, type: string): CachedAnswer {
  const bytes = typeof body === "string" ? Buffer.from(body) : body;
  return { body: bytes, type, etag: entityTag(bytes) };
}

/**
 * A least-recently-used map of serialised answers bounded by their total size in bytes (and by an
 * entry count): an answer larger than `maxEntryBytes` is not kept; adding one drops the least
 * recently used until the total fits. Map iteration order is insertion order, so a hit is moved to
 * the end by deleting and re-inserting it, and the first key is always the least recently used.
 */
export class AnswerCache {
  private readonly entries = new Map<string, CachedAnswer>();
  private bytes = 0;

  constructor(
    readonly maxBytes: number,
    readonly maxEntryBytes: number,
    readonly maxEntries = 10_000,
  ) {}

  get(key: string, now = Date.now()): CachedAnswer | undefined {
    const entry = this.entries.get(key);
    if (entry && entry.expires !== undefined && entry.expires <= now) {
      this.delete(key);
      return undefined;
    }
    if (entry) {
      this.entries.delete(key);
      this.entries.set(key, entry);
    }
    return entry;
  }

  set(key: string, answer: CachedAnswer): void {
    this.delete(key);
    if (answer.body.length > this.maxEntryBytes) return;
    this.entries.set(key, answer);
    this.bytes += answer.body.length;
    while (this.bytes > this.maxBytes || this.entries.size > this.maxEntries) {
      const oldest = this.entries.keys().next();
      if (oldest.done) break;
      this.delete(oldest.value);
    }
  }

  delete(key: string): void {
    const entry = this.entries.get(key);
    if (!entry) return;
    this.entries.delete(key);
    this.bytes -= entry.body.length;
  }

  /** Drops every entry whose key starts with `prefix`. */
  deletePrefix(prefix: string): void {
    for (const key of [...this.entries.keys()]) if (key.startsWith(prefix)) this.delete(key);
  }

  clear(): void {
    this.entries.clear();
    this.bytes = 0;
  }

  /** Total bytes held. */
  get size(): number {
    return this.bytes;
  }

  get count(): number {
    return this.entries.size;
  }
}

/**
 * Sends a kept answer with its ETag; a GET whose If-None-Match names that tag gets 304 Not
 * Modified without the body (Express compares them: req.fresh). `Cache-Control: private, no-cache`
 * lets the browser keep the bytes but ask again every time, so the session and the membership are
 * checked on every request before the 304.
 */
export function sendAnswer(req: Request, res: Response, answer: CachedAnswer): void {
  res.setHeader("Cache-Control", "private, no-cache");
  res.setHeader("ETag", answer.etag);
  res.type(answer.type);
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  res.send(answer.body);
}
