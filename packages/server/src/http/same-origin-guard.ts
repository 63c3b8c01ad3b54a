import type { RequestHandler } from "express";
import { HttpError } from "./http-error.js";

/** Methods that change nothing; every other method is state-changing and checked. */
const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** True when the request carries a body (a length above zero, or a chunked body). */
function hasBody(headers: { "content-length"?: string | undefined; "transfer-encoding"?: string | undefined }): boolean {
  const length = headers["content-length"];
  if (length !== undefined) return Number(length) > 0;
  return headers["transfer-encoding"] !== undefined;
}

/**
 * Refuses cross-site requests on every state-changing route (common practice, after the OWASP
 * Cross-Site Request Forgery Prevention Cheat Sheet: verify the origin with standard headers, and
 * Fetch Metadata). A browser names the page's origin in `Origin` and says in `Sec-Fetch-Site` whether
 * it is this site's own page; a form posted from another port of the same host passes SameSite=Lax
 * but not these checks:
 *
 * - `Sec-Fetch-Site`, when sent, must be `same-origin` (or `none`: typed by the user);
 * - `Origin`, when sent, must be one of `trustedOrigins`;
 * - a request that sends a session cookie must send one of the two (every browser does);
 * - a body must be JSON (`Content-Type: application/json`), which no HTML form can send; on the
 *   upload paths (`multipartPaths`, matched against the path under /api) multipart/form-data too,
 *   still behind the three checks above.
 *
 * Scripts outside a browser (curl, the load bench) send neither header nor a cookie from a browser's
 * jar, so they pass the first three checks; they gain nothing an attacker's page could use.
 */
export function sameOriginGuard(trustedOrigins: readonly string[], sessionCookie: RegExp, multipartPaths: readonly RegExp[] = []): RequestHandler {
  const trusted = new Set(trustedOrigins);
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) {
      next();
      return;
    }
    const site = req.headers["sec-fetch-site"];
    const origin = req.headers.origin;
    if (site !== undefined && site !== "same-origin" && site !== "none") {
      next(new HttpError(403, `This request came from another site (Sec-Fetch-Site: ${site}); Loopyard accepts changes only from its own pages.`));
      return;
    }
    if (origin !== undefined && !trusted.has(origin)) {
      next(new HttpError(403, "This request came from a page of another origin; Loopyard accepts changes only from its own pages."));
      return;
    }
    if (origin === undefined && site === undefined && sessionCookie.test(req.headers.cookie ?? "")) {
      next(new HttpError(403, "A signed-in change must name its origin (the Origin header); send it from a Loopyard page."));
      return;
    }
    const upload = req.method === "POST" && multipartPaths.some((path) => path.test(req.path)) && req.is("multipart/form-data");
    if (hasBody(req.headers) && !req.is("application/json") && !upload) {
      next(new HttpError(415, "Send the request body as JSON with the header Content-Type: application/json."));
      return;
    }
    next();
  };
}
