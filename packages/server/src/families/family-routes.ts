import { Router } from "express";
import { z } from "zod";
import { familyInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { parseBody, parseIdParam, parseQuery } from "../http/validation.js";
import { diffQuerySchema } from "../revisions/revision-rules.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import {
  createFamily,
  createFamilyRevision,
  FAMILY_NOT_FOUND,
  getFamilyDetail,
  getFamilyDiff,
  listFamilies,
  setFamilyArchive,
} from "./family-service.js";

const detailQuerySchema = z.object({
  revision: z.coerce.number({ error: "give a revision number" }).int("give a whole revision number").min(1, "revisions start at 1").optional(),
});

/** /api/workspaces/:slug/families */
export function familyRoutes(db: Database): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Reading the families of the library");
  const idOf = (value: unknown) => parseIdParam(value, FAMILY_NOT_FOUND);

  router.get("/", canRead, async (req, res) => {
    res.json(await listFamilies(db, accessOf(req)));
  });

  router.post("/", memberOf(db, "engineer", "Saving families"), async (req, res) => {
    const input = parseBody(familyInputSchema, req);
    res.status(201).json(await createFamily(db, accessOf(req), input));
  });

  router.get("/:familyId", canRead, async (req, res) => {
    const { revision } = parseQuery(detailQuerySchema, req);
    res.json(await getFamilyDetail(db, accessOf(req), idOf(req.params.familyId), revision));
  });

  router.get("/:familyId/diff", canRead, async (req, res) => {
    const query = parseQuery(diffQuerySchema, req);
    res.json(await getFamilyDiff(db, accessOf(req), idOf(req.params.familyId), query));
  });

  router.post("/:familyId/revisions", memberOf(db, "engineer", "Revising families"), async (req, res) => {
    const familyId = idOf(req.params.familyId);
    const input = parseBody(familyInputSchema, req);
    res.status(201).json(await createFamilyRevision(db, accessOf(req), familyId, input));
  });

  router.post("/:familyId/archive", memberOf(db, "engineer", "Archiving families"), async (req, res) => {
    res.json(await setFamilyArchive(db, accessOf(req), idOf(req.params.familyId), true));
  });

  router.post("/:familyId/restore", memberOf(db, "engineer", "Restoring families"), async (req, res) => {
    res.json(await setFamilyArchive(db, accessOf(req), idOf(req.params.familyId), false));
  });

  return router;
}
