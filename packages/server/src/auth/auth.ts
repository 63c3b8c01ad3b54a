import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { MIN_PASSWORD_LENGTH } from "@loopyard/core";
import type { AppConfig } from "../config.js";
import type { Database } from "../db/database.js";
import { authSchema } from "../db/schema.js";
import { DEFAULT_RATE_LIMITS, type RateLimits } from "../http/rate-limits.js";
import { MAX_PASSWORD_LENGTH } from "./auth-input-guard.js";
import {
  existingAccountMail,
  pageLinkWithSecret,
  passwordResetMail,
  verificationMail,
  type AccountMailMessage,
  type SendAccountMail,
} from "../members/account-mail.js";

/** How long a password-reset link works [min]. */
export const RESET_PASSWORD_MINUTES = 60;
/** How long an address-check link works [h]. */
export const VERIFY_EMAIL_HOURS = 48;
/** The web app's pages that open the mailed links; the secret follows after "#". */
export const RESET_PASSWORD_PAGE = "reset-password";
export const VERIFY_EMAIL_PAGE = "verify-email";

/** What the auth flows need from the rest of the app. */
export interface AuthHooks {
  /** Queues a mail (reset link, address check). */
  sendMail: SendAccountMail;
  /** Called after a password reset has ended the user's sessions (the session cache forgets them). */
  onPasswordReset?: (userId: string) => void;
}

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
 *
 * Password reset and the address check are better-auth's own flows; their mails go through the mail
 * queue with links to the web app's pages, the secret after "#" (kept out of request logs), and
 * better-auth stores its reset tokens hashed. Accounts with an unchecked address may sign in (the
 * page asks them to confirm it); a reset ends every session of the account.
 */
export function createAuth(
  db: Database,
  config: Pick<AppConfig, "authSecret" | "publicUrl" | "extraTrustedOrigins" | "rateLimits">,
  hooks: AuthHooks,
) {
  const limits: RateLimits = config.rateLimits ?? DEFAULT_RATE_LIMITS;
  const credentials = { window: limits.betterAuthCredentials.windowSeconds, max: limits.betterAuthCredentials.max };
  const origin = new URL(config.publicUrl).origin;
  const extra = (config.extraTrustedOrigins ?? []).map((url) => new URL(url).origin);
  // Queued without waiting: a request for an address with an account takes as long as one without.
  const queue = (message: AccountMailMessage) => {
    void hooks.sendMail(message).catch(() => undefined);
  };
  const link = (page: string, secret: string) => pageLinkWithSecret(config.publicUrl, page, secret);
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
      // Unchecked addresses may sign in: invitations are bound to the address and checked by their own token.
      requireEmailVerification: false,
      resetPasswordTokenExpiresIn: RESET_PASSWORD_MINUTES * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, token }) => {
        queue(passwordResetMail({ to: user.email, name: user.name, link: link(RESET_PASSWORD_PAGE, token), expiresInMinutes: RESET_PASSWORD_MINUTES }));
      },
      onPasswordReset: async ({ user }) => {
        hooks.onPasswordReset?.(user.id);
      },
      // A sign-up with a taken address answers as a fresh one; the owner gets this mail instead of an address check.
      onExistingUserSignUp: async ({ user }) => {
        queue(existingAccountMail({ to: user.email, name: user.name, signInLink: `${config.publicUrl}/sign-in`, resetLink: `${config.publicUrl}/forgot-password` }));
      },
    },
    emailVerification: {
      sendOnSignUp: true,
      expiresIn: VERIFY_EMAIL_HOURS * 3600,
      autoSignInAfterVerification: false,
      sendVerificationEmail: async ({ user, token }) => {
        queue(verificationMail({ to: user.email, name: user.name, link: link(VERIFY_EMAIL_PAGE, token) }));
      },
    },
    // Reset tokens are looked up by their hash: a copy of the database holds no working link.
    verification: { storeIdentifier: "hashed" },
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
