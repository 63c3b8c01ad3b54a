import { aggregateScores, BATCH_STATUSES, controllerFromVector, planSweep, SweepPlanError } from "@loopyard/core";
import type {
  ComparisonAnalysis,
  ComparisonInput,
  ComparisonPick,
  Controller,
  CriterionId,
  DecisionContent,
  DecisionRecordVariant,
  DecisionSource,
  Plant,
  ScoreValue,
  SweepDetailDto,
  SweepInputParsed,
} from "@loopyard/core";
import { limitExceeded, type Compute } from "../compute/compute.js";
import { ComparisonDefinitionError, loadPlan, storedInput } from "../comparisons/comparison-engine.js";
import { findComparisonInWorkspace, loadResult } from "../comparisons/comparison-repository.js";
import type { Database } from "../db/database.js";
import { badRequest, HttpError } from "../http/http-error.js";
import { findCandidate } from "../sweeps/candidate-repository.js";
import { toScoreValue } from "../sweeps/score-value.js";
import { definitionVariants } from "../sweeps/sweep-evaluation.js";
import { findSweepDetail } from "../sweeps/sweep-repository.js";
import { controllerParameters } from "./decision-controller.js";
import { decisionFamilyKey } from "./decision-family.js";
import { findRevisionsForRecord, type RecordRevision } from "./decision-repository.js";

/** What a proposal rests on, resolved from its source: the snapshot stored with it and what it pins. */
export interface ResolvedSource {
  content: DecisionContent;
  familyKey: string;
  /** The plant revisions of the family (pinned: not deletable while the decision stands). */
  revisionIds: string[];
  sweepId: string | null;
  comparisonId: string | null;
}

/**
 * Resolves a proposal's source into the content of its record, from what is already stored: a
 * sweep candidate's stored scores per variant, a finished comparison's stored pick (its registry
 * criteria per variant and its cross-score row), or — for a baseline — the rule's controller scored
 * on every variant on the server's compute pool (core baselineScores, under a work budget and time
 * limit). A source that does not exist in this workspace, or cannot be proposed, is a 400 naming
 * the field; a comparison that has not finished a 409.
 */
export async function resolveSource(db: Database, compute: Compute, workspaceId: string, source: DecisionSource): Promise<ResolvedSource> {
  switch (source.kind) {
    case "sweep-candidate":
      return fromSweepCandidate(db, workspaceId, source);
    case "baseline":
      return fromBaseline(db, compute, workspaceId, source);
    case "comparison-pick":
      return fromComparisonPick(db, workspaceId, source);
  }
}

async function sweepOf(db: Database, workspaceId: string, sweepId: string): Promise<SweepDetailDto> {
  const sweep = await findSweepDetail(db, workspaceId, sweepId);
  if (!sweep) throw badRequest("source.sweepId: there is no such sweep in this workspace", "source.sweepId");
  return sweep;
}

/** The family's revisions with their plants, in family order; a 409 when one no longer exists. */
async function recordRevisions(db: Database, revisionIds: readonly string[]): Promise<RecordRevision[]> {
  const found = await findRevisionsForRecord(db, revisionIds);
  return revisionIds.map((id) => {
    const revision = found.get(id);
    if (!revision) throw new HttpError(409, "A plant revision of this study no longer exists, so it cannot be proposed.");
    return revision;
  });
}

function recordVariant(revision: RecordRevision, label: string, parameters: Record<string, number> | undefined): DecisionRecordVariant {
  return {
    label,
    plantId: revision.plantId,
    plantName: revision.plantName,
    revisionId: revision.id,
    revisionNumber: revision.number,
    revisionName: revision.name,
    unitsNote: revision.unitsNote,
    model: revision.model,
    ...(parameters && Object.keys(parameters).length > 0 ? { parameters } : {}),
  };
}

/** The family of a sweep: its variants' revisions with models, labelled as the sweep's page labels them. */
async function sweepFamily(db: Database, sweep: SweepDetailDto): Promise<{ variants: DecisionRecordVariant[]; models: Plant[] }> {
  const variants = definitionVariants(sweep.definition);
  const revisions = await recordRevisions(
    db,
    variants.map((v) => v.plantRevisionId),
  );
  return {
    variants: variants.map((v, i) => recordVariant(revisions[i] as RecordRevision, sweep.family[i]?.label ?? (revisions[i] as RecordRevision).name, v.parameters)),
    models: revisions.map((r) => r.model),
  };
}

function sweepEvaluation(definition: SweepInputParsed): DecisionContent["evaluation"] {
  return {
    aggregate: definition.aggregate ?? { kind: "worst" },
    ...(definition.criterionOptions !== undefined ? { criterionOptions: definition.criterionOptions } : {}),
  };
}

