import type { RequestHandler } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { UserDto } from "@loopyard/core";
import type { Auth } from "./auth.js";
import { unauthorized } from "../http/http-error.js";
import { sessionCookieValue, type SessionCache } from "./session-cache.js";

declare module "express-serve-static-core" {
  interface Request {
    /** The signed-in user, set by requireSession. */
    user?: UserDto;
    /** The id of the session the request was made with, set by requireSession. */
    sessionId?: string;
  }
}

/**
 * Looks up the better-auth session of the request (from `cache` when it was looked up in the last
 * few seconds); answers 401 when there is none.
 */
export function requireSession(auth: Auth, cache: SessionCache): RequestHandler {
  return async (req, res, next) => {
    const token = sessionCookieValue(req.headers.cookie);
    if (token === null) {
      next(unauthorized());
      return;
    }
    const cached = cache.get(token);
    if (cached) {
      req.user = cached.user;
      req.sessionId = cached.sessionId;
      next();
      return;
    }
    const { headers, response: session } = await auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
    // When better-auth extends a session it renews the cookie too; pass that on.
    const renewed = headers.getSetCookie();
    if (renewed.length > 0) res.append("Set-Cookie", renewed);
    if (!session) {
      next(unauthorized());
      return;
    }
    req.user = { id: session.user.id, name: session.user.name, email: session.user.email };
    req.sessionId = session.session.id;
    cache.set(token, { user: req.user, sessionId: session.session.id, expiresAt: new Date(session.session.expiresAt) });
    next();
  };
}

/**
 * Before every /api/auth/* request that changes something: forgets the cached sessions of the user
 * making it (a sign-out, a revocation, a new name or password must show at once).
 */
export function forgetCachedSessions(cache: SessionCache): RequestHandler {
  return (req, res, next) => {
    if (req.method !== "GET") {
      const token = sessionCookieValue(req.headers.cookie);
      const userId = token === null ? null : cache.userOf(token);
      if (userId !== null) {
        cache.forgetUser(userId);
        // Once more when answered: a lookup made meanwhile may have remembered the old state.
        res.on("finish", () => cache.forgetUser(userId));
      }
    }
    next();
  };
}

/** The signed-in user of a request that passed requireSession. */
export function currentUser(req: { user?: UserDto }): UserDto {
  if (!req.user) throw unauthorized();
  return req.user;
}
