import { Router } from "express";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { getMe } from "../workspaces/workspace-service.js";

/** /api/me: the signed-in user and their workspaces. */
export function meRoutes(db: Database): Router {
  const router = Router();
  router.get("/", async (req, res) => {
    res.json(await getMe(db, currentUser(req)));
  });
  return router;
}
