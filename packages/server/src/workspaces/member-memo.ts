import type { Role, WorkspaceDto } from "@loopyard/core";

/** How long a membership that was looked up is trusted without asking the database again [ms] (as long as a cached session). */
export const MEMBER_MEMO_TTL_MS = 5_000;
/** Most memberships remembered (the oldest go first). */
export const MEMBER_MEMO_MAX_ENTRIES = 10_000;

interface Entry {
  found: { workspace: WorkspaceDto; role: Role };
  until: number;
  generation: number;
}

const entries = new Map<string, Entry>();
/** Raised by every membership write of this process: an entry remembered before it is not used. */
let generation = 0;

const keyOf = (userId: string, slug: string) => `${userId}\u0000${slug}`;

/**
 * A short-lived, bounded, per-process memory of "user U is a member of workspace S with role R", so
 * that a page's burst of API calls costs one membership query instead of one each. Only memberships
 * are remembered, never their absence (someone just added is a member at once). Any membership
 * written in this process (forgetMemberships, called by the repository's writes) makes every entry
 * stale at once; a change made by another process shows within MEMBER_MEMO_TTL_MS, the bound the
 * session cache has too.
 */
export const memberMemo = {
  get(userId: string, slug: string, now = Date.now()): { workspace: WorkspaceDto; role: Role } | null {
    const key = keyOf(userId, slug);
    const entry = entries.get(key);
    if (!entry) return null;
    if (entry.until <= now || entry.generation !== generation) {
      entries.delete(key);
      return null;
    }
    return entry.found;
  },

  set(userId: string, slug: string, found: { workspace: WorkspaceDto; role: Role }, now = Date.now()): void {
    if (entries.size >= MEMBER_MEMO_MAX_ENTRIES) {
      const oldest = entries.keys().next();
      if (!oldest.done) entries.delete(oldest.value);
    }
    entries.set(keyOf(userId, slug), { found, until: now + MEMBER_MEMO_TTL_MS, generation });
  },

  /** How many entries are held (tests). */
  get size(): number {
    return entries.size;
  },
};

/** Forgets every remembered membership (after a membership or workspace is written in this process). */
export function forgetMemberships(): void {
  generation += 1;
  entries.clear();
}
