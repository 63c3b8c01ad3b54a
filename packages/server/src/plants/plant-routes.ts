import { Router } from "express";
import { z } from "zod";
import { plantInputSchema, refitInputSchema } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { parseBody, parseIdParam, parseQuery } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { refitPlant } from "../step-tests/step-test-service.js";
import { createPlant, createRevision, getPlantDetail, listPlants, PLANT_NOT_FOUND } from "./plant-service.js";

const detailQuerySchema = z.object({
  revision: z.coerce.number({ error: "give a revision number" }).int("give a whole revision number").min(1, "revisions start at 1").optional(),
});

/** /api/workspaces/:slug/plants */
export function plantRoutes(db: Database, compute: Compute): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Reading the plant library");

  router.get("/", canRead, async (req, res) => {
    res.json(await listPlants(db, accessOf(req)));
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

  router.post("/:plantId/refit", memberOf(db, "engineer", "Editing plants"), async (req, res) => {
    const plantId = parseIdParam(req.params.plantId, PLANT_NOT_FOUND);
    res.status(201).json(await refitPlant(db, compute, accessOf(req), plantId, parseBody(refitInputSchema, req)));
  });

  return router;
}
