/**
 * The sign-in limits as shipped (DEFAULT_RATE_LIMITS), in a file of their own so that no other
 * test's sign-ins from 127.0.0.1 count against them (better-auth's in-memory store is per process).
 * 429 with Retry-After per RFC 6585, section 4; limits per account and per address after the OWASP
 * Authentication Cheat Sheet ("common practice").
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEFAULT_RATE_LIMITS } from "../../packages/server/src/index.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser } from "./api-client.js";

describe("rate limits (the shipped defaults)", () => {
  let limited: TestServer;

  beforeAll(async () => {
    limited = await startTestServer({ embeddedWorker: false, rateLimits: DEFAULT_RATE_LIMITS });
  });

  afterAll(async () => {
    await limited?.close();
  });

  it("when one account gets more failed sign-ins than allowed, then 429 with Retry-After, even for the right password", async () => {
    const victim = freshUser("Victim");
    await new ApiClient(limited.url).request("POST", "/api/auth/sign-up/email", { json: victim });
    const statuses: number[] = [];
    for (let i = 0; i < DEFAULT_RATE_LIMITS.failedSignInsPerAccount.max; i += 1) {
      statuses.push((await new ApiClient(limited.url).signIn(victim.email, `wrong-password-${i}`)).status);
    }
    expect(new Set(statuses)).toEqual(new Set([401]));
    const locked = await new ApiClient(limited.url).signIn(victim.email, `wrong-password-last`);
    expect(locked.status).toBe(429);
    expect(Number(locked.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(locked.body.error.message).toMatch(/failed sign-ins to this account/);
    // Even the right password waits: the account is throttled, not the address.
    expect((await new ApiClient(limited.url).signIn(victim.email, victim.password)).status).toBe(429);
  });

  it("when 100 sign-ins come at once from one address, then the surplus gets 429 with Retry-After", async () => {
    const responses = await Promise.all(
      Array.from({ length: 100 }, (_, i) => new ApiClient(limited.url).signIn(`nobody-${i}@loopyard-tests.example`, "wrong-password-here")),
    );
    const limitedOnes = responses.filter((r) => r.status === 429);
    expect(limitedOnes.length).toBeGreaterThanOrEqual(100 - DEFAULT_RATE_LIMITS.authPerIp.max);
    for (const response of limitedOnes) expect(Number(response.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(responses.every((r) => r.status === 401 || r.status === 429)).toBe(true);
  });
});
