import { Router } from "express";
import { stepTestFitInputSchema, stepTestPlantInputSchema } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { parseBody, parseIdParam } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { fitStepTestModels, getStepTest, saveIdentifiedPlant, STEP_TEST_NOT_FOUND, uploadStepTest } from "./step-test-service.js";
import { receivedStepTest, receiveStepTest } from "./step-test-upload.js";

/** /api/workspaces/:slug/step-tests */
export function stepTestRoutes(db: Database, compute: Compute): Router {
  const router = Router({ mergeParams: true });

  router.post("/", memberOf(db, "engineer", "Uploading step tests"), receiveStepTest, async (req, res) => {
    res.status(201).json(await uploadStepTest(db, compute, accessOf(req), receivedStepTest(req.file)));
  });

  router.get("/:stepTestId", memberOf(db, "viewer", "Reading step tests"), async (req, res) => {
    res.json(await getStepTest(db, accessOf(req), parseIdParam(req.params.stepTestId, STEP_TEST_NOT_FOUND)));
  });

  router.post("/:stepTestId/fits", memberOf(db, "engineer", "Fitting step tests"), async (req, res) => {
    const id = parseIdParam(req.params.stepTestId, STEP_TEST_NOT_FOUND);
    res.json(await fitStepTestModels(db, compute, accessOf(req), id, parseBody(stepTestFitInputSchema, req)));
  });

  router.post("/:stepTestId/plants", memberOf(db, "engineer", "Creating plants"), async (req, res) => {
    const id = parseIdParam(req.params.stepTestId, STEP_TEST_NOT_FOUND);
    res.status(201).json(await saveIdentifiedPlant(db, compute, accessOf(req), id, parseBody(stepTestPlantInputSchema, req)));
  });

  return router;
}
