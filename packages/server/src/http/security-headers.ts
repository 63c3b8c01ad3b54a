import type { RequestHandler } from "express";
import helmet from "helmet";

/**
 * Features no Loopyard page uses, switched off for the page and anything it embeds
 * (W3C Permissions Policy; the list after the OWASP Secure Headers Project's recommended value).
 */
export const PERMISSIONS_POLICY = [
  "accelerometer=()",
  "autoplay=()",
  "camera=()",
  "display-capture=()",
  "encrypted-media=()",
  "fullscreen=(self)",
  "geolocation=()",
  "gyroscope=()",
  "magnetometer=()",
  "microphone=()",
  "midi=()",
  "payment=()",
  "picture-in-picture=()",
  "publickey-credentials-get=()",
  "screen-wake-lock=()",
  "serial=()",
  "usb=()",
  "xr-spatial-tracking=()",
].join(", ");

/**
 * The Content-Security-Policy of the web app's pages: scripts, workers, styles, fonts and data only
 * from the app's own origin, and no string ever evaluated as code (no 'unsafe-eval': the chart
 * library is plotly's strict bundle, whose WebGL draw calls are compiled ahead of time, and zod runs
 * without its compiled parsers; see packages/web/src/zod-jitless.ts). Exceptions, each needed by
 * the chart library (plotly.js): inline styles (it sets style attributes and writes a <style>
 * element) and `data:`/`blob:` images (its icons and image exports). No script from another origin
 * and no inline script can run, and nothing the server sends is evaluated.
 */
export const PAGE_CSP_DIRECTIVES = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  workerSrc: ["'self'", "blob:"],
  styleSrc: ["'self'", "'unsafe-inline'"],
  imgSrc: ["'self'", "data:", "blob:"],
  fontSrc: ["'self'", "data:"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
};

/**
 * Response hardening for every response with helmet (common practice, after the OWASP Secure
 * Headers Project): no MIME sniffing, no framing, no referrer leaking to other sites, an isolated
 * browsing context, a CSP (PAGE_CSP_DIRECTIVES) and the Permissions-Policy. HSTS is sent only
 * when the app is served over https.
 */
export function securityHeaders(https: boolean): RequestHandler {
  const headers = helmet({
    contentSecurityPolicy: { useDefaults: false, directives: PAGE_CSP_DIRECTIVES },
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "same-origin" },
    crossOriginOpenerPolicy: { policy: "same-origin" },
    crossOriginResourcePolicy: { policy: "same-origin" },
    crossOriginEmbedderPolicy: false,
    strictTransportSecurity: https ? { maxAge: 15_552_000, includeSubDomains: true } : false,
  });
  return setHeaders([...headersSetBy(headers), ["Permissions-Policy", PERMISSIONS_POLICY]]);
}

/**
 * The headers a middleware sets, found by running it once on a stand-in response. Helmet's headers
 * here depend on nothing in the request (no nonce, no function in a directive), so they are computed
 * once and then set as they are: one loop instead of a dozen middleware calls on every request.
 */
export function headersSetBy(middleware: RequestHandler): [string, string][] {
  const set = new Map<string, string>();
  const res = {
    setHeader(name: string, value: string | number | readonly string[]) {
      set.set(name, String(value));
    },
    removeHeader(name: string) {
      set.delete(name);
    },
    getHeader(name: string) {
      return set.get(name);
    },
  };
  let done = false;
  middleware({ method: "GET", headers: {}, url: "/" } as never, res as never, (error?: unknown) => {
    if (error) throw error;
    done = true;
  });
  if (!done) throw new Error("the header middleware did not call next() at once");
  return [...set];
}

function setHeaders(headers: readonly [string, string][]): RequestHandler {
  return (_req, res, next) => {
    for (const [name, value] of headers) res.setHeader(name, value);
    next();
  };
}

const apiCsp = headersSetBy(helmet.contentSecurityPolicy({ useDefaults: false, directives: { defaultSrc: ["'none'"], frameAncestors: ["'none'"] } }));

/** API responses are data, never pages: forbid everything a browser could run from them, never cache. */
export const apiHeaders: RequestHandler = setHeaders([["Cache-Control", "no-store"], ...apiCsp]);
