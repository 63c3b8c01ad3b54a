import { Router } from "express";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { parseBody } from "../http/validation.js";
import { accessOf, memberOf } from "./require-member.js";
import { workspaceInputSchema } from "./workspace-input.js";
import { HttpError } from "../http/http-error.js";
import { createWorkspace, getWorkspaceHome } from "./workspace-service.js";

/** /api/workspaces */
export function workspaceRoutes(db: Database): Router {
  const router = Router();

  router.post("/", async (req, res) => {
    const input = parseBody(workspaceInputSchema, req);
    res.status(201).json(await createWorkspace(db, currentUser(req), input));
  });

  router.get("/:slug", memberOf(db, "viewer", "Opening this workspace"), async (req, res) => {
    res.json(await getWorkspaceHome(db, accessOf(req)));
  });

  // Gone: adding a registered user by address told whether the address had an account, and added
  // people without their consent. Members join by accepting a mailed invitation.
  router.post("/:slug/members", memberOf(db, "viewer", "Adding members"), () => {
    throw new HttpError(
      410,
      "Adding a member by address is gone: invite people instead (POST /api/workspaces/:slug/invitations with { email, role }, admins only); they join when they accept the mailed invitation.",
    );
  });

  return router;
}
