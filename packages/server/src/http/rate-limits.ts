import type { Request, RequestHandler } from "express";
import { ipKeyGenerator, rateLimit } from "express-rate-limit";

/** One limit: at most `max` requests per `windowSeconds`. */
export interface RateLimitRule {
  windowSeconds: number;
  max: number;
}

/** The limits of the sign-in endpoints (AppConfig.rateLimits). */
export interface RateLimits {
  /** Every /api/auth/* request that changes something, per client address (express-rate-limit). */
  authPerIp: RateLimitRule;
  /** Failed sign-ins per account (the email address), from any address (express-rate-limit). */
  failedSignInsPerAccount: RateLimitRule;
  /** better-auth's own limiter, per address and endpoint: every auth endpoint … */
  betterAuth: RateLimitRule;
  /** … and sign-in, sign-up, password and email changes. */
  betterAuthCredentials: RateLimitRule;
}

/**
 * Defaults: enough for a person who mistypes, far too few for a password-guessing script
 * (common practice, after the OWASP Authentication Cheat Sheet: throttle per account and per address).
 */
export const DEFAULT_RATE_LIMITS: RateLimits = {
  authPerIp: { windowSeconds: 60, max: 30 },
  failedSignInsPerAccount: { windowSeconds: 15 * 60, max: 10 },
  betterAuth: { windowSeconds: 60, max: 100 },
  betterAuthCredentials: { windowSeconds: 60, max: 20 },
};

function minutesText(seconds: number): string {
  return seconds % 60 === 0 ? `${seconds / 60} minute${seconds === 60 ? "" : "s"}` : `${seconds} seconds`;
}

/** The client's address as the socket reports it (no proxy is trusted), /56 for IPv6. */
function clientKey(req: Request): string {
  return ipKeyGenerator(req.socket.remoteAddress ?? "unknown");
}

/** The account a sign-in names: the lower-cased email of its JSON body (parsed before this runs). */
function accountKey(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" ? email.trim().toLowerCase().slice(0, 254) : "";
}

/** Limits every state-changing /api/auth/* request per address; 429 with Retry-After and a sentence. */
export function authPerIpLimit(rule: RateLimitRule): RequestHandler {
  return rateLimit({
    windowMs: rule.windowSeconds * 1000,
    limit: rule.max,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    keyGenerator: clientKey,
    // No proxy is trusted, so a client's X-Forwarded-For is ignored (and needs no warning).
    validate: { xForwardedForHeader: false },
    skip: (req) => req.method === "GET" || req.method === "HEAD" || req.method === "OPTIONS",
    handler(_req, res, _next, options) {
      res.status(options.statusCode).json({
        error: { message: `Too many sign-in requests from your address (more than ${rule.max} in ${minutesText(rule.windowSeconds)}); wait and try again.` },
      });
    },
  });
}

/**
 * Limits failed sign-ins per account, whatever the address, so that guessing one person's password
 * from many addresses is slow too; successful sign-ins do not count.
 */
export function failedSignInLimit(rule: RateLimitRule): RequestHandler {
  return rateLimit({
    windowMs: rule.windowSeconds * 1000,
    limit: rule.max,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    keyGenerator: accountKey,
    validate: { xForwardedForHeader: false, keyGeneratorIpFallback: false },
    skip: (req) => accountKey(req) === "",
    skipSuccessfulRequests: true,
    handler(_req, res, _next, options) {
      res.status(options.statusCode).json({
        error: { message: `Too many failed sign-ins to this account (${rule.max} in ${minutesText(rule.windowSeconds)}); wait and try again, or ask an admin.` },
      });
    },
  });
}

/**
 * better-auth's limiter answers 429 with its own X-Retry-After header; this also sends the standard
 * Retry-After (RFC 9110, 10.2.3) with the same number of seconds.
 */
export const mirrorRetryAfter: RequestHandler = (_req, res, next) => {
  const setHeader = res.setHeader.bind(res);
  res.setHeader = (name: string, value: number | string | readonly string[]) => {
    if (name.toLowerCase() === "x-retry-after") setHeader("Retry-After", value);
    return setHeader(name, value);
  };
  next();
};
