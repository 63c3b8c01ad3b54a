import type { RequestHandler } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { UserDto } from "@loopyard/core";
import type { Auth } from "./auth.js";
import { unauthorized } from "../http/http-error.js";

declare module "express-serve-static-core" {
  interface Request {
    /** The signed-in user, set by requireSession. */
    user?: UserDto;
  }
}

/** Looks up the better-auth session of the request; answers 401 when there is none. */
export function requireSession(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const { headers, response: session } = await auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
    // When better-auth extends a session it renews the cookie too; pass that on.
    const renewed = headers.getSetCookie();
    if (renewed.length > 0) res.append("Set-Cookie", renewed);
    if (!session) {
      next(unauthorized());
      return;
    }
    req.user = { id: session.user.id, name: session.user.name, email: session.user.email };
    next();
  };
}

/** The signed-in user of a request that passed requireSession. */
export function currentUser(req: { user?: UserDto }): UserDto {
  if (!req.user) throw unauthorized();
  return req.user;
}
