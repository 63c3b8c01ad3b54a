import { familyBoundCurve, planSweep, scoreFamilyBaselines } from "@loopyard/core";
import type {
  Aggregate,
  BaselineDto,
  FrequencyDto,
  Plant,
  ReferencesDto,
  SensitivityWeight,
  SweepDetailDto,
  SweepPlan,
} from "@loopyard/core";
import { limitExceeded, type Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findCandidate } from "./candidate-repository.js";
import { toScoreValue } from "./score-value.js";
import { findStoredReferences, findSweepDetail, storeReferences } from "./sweep-repository.js";
import { loadSweepModels, loadSweepPlan } from "./sweep-evaluation.js";
import { sweepVariantPlant } from "./sweep-variant-plant.js";

import { getSweep } from "./sweep-service.js";

/** A refusal of core (a RangeError or TypeError) as a sentence; anything else is rethrown. */
function refusal(error: unknown): string {
  if (error instanceof RangeError || error instanceof TypeError) return error.message;
  throw error;
}

/**
 * Version of the stored references: raise it when what computeReferences returns changes (a new
 * rule, another bound grid), so that references stored by an earlier version are computed again.
 * 2: bound and baselines over the whole family with the sweep's aggregate, bound over the scenario's horizon.
 */
export const REFERENCES_VERSION = 2;

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
 * The bound curve on the (ISE, effort) plane for the sweep's aggregate over its family (core
 * familyBoundCurve: the variants' LQR bounds combined per the aggregate, over the scenario's horizon,
 * or infinite when the criterion options ask for the infinite horizon) and every published tuning
 * rule (core scoreFamilyBaselines: designed on the first variant, scored on every variant with the
 * sweep's scenario, criteria and criterion options, aggregated like the candidates).
 */
async function computeReferences(db: Database, workspaceId: string, sweep: SweepDetailDto): Promise<ReferencesDto> {
  const setup = await loadSweepPlan(db, sweep.definition);
  const family = [...setup.family];
  const labels = family.map((_, i) => sweep.family[i]?.label ?? `variant ${i + 1}`);
  const aggregate = setup.aggregate;
  const baselinesNote =
    family.length > 1
      ? `Tuning rules designed on the first variant (${labels[0]}), each scored on all ${family.length} variants and combined like the candidates (${aggregateWords(aggregate)}).`
      : undefined;
  return { bound: boundOf(family, labels, setup, aggregate), ...baselinesOf(family, setup, sweep.criteria, aggregate), ...(baselinesNote ? { baselinesNote } : {}) };
}

function aggregateWords(aggregate: Aggregate): string {
  return aggregate.kind === "worst" ? "worst case" : aggregate.kind === "mean" ? "mean" : `${aggregate.p}th percentile`;
}

function boundOf(family: Plant[], labels: string[], setup: SweepPlan, aggregate: Aggregate): ReferencesDto["bound"] {
  if (family.every((plant) => plant.kind === "nonlinear")) {
    return { ok: false, reason: family.length > 1 ? "The bound needs linear plants; every variant is nonlinear." : "The bound needs a linear plant; this plant is nonlinear.", points: [] };
  }
  const horizon = setup.evaluation.criterion?.horizon === "infinite" ? "infinite" : setup.scenario.horizon;
  try {
    const curve = familyBoundCurve(family, setup.scenario, aggregate, { horizon, labels });
    if (!curve.ok) return { ok: false, reason: `No bound for this ${family.length > 1 ? "family" : "plant"}: ${curve.reason}.`, points: [] };
    return { ok: true, points: curve.points.map(({ ratio, ise, effort }) => ({ ratio, ise, effort })), note: curve.note };
  } catch (error) {
    return { ok: false, reason: `No bound for this sweep: ${refusal(error)}.`, points: [] };
  }
}

function baselinesOf(family: Plant[], plan: SweepPlan, criteria: SweepDetailDto["criteria"], aggregate: Aggregate): Pick<ReferencesDto, "baselines" | "skipped"> {
  let scored: ReturnType<typeof scoreFamilyBaselines>;
  try {
    scored = scoreFamilyBaselines(family, plan.scenario, criteria, aggregate, { evaluation: plan.evaluation });
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
 * |S|, |T| (and 1/|W| when the sweep's criterion options hold a weight) of one candidate's loop on one
 * variant of the family (the first by default), from core frequencyResponse on
 * loopTransferFunction(plant, controller), the controller rebuilt as the runner evaluated it.
 * Linear plants only (400 otherwise). The adaptive grid is thinned to about
 * MAX_FREQUENCY_POINTS log-spaced points, keeping the peaks of |S| and |T|. Computed on the
 * server's compute pool under a time limit (422 past it).
 */
export async function getCandidateFrequency(
  db: Database,
  compute: Compute,
  access: MemberAccess,
  sweepId: string,
  index: number,
  variant = 0,
): Promise<FrequencyDto> {
  const sweep = await getSweep(db, access, sweepId);
  const models = await loadSweepModels(db, sweep.definition);
  const plant = sweepVariantPlant(planSweep(sweep.definition, models), variant);
  if (plant.kind === "nonlinear") {
    throw badRequest("The frequency response needs a linear plant; this sweep's plant is nonlinear, so only its time response can be shown.");
  }
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) throw notFound(`This sweep has no evaluated candidate ${index}.`);
  const weight = sweepWeight(sweep);
  const outcome = await compute.run("candidateFrequency", { definition: sweep.definition, models, params: stored.params, variant, ...(weight ? { weight } : {}) });
  if (!outcome.ok) {
    throw (
      limitExceeded(outcome, "The frequency response of this candidate", "choose another candidate.") ??
      new HttpError(409, `The frequency response of this candidate could not be computed (${outcome.reason}); choose another candidate.`)
    );
  }
  return { index, status: stored.status, ...outcome.value };
}

/** The sensitivity weight of the sweep's criterion options, when the definition carries one. */
function sweepWeight(sweep: SweepDetailDto): SensitivityWeight | undefined {
  const options = sweep.definition.criterionOptions as { weight?: SensitivityWeight } | undefined;
  return options?.weight;
}
