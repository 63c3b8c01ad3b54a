import { Router } from "express";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { parseBody } from "../http/validation.js";
import { accessOf, memberOf } from "./require-member.js";
import { memberInputSchema, workspaceInputSchema } from "./workspace-input.js";
import { addMember, createWorkspace, getWorkspaceHome } from "./workspace-service.js";

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

  router.post("/:slug/members", memberOf(db, "admin", "Adding members"), async (req, res) => {
    const input = parseBody(memberInputSchema, req);
    res.status(201).json(await addMember(db, accessOf(req), input));
  });

  return router;
}
