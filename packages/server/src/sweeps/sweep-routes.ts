import { Router, type Request, type Response } from "express";
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
  frontWithCandidates,
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
import { pointsBinaryOf, pointsJsonOf } from "./sweep-points-service.js";
import { getCandidateSheet, sheetQuerySchema } from "../deployment/sheet-service.js";
import { cachedAnswer, sendAnswer, type CachedAnswer } from "../http/answer-cache.js";
import { finishedSweepAnswer, finishedSweepKey } from "./finished-sweep-answers.js";

const JSON_TYPE = "application/json; charset=utf-8";

/** A kept answer of a finished sweep with its ETag (or 304); an unfinished sweep's answer as it is, not stored by the browser. */
function send(req: Request, res: Response, found: { answer: CachedAnswer; finished: boolean }): void {
  if (found.finished) sendAnswer(req, res, found.answer);
  else res.type(found.answer.type).send(found.answer.body);
}
import { resolveFamilyReference } from "../families/family-reference.js";

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
function parseSweepBody(body: unknown): SweepInputParsed {
  if (body === undefined) throw new HttpError(400, "Send the request body as JSON with the header Content-Type: application/json.");
  const result = sweepInputSchema.safeParse(body);
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
    const access = accessOf(req);
    // A saved family (familyRevisionId) becomes the definition's variant list before it is parsed.
    const input = parseSweepBody(await resolveFamilyReference(db, access, req.body, true));
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

  // A finished sweep's front and points never change: computed once, kept (finished-sweep-answers.ts), sent with an ETag.
  router.get("/:sweepId/front", canRead, async (req, res) => {
    const query = parseQuery(frontQuerySchema, req);
    const access = accessOf(req);
    const sweepId = sweepIdOf(req.params.sweepId);
    const key = finishedSweepKey(access.workspace.id, sweepId, "front", [query.x, query.y, query.criteria]);
    const found = await finishedSweepAnswer(key, async () => {
      const sweep = await getSweep(db, access, sweepId);
      const front = await frontWithCandidates(db, sweep, query);
      return { answer: cachedAnswer(JSON.stringify(front), JSON_TYPE), finished: sweep.status === "finished" };
    });
    send(req, res, found);
  });

  // PointsDto: the chart's cloud in columns, a few MB for 10⁵ candidates instead of the full list.
  // The same in binary (core POINTS_BINARY_TYPE) when the client asks for it first: exact numbers, nothing printed.
  router.get("/:sweepId/points", canRead, async (req, res) => {
    const { x, y } = parseQuery(frontQuerySchema, req);
    const access = accessOf(req);
    const sweepId = sweepIdOf(req.params.sweepId);
    const binary = req.accepts(["application/json", POINTS_BINARY_TYPE]) === POINTS_BINARY_TYPE;
    const key = finishedSweepKey(access.workspace.id, sweepId, binary ? "points.bin" : "points.json", [x, y]);
    const found = await finishedSweepAnswer(key, async () => {
      const sweep = await getSweep(db, access, sweepId);
      const answer = binary
        ? cachedAnswer(Buffer.from(await pointsBinaryOf(db, sweep, { x, y })), POINTS_BINARY_TYPE)
        : cachedAnswer(await pointsJsonOf(db, sweep, { x, y }), JSON_TYPE);
      return { answer, finished: sweep.status === "finished" };
    });
    res.vary("Accept");
    send(req, res, found);
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
