import type { RequestHandler } from "express";

/**
 * Basic response hardening for every response (common practice, after the OWASP Secure Headers
 * Project): no MIME sniffing, no framing, no referrer leaking to other sites, isolated browsing context.
 */
export const securityHeaders: RequestHandler = (_req, res, next) => {
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("X-Frame-Options", "DENY");
  res.setHeader("Referrer-Policy", "same-origin");
  res.setHeader("Cross-Origin-Opener-Policy", "same-origin");
  res.setHeader("Cross-Origin-Resource-Policy", "same-origin");
  next();
};

/** API responses are data, never pages: forbid everything a browser could run from them, never cache. */
export const apiHeaders: RequestHandler = (_req, res, next) => {
  res.setHeader("Content-Security-Policy", "default-src 'none'; frame-ancestors 'none'");
  res.setHeader("Cache-Control", "no-store");
  next();
};