function finiteParameters(names: readonly string[], values: readonly number[]): Record<string, number> {
  const out: Record<string, number> = {};
  names.forEach((name, i) => {
    const value = values[i];
    if (typeof value === "number" && Number.isFinite(value)) out[name] = value;
  });
  return out;
}

function planFor(definition: SweepInputParsed, models: Plant[]) {
  try {
    return planSweep(definition, models);
  } catch (error) {
    if (error instanceof SweepPlanError) throw new HttpError(409, `This sweep can no longer be planned (${error.message}), so its designs cannot be proposed.`);
    throw error;
  }
}

async function fromSweepCandidate(db: Database, workspaceId: string, source: Extract<DecisionSource, { kind: "sweep-candidate" }>): Promise<ResolvedSource> {
  const sweep = await sweepOf(db, workspaceId, source.sweepId);
  const stored = await findCandidate(db, sweep.id, source.candidateIndex, sweep.criteria.length);
  if (!stored) {
    throw badRequest(`source.candidateIndex: this sweep has no stored candidate ${source.candidateIndex}; choose one from its front or its chart`, "source.candidateIndex");
  }
  if (stored.status !== "stable" || stored.scores === null) {
    throw badRequest(
      `source.candidateIndex: candidate ${source.candidateIndex} is ${stored.status} on ${sweep.family.length > 1 ? "some variant" : "this plant"}; propose a candidate that is stable on every variant`,
      "source.candidateIndex",
    );
  }
  const { variants, models } = await sweepFamily(db, sweep);
  const plan = planFor(sweep.definition, models);
  const controller = plan.controllerFromParameters(stored.params);
  const perVariant = stored.variantScores ?? [stored.scores];
  const content: DecisionContent = {
    sourceLabel: `candidate ${source.candidateIndex} of sweep “${sweep.name}”`,
    sweep: { id: sweep.id, name: sweep.name },
    comparison: null,
    family: { key: decisionFamilyKey(variants.map((v) => v.revisionId)), name: sweep.definition.family?.name ?? null, variants },
    structure: { kind: controller.kind, parameters: finiteParameters(sweep.parameters, stored.params), tuned: [...sweep.swept], controller },
    scenario: sweep.definition.scenario,
    evaluation: sweepEvaluation(sweep.definition),
    criteria: [...sweep.criteria],
    scores: {
      variants: variants.map((v, f) => {
        const scores = perVariant[f] ?? null;
        return { label: v.label, status: scores === null ? stored.status : "stable", scores };
      }),
      aggregate: stored.scores,
    },
  };
  return pinned(content, sweep.id, null);
}

async function fromBaseline(db: Database, compute: Compute, workspaceId: string, source: Extract<DecisionSource, { kind: "baseline" }>): Promise<ResolvedSource> {
  const sweep = await sweepOf(db, workspaceId, source.sweepId);
  const { variants, models } = await sweepFamily(db, sweep);
  planFor(sweep.definition, models);
  const outcome = await compute.run("baselineScores", { definition: sweep.definition, models, rule: source.rule, variant: source.variant });
  if (!outcome.ok) {
    const limited = limitExceeded(outcome, "Scoring this tuning rule on every variant", "propose a candidate of the sweep instead.");
    if (limited) throw limited;
    throw badRequest(outcome.reason.startsWith("source.") ? outcome.reason : `source.rule: ${outcome.reason}`, "source.rule");
  }
  const scored = outcome.value;
  const controller: Controller = scored.controller;
  const content: DecisionContent = {
    sourceLabel: `${scored.label} beside sweep “${sweep.name}”`,
    sweep: { id: sweep.id, name: sweep.name },
    comparison: null,
    family: { key: decisionFamilyKey(variants.map((v) => v.revisionId)), name: sweep.definition.family?.name ?? null, variants },
    structure: { kind: controller.kind, parameters: controllerParameters(controller), tuned: [], controller },
    scenario: sweep.definition.scenario,
    evaluation: sweepEvaluation(sweep.definition),
    criteria: scored.criteria,
    scores: {
      variants: variants.map((v, f) => {
        const run = scored.variants[f];
        return { label: v.label, status: run?.status ?? "diverged", scores: run?.scores ? run.scores.map(toScoreValue) : null };
      }),
      aggregate: scored.aggregate ? scored.aggregate.map(toScoreValue) : null,
    },
  };
  if (content.scores.aggregate === null) {
    throw badRequest(`source.rule: ${scored.label} is not stable on every variant of this sweep's family; propose another design`, "source.rule");
  }
  return pinned(content, sweep.id, null);
}

