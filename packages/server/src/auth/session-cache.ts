import type { UserDto } from "@loopyard/core";

/** How long a looked-up session is trusted without asking the database again [ms]. */
export const SESSION_CACHE_TTL_MS = 5_000;
/** Most sessions held (the oldest go first). */
export const SESSION_CACHE_MAX_ENTRIES = 10_000;

interface Entry {
  user: UserDto;
  sessionId: string;
  /** When the entry stops being trusted: the sooner of now + TTL and the session's expiry [ms since epoch]. */
  until: number;
}

/**
 * A short-lived, bounded, in-process memory of session lookups, keyed by the session cookie's value,
 * so that a page's burst of API calls costs one session query instead of one each. An entry lives
 * SESSION_CACHE_TTL_MS at most and never past the session's expiry; signing out, revoking a session
 * or changing the account through /api/auth forgets every entry of that user at once (see
 * forgetUser), so revocation is immediate in this process.
 */
export class SessionCache {
  private readonly entries = new Map<string, Entry>();

  constructor(private readonly ttlMs = SESSION_CACHE_TTL_MS, private readonly maxEntries = SESSION_CACHE_MAX_ENTRIES) {}

  get(token: string, now = Date.now()): Entry | null {
    const entry = this.entries.get(token);
    if (!entry) return null;
    if (entry.until <= now) {
      this.entries.delete(token);
      return null;
    }
    return entry;
  }

  set(token: string, value: { user: UserDto; sessionId: string; expiresAt: Date }, now = Date.now()): void {
    if (this.entries.size >= this.maxEntries) {
      const oldest = this.entries.keys().next();
      if (!oldest.done) this.entries.delete(oldest.value);
    }
    this.entries.set(token, { user: value.user, sessionId: value.sessionId, until: Math.min(now + this.ttlMs, value.expiresAt.getTime()) });
  }

  /** Forgets every entry of `userId` (after a sign-out, a revocation, a change of name or password). */
  forgetUser(userId: string): void {
    for (const [token, entry] of this.entries) if (entry.user.id === userId) this.entries.delete(token);
  }

  /** The user whose session this cookie value is, if it is remembered. */
  userOf(token: string): string | null {
    return this.entries.get(token)?.user.id ?? null;
  }
}

/** The session cookie of better-auth with Loopyard's prefix (with __Secure- over https). */
const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?loopyard\.session_token=([^;]*)/;

/** The value of the session cookie in a Cookie header, or null. */
export function sessionCookieValue(cookieHeader: string | undefined): string | null {
  const match = cookieHeader ? SESSION_COOKIE.exec(cookieHeader) : null;
  return match?.[1] ? match[1] : null;
}

/** Tests whether a Cookie header carries a session cookie. */
export const SESSION_COOKIE_PATTERN = /(?:^|;\s*)(?:__Secure-)?loopyard\.session_token=/;
