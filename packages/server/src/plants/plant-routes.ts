import { Router } from "express";
import { z } from "zod";
import { plantInputSchema, refitInputSchema } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { parseBody, parseIdParam, parseQuery } from "../http/validation.js";
import { sendAnswer } from "../http/answer-cache.js";
import { plantListAnswer } from "./plant-list-cache.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { diffQuerySchema } from "../revisions/revision-rules.js";
import { refitPlant } from "../step-tests/step-test-service.js";
import { createPlant, createRevision, getPlantDetail, getPlantDiff, listPlants, PLANT_NOT_FOUND, setPlantArchive } from "./plant-service.js";

const detailQuerySchema = z.object({
  revision: z.coerce.number({ error: "give a revision number" }).int("give a whole revision number").min(1, "revisions start at 1").optional(),
});

/** /api/workspaces/:slug/plants */
export function plantRoutes(db: Database, compute: Compute): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Reading the plant library");

  // Kept a few seconds per workspace, forgotten at once by a write (plant-list-cache.ts); sent with an ETag.
  router.get("/", canRead, async (req, res) => {
    const access = accessOf(req);
    sendAnswer(req, res, await plantListAnswer(access.workspace.id, () => listPlants(db, access)));
  });

  router.post("/", memberOf(db, "engineer", "Creating plants"), async (req, res) => {
    const input = parseBody(plantInputSchema, req);
    res.status(201).json(await createPlant(db, compute, accessOf(req), input));
  });

  router.get("/:plantId", canRead, async (req, res) => {
    const { revision } = parseQuery(detailQuerySchema, req);
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    res.json(await getPlantDetail(db, compute, accessOf(req), plantId, revision));
  });

  router.post("/:plantId/revisions", memberOf(db, "engineer", "Editing plants"), async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    const input = parseBody(plantInputSchema, req);
    res.status(201).json(await createRevision(db, compute, accessOf(req), plantId, input));
  });

  router.get("/:plantId/diff", canRead, async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    const query = parseQuery(diffQuerySchema, req);
    res.json(await getPlantDiff(db, accessOf(req), plantId, query));
  });

  router.post("/:plantId/archive", memberOf(db, "engineer", "Archiving plants"), async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    res.json(await setPlantArchive(db, compute, accessOf(req), plantId, true));
  });

  router.post("/:plantId/restore", memberOf(db, "engineer", "Restoring plants"), async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    res.json(await setPlantArchive(db, compute, accessOf(req), plantId, false));
  });

  router.post("/:plantId/refit", memberOf(db, "engineer", "Editing plants"), async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    res.status(201).json(await refitPlant(db, compute, accessOf(req), plantId, parseBody(refitInputSchema, req)));
  });

  return router;
}