async function fromComparisonPick(db: Database, workspaceId: string, source: Extract<DecisionSource, { kind: "comparison-pick" }>): Promise<ResolvedSource> {
  const record = await findComparisonInWorkspace(db, workspaceId, source.comparisonId);
  if (!record) throw badRequest("source.comparisonId: there is no such comparison in this workspace", "source.comparisonId");
  if (record.status !== "finished") {
    throw new HttpError(409, `The comparison “${record.name}” is ${record.status}; its picks can be proposed once it has finished.`);
  }
  const result = await loadResult<ComparisonAnalysis>(db, record.id);
  if (!result) throw new HttpError(409, `The comparison “${record.name}” finished without a stored result; start it again.`);
  const row = result.picks.findIndex((p) => p.contender === source.contender);
  const pick = result.picks[row];
  if (!pick) {
    const keys = result.picks.map((p) => p.contender).join(", ");
    throw badRequest(`source.contender: the comparison has no contender “${source.contender}”; choose one of ${keys}`, "source.contender");
  }
  if (!pick.found || pick.vector.length === 0) {
    throw badRequest(`source.contender: ${source.contender} has no pick in this comparison (${pick.reason ?? "none was feasible"})`, "source.contender");
  }
  const input: ComparisonInput = storedInput(record.definition);
  let plan;
  try {
    plan = await loadPlan(db, input);
  } catch (error) {
    if (error instanceof ComparisonDefinitionError) throw new HttpError(409, `The comparison can no longer be planned (${error.message}), so its picks cannot be proposed.`);
    throw error;
  }
  const controller = controllerFromVector(plan.setup.structure, Float64Array.from(pick.vector));
  const revisions = await recordRevisions(
    db,
    input.family.variants.map((v) => v.plantRevisionId),
  );
  const variants = input.family.variants.map((v, i) => recordVariant(revisions[i] as RecordRevision, plan.variants[i] ?? (revisions[i] as RecordRevision).name, v.parameters));
  const contenders = plan.columns.filter((c) => c.role === "contender").map((c) => c.key);
  const content: DecisionContent = {
    sourceLabel: `the ${source.contender} pick of comparison “${record.name}”`,
    sweep: null,
    comparison: {
      id: record.id,
      name: record.name,
      contender: source.contender,
      contenders,
      judges: plan.columns.filter((c) => c.role === "judge").map((c) => c.key),
      constraints: input.constraints ?? {},
      columns: plan.columns.map((c) => c.key),
      values: (result.crossScore.values[row] ?? pick.aggregates).map(toScoreValue),
      regrets: (result.crossScore.regrets[row] ?? []).map(toScoreValue),
      perVariant: pick.perVariant.map((r) => r.map(toScoreValue)),
      atBound: pick.atBound.map((b) => ({ parameter: b.parameter, bound: b.bound })),
    },
    family: { key: decisionFamilyKey(variants.map((v) => v.revisionId)), name: input.family.name ?? null, variants },
    structure: { kind: controller.kind, parameters: controllerParameters(controller), tuned: [...plan.parameters], controller },
    scenario: input.scenario,
    evaluation: { aggregate: input.aggregate, ...(input.criterionOptions !== undefined ? { criterionOptions: input.criterionOptions } : {}) },
    criteria: [...pick.base.criteria],
    scores: pickScores(pick, variants, plan.aggregate),
  };
  return pinned(content, null, record.id);
}

/** A pick's registry criteria per variant (stored with the pick), and their aggregate over the family (core aggregateScores). */
function pickScores(pick: ComparisonPick, variants: readonly DecisionRecordVariant[], aggregate: Parameters<typeof aggregateScores>[5]): DecisionContent["scores"] {
  const criteria = pick.base.criteria as CriterionId[];
  const nc = criteria.length;
  const F = variants.length;
  const flat = new Float64Array(F * nc);
  const codes = new Uint8Array(F);
  const rows = variants.map((v, f) => {
    const name = pick.status[f] ?? "diverged";
    codes[f] = Math.max(0, BATCH_STATUSES.indexOf(name));
    const status: "stable" | "unstable" | "diverged" = name === "stable" ? "stable" : name === "unstable" ? "unstable" : "diverged";
    const scores = pick.base.scores[f] ?? [];
    criteria.forEach((_, c) => (flat[f * nc + c] = scores[c] ?? Number.NaN));
    return { label: v.label, status, scores: status === "stable" ? criteria.map((_, c) => toScoreValue(scores[c] ?? Number.NaN)) : null };
  });
  const stable = rows.every((r) => r.status === "stable");
  const combined: ScoreValue[] | null = stable ? Array.from(aggregateScores(flat, codes, 1, F, criteria, aggregate), toScoreValue) : null;
  return { variants: rows, aggregate: combined };
}

function pinned(content: DecisionContent, sweepId: string | null, comparisonId: string | null): ResolvedSource {
  return {
    content,
    familyKey: content.family.key,
    revisionIds: [...new Set(content.family.variants.map((v) => v.revisionId))],
    sweepId,
    comparisonId,
  };
}
