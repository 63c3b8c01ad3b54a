import { Router } from "express";
import type { Database } from "../db/database.js";
import { pathParam } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import type { MailConfig } from "./mail-config.js";
import { getOutboxMessage, listOutbox } from "./outbox-service.js";

/** /api/workspaces/:slug/outbox: what the local mail sink received about this workspace (admins only). */
export function outboxRoutes(db: Database, mail: MailConfig | null): Router {
  const router = Router({ mergeParams: true });
  router.get("/", memberOf(db, "admin", "Reading the outbox"), async (req, res) => {
    res.json(await listOutbox(accessOf(req), mail));
  });
  router.get("/:messageId", memberOf(db, "admin", "Reading the outbox"), async (req, res) => {
    res.json(await getOutboxMessage(accessOf(req), mail, pathParam(req.params.messageId)));
  });
  return router;
}
