import { Router, type Request } from "express";
import { z } from "zod";
import { firstSweepIssue, POINTS_BINARY_TYPE, sweepInputSchema, sweepIssues } from "@loopyard/core";
import type { SweepInputParsed } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { HttpError } from "../http/http-error.js";
import { parseIdParam, parseQuery, pathParam } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import {
  cancelSweep,
  createSweep,
  getCandidateResponse,
  getFront,
  getSweep,
  getCandidate,
  listCandidatesJson,
  listSweeps,
  SWEEP_NOT_FOUND,
  type SweepLimits,
  type SweepJobControl,
} from "./sweep-service.js";
import { getCandidateFrequency, getReferences, prepareReferences } from "./sweep-reference-service.js";
import type { BackgroundTasks } from "../http/background-tasks.js";
import { getPointsBinary, getPointsJson } from "./sweep-points-service.js";
import { getCandidateSheet, sheetQuerySchema } from "../deployment/sheet-service.js";

const frontQuerySchema = z.object({
  x: z.string({ error: "give one criterion" }).optional(),
  y: z.string({ error: "give one criterion" }).optional(),
  criteria: z.string({ error: "list criteria separated by commas" }).optional(),
});

/** ?variant=k: which variant of the family a candidate's response or |S|, |T| is computed on (0, the first, by default). */
const variantQuerySchema = z.object({
  variant: z.coerce.number({ error: "give a variant number" }).int({ error: "give a whole variant number from 0" }).min(0, { error: "variants are numbered from 0" }).optional(),
});

function candidateIndex(param: string | string[] | undefined): number {
  const value = pathParam(param);
  const index = Number(value);
  if (!Number.isInteger(index) || index < 0 || String(index) !== value) {
    throw new HttpError(404, `“${value}” is not a candidate index; indices are whole numbers from 0.`);
  }
  return index;
}

/**
 * The sweep definition of a POST body, or a 400 with core's sentence for its first problem
 * (firstSweepIssue): the words the web form shows at the field and the CLI prints.
 */
function parseSweepBody(req: Request): SweepInputParsed {
  if (req.body === undefined) throw new HttpError(400, "Send the request body as JSON with the header Content-Type: application/json.");
  const result = sweepInputSchema.safeParse(req.body);
  if (result.success) return result.data;
  const first = firstSweepIssue(result.error);
  const issues = sweepIssues(result.error).map((i) => ({ field: i.field, message: i.sentence }));
  throw new HttpError(400, first.sentence, first.field ? { field: first.field, issues } : { issues });
}

/** /api/workspaces/:slug/sweeps */
export function sweepRoutes(db: Database, jobs: SweepJobControl, limits: SweepLimits, background: BackgroundTasks, compute: Compute): Router {
  const router = Router({ mergeParams: true });
  const canRead = memberOf(db, "viewer", "Reading sweeps");
  const sweepIdOf = (value: unknown) => parseIdParam(value, SWEEP_NOT_FOUND);

  router.get("/", canRead, async (req, res) => {
    res.json(await listSweeps(db, accessOf(req)));
  });

  router.post("/", memberOf(db, "engineer", "Starting sweeps"), async (req, res) => {
    const input = parseSweepBody(req);
    const access = accessOf(req);
    const created = await createSweep(db, jobs.start, access, input, limits);
    res.status(201).json(created);
    // The bound and the baselines follow from the definition: ready by the time the sweep has results.
    background.run(`computing the references of sweep ${created.id}`, () => prepareReferences(db, compute, access.workspace.id, created.id));
  });

  router.post("/:sweepId/cancel", memberOf(db, "engineer", "Cancelling sweeps"), async (req, res) => {
    res.json(await cancelSweep(db, jobs.cancel, accessOf(req), sweepIdOf(req.params.sweepId)));
  });

  router.get("/:sweepId", canRead, async (req, res) => {
    res.json(await getSweep(db, accessOf(req), sweepIdOf(req.params.sweepId)));
  });

  // CandidateListDto, written as JSON text from PostgreSQL's arrays (10⁵ candidates in well under a second).
  router.get("/:sweepId/candidates", canRead, async (req, res) => {
    res.type("application/json").send(await listCandidatesJson(db, accessOf(req), sweepIdOf(req.params.sweepId)));
  });

  router.get("/:sweepId/candidates/:index", canRead, async (req, res) => {
    const index = candidateIndex(req.params.index);
    res.json(await getCandidate(db, accessOf(req), sweepIdOf(req.params.sweepId), index));
  });

  router.get("/:sweepId/front", canRead, async (req, res) => {
    const query = parseQuery(frontQuerySchema, req);
    res.json(await getFront(db, accessOf(req), sweepIdOf(req.params.sweepId), query));
  });

  // PointsDto: the chart's cloud in columns, a few MB for 10⁵ candidates instead of the full list.
  // The same in binary (core POINTS_BINARY_TYPE) when the client asks for it first: exact numbers, nothing printed.
  router.get("/:sweepId/points", canRead, async (req, res) => {
    const { x, y } = parseQuery(frontQuerySchema, req);
    const sweepId = sweepIdOf(req.params.sweepId);
    if (req.accepts(["application/json", POINTS_BINARY_TYPE]) === POINTS_BINARY_TYPE) {
      res.type(POINTS_BINARY_TYPE).send(Buffer.from(await getPointsBinary(db, accessOf(req), sweepId, { x, y })));
    } else {
      res.type("application/json").send(await getPointsJson(db, accessOf(req), sweepId, { x, y }));
    }
  });

  router.get("/:sweepId/candidates/:index/response", canRead, async (req, res) => {
    const index = candidateIndex(req.params.index);
    const { variant } = parseQuery(variantQuerySchema, req);
    res.json(await getCandidateResponse(db, compute, accessOf(req), sweepIdOf(req.params.sweepId), index, variant));
  });

  router.get("/:sweepId/references", canRead, async (req, res) => {
    res.json(await getReferences(db, compute, accessOf(req), sweepIdOf(req.params.sweepId)));
  });

  router.get("/:sweepId/candidates/:index/frequency", canRead, async (req, res) => {
    const index = candidateIndex(req.params.index);
    const { variant } = parseQuery(variantQuerySchema, req);
    res.json(await getCandidateFrequency(db, compute, accessOf(req), sweepIdOf(req.params.sweepId), index, variant));
  });

  // DeploymentSheetDto: the candidate's controller in the forms firmware needs (?sampleTime=&method=&format=).
  router.get("/:sweepId/candidates/:index/sheet", canRead, async (req, res) => {
    const index = candidateIndex(req.params.index);
    const query = parseQuery(sheetQuerySchema, req);
    res.json(await getCandidateSheet(db, compute, accessOf(req), sweepIdOf(req.params.sweepId), index, query));
  });

  return router;
}
