import { boundCurve, frequencyResponse, loopTransferFunction, scoreBaselines, thinFrequencyResponse } from "@loopyard/core";
import type {
  BaselineDto,
  EvaluationOptions,
  FrequencyDto,
  FrequencyResponse,
  Scenario,
  LinearPlant,
  Plant,
  ReferencesDto,
  SensitivityWeight,
  SweepDetailDto,
} from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import { findRevisionInWorkspace } from "../plants/plant-repository.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findCandidate } from "./candidate-repository.js";
import { toScoreValue } from "./score-value.js";
import { findStoredReferences, findSweepDetail, storeReferences } from "./sweep-repository.js";
import { loadSweepPlan } from "./sweep-evaluation.js";
import { getSweep } from "./sweep-service.js";

async function sweepPlant(db: Database, workspaceId: string, sweep: SweepDetailDto): Promise<Plant> {
  const revision = await findRevisionInWorkspace(db, workspaceId, sweep.plant.revisionId);
  if (!revision) throw notFound("The plant revision of this sweep no longer exists.");
  return revision.model;
}

/** A refusal of core (a RangeError or TypeError) as a sentence; anything else is rethrown. */
function refusal(error: unknown): string {
  if (error instanceof RangeError || error instanceof TypeError) return error.message;
  throw error;
}

/**
 * Version of the stored references: raise it when what computeReferences returns changes (a new
 * rule, another bound grid), so that references stored by an earlier version are computed again.
 */
export const REFERENCES_VERSION = 1;

interface StoredReferences {
  version: number;
  references: ReferencesDto;
}

/**
 * The references drawn beside a sweep's front (see computeReferences). They follow from the sweep's
 * definition alone, so they are computed once (usually just after the sweep was created, by
 * prepareReferences) and stored with the sweep; a request reads them from there.
 */
export async function getReferences(db: Database, access: MemberAccess, sweepId: string): Promise<ReferencesDto> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = (await findStoredReferences(db, sweep.id)) as StoredReferences | null;
  if (stored?.version === REFERENCES_VERSION) return stored.references;
  const references = await computeReferences(db, access.workspace.id, sweep);
  await storeReferences(db, sweep.id, { version: REFERENCES_VERSION, references } satisfies StoredReferences);
  return references;
}

/**
 * Computes and stores a new sweep's references (a few hundred milliseconds of Riccati solves and
 * baseline simulations), so that its page finds them ready. Called without waiting for it after the
 * sweep was created; if it fails, the first request computes them and says why.
 */
export async function prepareReferences(db: Database, workspaceId: string, sweepId: string): Promise<void> {
  const sweep = await findSweepDetail(db, workspaceId, sweepId);
  if (!sweep) return;
  const references = await computeReferences(db, workspaceId, sweep);
  await storeReferences(db, sweepId, { version: REFERENCES_VERSION, references } satisfies StoredReferences);
}

/**
 * The bound curve on the (ISE, effort) plane from core boundCurve (linear plants; infinite horizon,
 * the sweep's scenario) and every published tuning rule of core scoreBaselines, scored with the
 * sweep's scenario, criteria and criterion options.
 */
async function computeReferences(db: Database, workspaceId: string, sweep: SweepDetailDto): Promise<ReferencesDto> {
  const plant = await sweepPlant(db, workspaceId, sweep);
  const setup = await loadSweepPlan(db, sweep.definition);
  return { bound: boundOf(plant, setup.scenario), ...baselinesOf(plant, setup, sweep.criteria) };
}

function boundOf(plant: Plant, scenario: Scenario): ReferencesDto["bound"] {
  if (plant.kind === "nonlinear") {
    return { ok: false, reason: "The bound needs a linear plant; this plant is nonlinear.", points: [] };
  }
  try {
    const curve = boundCurve(plant, scenario);
    if (!curve.ok) return { ok: false, reason: `No bound for this plant: ${curve.reason}.`, points: [] };
    return { ok: true, points: curve.points.map(({ ratio, ise, effort }) => ({ ratio, ise, effort })) };
  } catch (error) {
    return { ok: false, reason: `No bound for this sweep: ${refusal(error)}.`, points: [] };
  }
}

function baselinesOf(plant: Plant, plan: { scenario: Scenario; evaluation: EvaluationOptions }, criteria: SweepDetailDto["criteria"]): Pick<ReferencesDto, "baselines" | "skipped"> {
  let scored: ReturnType<typeof scoreBaselines>;
  try {
    scored = scoreBaselines(plant, plan.scenario, criteria, { evaluation: plan.evaluation });
  } catch (error) {
    const reason = refusal(error);
    return { baselines: [], skipped: [{ rule: "all", variant: "", label: "Tuning rules", reason }] };
  }
  const baselines: BaselineDto[] = [];
  const skipped: ReferencesDto["skipped"] = [];
  for (const b of scored) {
    if (!b.ok || b.evaluation === null) {
      skipped.push({ rule: b.rule, variant: b.variant, label: b.label, reason: b.ok ? "not evaluated" : b.reason });
      continue;
    }
    const { kp, ki, kd, tf } = b.controller;
    const scores = b.evaluation.scores;
    baselines.push({
      rule: b.rule,
      variant: b.variant,
      label: b.label,
      note: b.note,
      params: { kp, ki, kd, tf },
      status: b.evaluation.status,
      scores: criteria.map((c) => (scores ? toScoreValue(scores[c] as number) : null)),
    });
  }
  return { baselines, skipped };
}

/**
 * |S|, |T| (and 1/|W| when the sweep's criterion options hold a weight) of one candidate's loop,
 * from core frequencyResponse on loopTransferFunction(plant, controller), the controller rebuilt as
 * the runner evaluated it. Linear plants only (400 otherwise). The adaptive grid is thinned to about
 * MAX_FREQUENCY_POINTS log-spaced points, keeping the peaks of |S| and |T|.
 */
export async function getCandidateFrequency(db: Database, access: MemberAccess, sweepId: string, index: number): Promise<FrequencyDto> {
  const sweep = await getSweep(db, access, sweepId);
  const plant = await sweepPlant(db, access.workspace.id, sweep);
  if (plant.kind === "nonlinear") {
    throw badRequest("The frequency response needs a linear plant; this sweep's plant is nonlinear, so only its time response can be shown.");
  }
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) throw notFound(`This sweep has no evaluated candidate ${index}.`);
  const plan = await loadSweepPlan(db, sweep.definition);
  const controller = plan.controllerFromParameters(stored.params);
  const weight = sweepWeight(sweep);
  let response: FrequencyResponse;
  try {
    response = frequencyResponse(loopTransferFunction(plant as LinearPlant, controller), weight ? { weight } : {});
  } catch (error) {
    throw new HttpError(409, `The frequency response of this candidate could not be computed (${refusal(error)}); choose another candidate.`);
  }
  return { index, status: stored.status, ...thinFrequencyResponse(response) };
}

/** The sensitivity weight of the sweep's criterion options, when the definition carries one. */
function sweepWeight(sweep: SweepDetailDto): SensitivityWeight | undefined {
  const options = sweep.definition.criterionOptions as { weight?: SensitivityWeight } | undefined;
  return options?.weight;
}
