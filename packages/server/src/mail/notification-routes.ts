import { Router } from "express";
import { notificationSettingsInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { currentUser } from "../auth/session-middleware.js";
import { parseBody } from "../http/validation.js";
import { getNotificationSettings, updateNotificationSettings } from "./notification-service.js";

/** /api/me/notifications: which kinds of mail the signed-in person gets. */
export function notificationRoutes(db: Database): Router {
  const router = Router();
  router.get("/", async (req, res) => {
    res.json(await getNotificationSettings(db, currentUser(req)));
  });
  router.put("/", async (req, res) => {
    const input = parseBody(notificationSettingsInputSchema, req);
    res.json(await updateNotificationSettings(db, currentUser(req), input));
  });
  return router;
}
