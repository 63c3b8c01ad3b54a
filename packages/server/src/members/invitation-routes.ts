import { Router } from "express";
import { invitationTokenInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { parseBody } from "../http/validation.js";
import { acceptInvitation, declineInvitation, previewInvitation, type InvitationDeps } from "./invitation-service.js";

/**
 * /api/invitations: the invitee's side, signed in. The token travels in the body, never in a URL,
 * so that no request log holds a working link.
 */
export function invitationRoutes(db: Database, deps: Pick<InvitationDeps, "now">): Router {
  const router = Router();

  router.post("/preview", async (req, res) => {
    const { token } = parseBody(invitationTokenInputSchema, req);
    res.json(await previewInvitation(db, currentUser(req), token, deps));
  });

  router.post("/accept", async (req, res) => {
    const { token } = parseBody(invitationTokenInputSchema, req);
    res.json(await acceptInvitation(db, currentUser(req), token, deps));
  });

  router.post("/decline", async (req, res) => {
    const { token } = parseBody(invitationTokenInputSchema, req);
    await declineInvitation(db, currentUser(req), token, deps);
    res.status(204).end();
  });

  return router;
}
