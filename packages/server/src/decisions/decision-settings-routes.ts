import { Router } from "express";
import { decisionSettingsSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { parseBody } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { getDecisionSettings, updateDecisionSettings } from "./decision-service.js";

/** /api/workspaces/:slug/decision-settings — members read the rules of decisions; admins change them. */
export function decisionSettingsRoutes(db: Database): Router {
  const router = Router({ mergeParams: true });

  router.get("/", memberOf(db, "viewer", "Reading the decision settings"), async (req, res) => {
    res.json(await getDecisionSettings(db, accessOf(req)));
  });

  router.put("/", memberOf(db, "admin", "Changing the decision settings"), async (req, res) => {
    const input = parseBody(decisionSettingsSchema, req);
    res.json(await updateDecisionSettings(db, accessOf(req), input));
  });

  return router;
}
