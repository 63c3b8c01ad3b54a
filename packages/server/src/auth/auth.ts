import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { MIN_PASSWORD_LENGTH } from "@loopyard/core";
import type { AppConfig } from "../config.js";
import type { Database } from "../db/database.js";
import { authSchema } from "../db/schema.js";

/** Shortest password a user may choose (core's limit, which the sign-up form reads too). */
export { MIN_PASSWORD_LENGTH };

// Defensive: no usage data leaves the machine, even if an option below were lost.
process.env.BETTER_AUTH_TELEMETRY = "0";

/**
 * Email + password sign-in with sessions stored in PostgreSQL through the Drizzle adapter.
 * Cookies are httpOnly and SameSite=Lax, and Secure whenever the public URL is https.
 */
export function createAuth(db: Database, config: Pick<AppConfig, "authSecret" | "publicUrl" | "extraTrustedOrigins">) {
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
      autoSignIn: true,
    },
    telemetry: { enabled: false },
    advanced: {
      cookiePrefix: "loopyard",
      useSecureCookies: origin.startsWith("https://"),
      defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
      // better-auth skips the origin check under NODE_ENV=test; keep it on so tests exercise what ships.
      disableOriginCheck: false,
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;
