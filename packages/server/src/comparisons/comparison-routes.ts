import { Router } from "express";
import { z } from "zod";
import { comparisonInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { parseIdParam, parseQuery, parseValue } from "../http/validation.js";
import { resolveFamilyReference } from "../families/family-reference.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { getComparisonsAcross } from "./comparison-across.js";
import {
  cancelComparison,
  COMPARISON_NOT_FOUND,
  createComparison,
  getComparison,
  getComparisonResultJson,
  getPickResponses,
  listComparisons,
  type ComparisonJobControl,
} from "./comparison-service.js";

const responsesQuerySchema = z.object({
  variant: z
    .string({ error: "give the variant's number (0 for the first) or leave it out" })
    .regex(/^\d{1,3}$/, "give the variant's number, a whole number from 0, or leave it out for each pick's worst variant")
    .transform(Number)
    .optional(),
});

const acrossQuerySchema = z.object({
  judge: z.string({ error: "give one column key" }).max(60, "keep the judge under 60 characters").optional(),
});

/** /api/workspaces/:slug/comparisons */
export function comparisonRoutes(db: Database, jobs: ComparisonJobControl): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Reading comparisons");
  const idOf = (value: unknown) => parseIdParam(value, COMPARISON_NOT_FOUND);

  router.get("/", canRead, async (req, res) => {
    res.json(await listComparisons(db, accessOf(req)));
  });

  router.post("/", memberOf(db, "engineer", "Starting comparisons"), async (req, res) => {
    const access = accessOf(req);
    // A saved family (familyRevisionId) becomes the comparison's variant list before it is parsed.
    const input = parseValue(comparisonInputSchema, await resolveFamilyReference(db, access, req.body, false));
    res.status(201).json(await createComparison(db, jobs, access, input));
  });

  // Before /:comparisonId, so that "across" is not read as an id.
  router.get("/across", canRead, async (req, res) => {
    const { judge } = parseQuery(acrossQuerySchema, req);
    res.json(await getComparisonsAcross(db, accessOf(req), judge));
  });

  router.get("/:comparisonId", canRead, async (req, res) => {
    res.json(await getComparison(db, accessOf(req), idOf(req.params.comparisonId)));
  });

  router.post("/:comparisonId/cancel", memberOf(db, "engineer", "Cancelling comparisons"), async (req, res) => {
    res.json(await cancelComparison(db, jobs, accessOf(req), idOf(req.params.comparisonId)));
  });

  router.get("/:comparisonId/result", canRead, async (req, res) => {
    res.type("application/json").send(await getComparisonResultJson(db, accessOf(req), idOf(req.params.comparisonId)));
  });

  router.get("/:comparisonId/responses", canRead, async (req, res) => {
    const { variant } = parseQuery(responsesQuerySchema, req);
    res.json(await getPickResponses(db, accessOf(req), idOf(req.params.comparisonId), variant ?? null));
  });

  return router;
}
