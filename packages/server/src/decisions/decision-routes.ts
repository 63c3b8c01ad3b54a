import { Router } from "express";
import { decisionCommentSchema, decisionListQuerySchema, decisionProposalSchema, decisionReturnSchema } from "@loopyard/core";
import { sheetQuerySchema } from "../deployment/sheet-service.js";
import { parseBody, parseIdParam, parseQuery } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { getDecisionPdf, getDecisionSheet } from "./decision-sheet.js";
import {
  approveDecision,
  commentOnDecision,
  DECISION_NOT_FOUND,
  getDecision,
  getDecisionRecord,
  listDecisions,
  proposeDecision,
  returnDecision,
  reviseDecision,
  waitingDecisions,
  withdrawDecision,
  type DecisionDeps,
} from "./decision-service.js";

/**
 * /api/workspaces/:slug/decisions — viewers read; engineers propose, revise their returned
 * proposals, comment and withdraw; leads approve and return. The order of the routes keeps a
 * proposal's own changes (revise, then approve, return, comment, withdraw) apart from its reads.
 */
export function decisionRoutes(deps: DecisionDeps): Router {
  const router = Router({ mergeParams: true });
  const { db } = deps;
  const canRead = memberOf(db, "viewer", "Reading decisions");
  const idOf = (value: unknown) => parseIdParam(value, DECISION_NOT_FOUND);

  router.get("/", canRead, async (req, res) => {
    res.json(await listDecisions(deps, accessOf(req), parseQuery(decisionListQuerySchema, req)));
  });

  router.post("/", memberOf(db, "engineer", "Proposing designs"), async (req, res) => {
    const body = parseBody(decisionProposalSchema, req);
    res.status(201).json(await proposeDecision(deps, accessOf(req), body));
  });

  // Before /:decisionId, so that "waiting" is not read as an id.
  router.get("/waiting", canRead, async (req, res) => {
    res.json(await waitingDecisions(deps, accessOf(req)));
  });

  router.get("/:decisionId", canRead, async (req, res) => {
    res.json(await getDecision(deps, accessOf(req), idOf(req.params.decisionId)));
  });

  router.put("/:decisionId", memberOf(db, "engineer", "Revising proposals"), async (req, res) => {
    const body = parseBody(decisionProposalSchema, req);
    res.json(await reviseDecision(deps, accessOf(req), idOf(req.params.decisionId), body));
  });

  router.post("/:decisionId/approve", memberOf(db, "lead", "Approving decisions"), async (req, res) => {
    res.json(await approveDecision(deps, accessOf(req), idOf(req.params.decisionId)));
  });

  router.post("/:decisionId/return", memberOf(db, "lead", "Returning proposals"), async (req, res) => {
    const { comment } = parseBody(decisionReturnSchema, req);
    res.json(await returnDecision(deps, accessOf(req), idOf(req.params.decisionId), comment));
  });

  router.post("/:decisionId/comments", memberOf(db, "engineer", "Commenting on proposals"), async (req, res) => {
    const { comment } = parseBody(decisionCommentSchema, req);
    res.status(201).json(await commentOnDecision(deps, accessOf(req), idOf(req.params.decisionId), comment));
  });

  router.post("/:decisionId/withdraw", memberOf(db, "engineer", "Withdrawing proposals"), async (req, res) => {
    res.json(await withdrawDecision(deps, accessOf(req), idOf(req.params.decisionId)));
  });

  router.get("/:decisionId/record.json", canRead, async (req, res) => {
    const id = idOf(req.params.decisionId);
    const record = await getDecisionRecord(deps, accessOf(req), id);
    res.setHeader("Content-Disposition", `attachment; filename="decision-${id}.json"`);
    res.json(record);
  });

  // The record as a PDF: parameters, scores per variant, step responses and |S| as vector plots, the audit trail.
  router.get("/:decisionId/record.pdf", canRead, async (req, res) => {
    const { filename, pdf } = await getDecisionPdf(deps, accessOf(req), idOf(req.params.decisionId));
    res.type("application/pdf").setHeader("Content-Disposition", `attachment; filename="${filename}"`);
    res.send(pdf);
  });

  // DeploymentSheetDto of the decision's controller (?sampleTime=&method=tustin|backward-euler&format=q15|q31).
  router.get("/:decisionId/sheet", canRead, async (req, res) => {
    const query = parseQuery(sheetQuerySchema, req);
    res.json(await getDecisionSheet(deps, accessOf(req), idOf(req.params.decisionId), query));
  });

  return router;
}
