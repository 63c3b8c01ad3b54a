import { describe, expect, it } from "vitest";
import { SessionCache, sessionCookieValue } from "../../src/auth/session-cache.js";

const user = { id: "u1", name: "Priya Raman", email: "priya@halvard.example" };

describe("SessionCache", () => {
  it("when an entry is older than its TTL or past the session's expiry, then it is gone", () => {
    const cache = new SessionCache(5_000, 10);
    cache.set("t1", { user, sessionId: "s1", expiresAt: new Date(1_000_000 + 60_000) }, 1_000_000);
    expect(cache.get("t1", 1_004_999)?.user).toEqual(user);
    expect(cache.get("t1", 1_005_000)).toBeNull();
    cache.set("t2", { user, sessionId: "s2", expiresAt: new Date(1_000_100) }, 1_000_000);
    expect(cache.get("t2", 1_000_100)).toBeNull();
  });

  it("when a user signs out or is revoked, then forgetUser drops every entry of theirs and no other", () => {
    const cache = new SessionCache(5_000, 10);
    const expiresAt = new Date(Date.now() + 60_000);
    cache.set("a", { user, sessionId: "s1", expiresAt });
    cache.set("b", { user, sessionId: "s2", expiresAt });
    cache.set("c", { user: { ...user, id: "u2" }, sessionId: "s3", expiresAt });
    cache.forgetUser("u1");
    expect([cache.get("a"), cache.get("b")]).toEqual([null, null]);
    expect(cache.get("c")?.user.id).toBe("u2");
  });

  it("when full, then the oldest entry goes first", () => {
    const cache = new SessionCache(5_000, 2);
    const expiresAt = new Date(Date.now() + 60_000);
    for (const token of ["a", "b", "c"]) cache.set(token, { user, sessionId: token, expiresAt });
    expect(cache.get("a")).toBeNull();
    expect(cache.get("c")).not.toBeNull();
  });

  it("sessionCookieValue reads Loopyard's session cookie, with or without __Secure-", () => {
    expect(sessionCookieValue("x=1; loopyard.session_token=abc.def; y=2")).toBe("abc.def");
    expect(sessionCookieValue("__Secure-loopyard.session_token=q")).toBe("q");
    expect(sessionCookieValue("other=1")).toBeNull();
    expect(sessionCookieValue(undefined)).toBeNull();
  });
});
