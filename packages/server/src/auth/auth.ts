import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { MIN_PASSWORD_LENGTH } from "@loopyard/core";
import type { AppConfig } from "../config.js";
import type { Database } from "../db/database.js";
import { authSchema } from "../db/schema.js";
import { DEFAULT_RATE_LIMITS, type RateLimits } from "../http/rate-limits.js";
import { MAX_PASSWORD_LENGTH } from "./auth-input-guard.js";

/** Shortest password a user may choose (core's limit, which the sign-up form reads too). */
export { MIN_PASSWORD_LENGTH };

// Defensive: no usage data leaves the machine, even if an option below were lost.
process.env.BETTER_AUTH_TELEMETRY = "0";

/**
 * Header carrying the client's address to better-auth: set by the app from the socket on every
 * /api/auth request (any copy the client sent is dropped first), since no proxy is trusted.
 */
export const CLIENT_ADDRESS_HEADER = "x-loopyard-client-address";

/**
 * Email + password sign-in with sessions stored in PostgreSQL through the Drizzle adapter.
 * Cookies are httpOnly and SameSite=Lax, and Secure whenever the public URL is https.
 * Sign-up does not sign in: a taken address gets the same answer as a fresh one (no enumeration of
 * accounts), and the client signs in next. better-auth's rate limiter is on in every mode, per
 * client address and endpoint.
 */
export function createAuth(db: Database, config: Pick<AppConfig, "authSecret" | "publicUrl" | "extraTrustedOrigins" | "rateLimits">) {
  const limits: RateLimits = config.rateLimits ?? DEFAULT_RATE_LIMITS;
  const credentials = { window: limits.betterAuthCredentials.windowSeconds, max: limits.betterAuthCredentials.max };
  const origin = new URL(config.publicUrl).origin;
  const extra = (config.extraTrustedOrigins ?? []).map((url) => new URL(url).origin);
  return betterAuth({
    appName: "Loopyard",
    baseURL: config.publicUrl,
    basePath: "/api/auth",
    secret: config.authSecret,
    trustedOrigins: [origin, ...extra],
    database: drizzleAdapter(db, { provider: "pg", schema: authSchema }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: MAX_PASSWORD_LENGTH,
      // Off so that sign-up with a taken address answers like a fresh one (better-auth then returns a synthetic user).
      autoSignIn: false,
    },
    rateLimit: {
      enabled: true,
      storage: "memory",
      window: limits.betterAuth.windowSeconds,
      max: limits.betterAuth.max,
      customRules: {
        "/sign-in/*": credentials,
        "/sign-up/*": credentials,
        "/change-password": credentials,
        "/change-email": credentials,
      },
    },
    telemetry: { enabled: false },
    // An error that is not better-auth's own (a database that is away) goes on to the app's error
    // middleware, which answers 503 with a sentence instead of an empty 500.
    onAPIError: { throw: true },
    advanced: {
      cookiePrefix: "loopyard",
      useSecureCookies: origin.startsWith("https://"),
      defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
      // better-auth skips the origin check under NODE_ENV=test; keep it on so tests exercise what ships.
      disableOriginCheck: false,
      ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] },
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;
