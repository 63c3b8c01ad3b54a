import { hasRole, type Role, type UserDto, type WorkspaceDto } from "@loopyard/core";
import type { RequestHandler } from "express";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { pathParam } from "../http/validation.js";
import { HttpError, notFound } from "../http/http-error.js";
import { findMemberWorkspace } from "./workspace-repository.js";
import { SLUG_PATTERN } from "./workspace-input.js";

/** A signed-in user's standing in one workspace, after the role check passed. */
export interface MemberAccess {
  workspace: WorkspaceDto;
  role: Role;
  user: UserDto;
}

function withArticle(role: Role): string {
  return /^[aeiou]/.test(role) ? `an ${role}` : `a ${role}`;
}

/** The sentence of a 403, e.g. "Creating plants needs the engineer role or higher in X; you are a viewer." */
export function roleRefusal(action: string, needed: Role, workspaceName: string, role: Role): string {
  const level = needed === "admin" ? `the ${needed} role` : `the ${needed} role or higher`;
  return `${action} needs ${level} in ${workspaceName}; you are ${withArticle(role)}.`;
}

/** The answer to anyone who is not a member, whether or not the workspace exists: the same 404, naming nothing. */
export function workspaceNotFound(slug: string): HttpError {
  return notFound(`There is no workspace “${slug}” that you are a member of; check the address, or ask one of its admins to add you.`);
}

/**
 * Server-side role check of every workspace route, in one query: 404 when the workspace does not
 * exist or the user is not a member (the same answer, so that a workspace's name and existence do
 * not leak to outsiders), 403 when the member's role is too low (the sentence names the role needed).
 *
 * @param action what the user tries to do, as the subject of a sentence: "Creating plants".
 */
export async function requireMember(db: Database, user: UserDto, slug: string, needed: Role, action: string): Promise<MemberAccess> {
  const found = SLUG_PATTERN.test(slug) ? await findMemberWorkspace(db, slug, user.id) : null;
  if (!found) throw workspaceNotFound(slug);
  const { workspace, role } = found;
  if (!hasRole(role, needed)) throw new HttpError(403, roleRefusal(action, needed, workspace.name, role));
  return { workspace, role, user };
}

declare module "express-serve-static-core" {
  interface Request {
    /** The member's standing in the :slug workspace, set by memberOf. */
    access?: MemberAccess;
  }
}

/**
 * Route middleware: checks the role before the body is even read, so that a refused user learns
 * about the role and not about the fields. Needs requireSession before it and a :slug parameter.
 */
export function memberOf(db: Database, needed: Role, action: string): RequestHandler & { requiredRole: Role } {
  const check: RequestHandler = async (req, _res, next) => {
    req.access = await requireMember(db, currentUser(req), pathParam(req.params.slug), needed, action);
    next();
  };
  // Read by the route table (http/route-table.ts), so that tests know each route's role from the routes themselves.
  return Object.assign(check, { requiredRole: needed });
}

/** The access memberOf put on the request. */
export function accessOf(req: { access?: MemberAccess }): MemberAccess {
  if (!req.access) throw new Error("memberOf must run before this handler");
  return req.access;
}
