import { Router } from "express";
import type pg from "pg";
import type { Database } from "../db/database.js";
import { parseIdParam } from "../http/validation.js";
import { SWEEP_NOT_FOUND } from "../sweeps/sweep-service.js";
import { COMPARISON_NOT_FOUND } from "../comparisons/comparison-service.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { streamCandidatesCsv } from "./candidates-csv.js";
import { crossScoreCsv } from "./cross-score-csv.js";

/** /api/workspaces/:slug — CSV exports of sweeps and comparisons (streamed from PostgreSQL where large). */
export function exportRoutes(db: Database, pool: pg.Pool): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Exporting results");

  router.get("/sweeps/:sweepId/candidates.csv", canRead, async (req, res) => {
    await streamCandidatesCsv(db, pool, accessOf(req), parseIdParam(req.params.sweepId, SWEEP_NOT_FOUND), res);
  });

  router.get("/comparisons/:comparisonId/cross-score.csv", canRead, async (req, res) => {
    const { file, text } = await crossScoreCsv(db, accessOf(req), parseIdParam(req.params.comparisonId, COMPARISON_NOT_FOUND));
    res.type("text/csv; charset=utf-8").attachment(file).send(text);
  });

  return router;
}
