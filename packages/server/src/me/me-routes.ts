import { Router } from "express";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import type { SessionCache } from "../auth/session-cache.js";
import { pathParam } from "../http/validation.js";
import { getMe } from "../workspaces/workspace-service.js";
import { listMySessions, revokeMySession } from "./session-service.js";

/** /api/me: the signed-in user, their workspaces and their sessions. */
export function meRoutes(db: Database, sessions: SessionCache): Router {
  const router = Router();
  router.get("/", async (req, res) => {
    res.json(await getMe(db, currentUser(req)));
  });
  router.get("/sessions", async (req, res) => {
    res.json(await listMySessions(db, currentUser(req), req.sessionId));
  });
  router.delete("/sessions/:sessionId", async (req, res) => {
    await revokeMySession(db, sessions, currentUser(req), pathParam(req.params.sessionId));
    res.status(204).end();
  });
  return router;
}
