import { planSweep } from "@loopyard/core";
import type { FrequencyDto, ReferencesDto, SensitivityWeight, SweepDetailDto } from "@loopyard/core";
import { limitExceeded, type Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findCandidate } from "./candidate-repository.js";
import { findStoredReferences, findSweepDetail, storeReferences } from "./sweep-repository.js";
import { loadSweepModels } from "./sweep-evaluation.js";
import { sweepVariantPlant } from "./sweep-variant-plant.js";

import { getSweep } from "./sweep-service.js";

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
export async function getReferences(db: Database, compute: Compute, access: MemberAccess, sweepId: string): Promise<ReferencesDto> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = (await findStoredReferences(db, sweep.id)) as StoredReferences | null;
  if (stored?.version === REFERENCES_VERSION) return stored.references;
  const { references, store } = await computeReferences(db, compute, sweep);
  if (store) await storeReferences(db, sweep.id, { version: REFERENCES_VERSION, references } satisfies StoredReferences);
  return references;
}

/**
 * Computes and stores a new sweep's references (a few hundred milliseconds of Riccati solves and
 * baseline simulations, on the compute pool), so that its page finds them ready. Called without waiting for it after the
 * sweep was created; if it fails, the first request computes them and says why.
 */
export async function prepareReferences(db: Database, compute: Compute, workspaceId: string, sweepId: string): Promise<void> {
  const sweep = await findSweepDetail(db, workspaceId, sweepId);
  if (!sweep) return;
  const { references, store } = await computeReferences(db, compute, sweep);
  if (store) await storeReferences(db, sweepId, { version: REFERENCES_VERSION, references } satisfies StoredReferences);
}

/**
 * The bound curve and the tuning rules' baselines (core's sweepReferences compute task), on the
 * server's compute pool under a work budget and time limit. A budget that runs out is stored as the
 * references' reason (it would run out again); a time limit that passes is a 422 and is not stored
 * (the server may only have been busy).
 */
async function computeReferences(db: Database, compute: Compute, sweep: SweepDetailDto): Promise<{ references: ReferencesDto; store: boolean }> {
  const models = await loadSweepModels(db, sweep.definition);
  const labels = models.map((_, i) => sweep.family[i]?.label ?? `variant ${i + 1}`);
  const outcome = await compute.run("sweepReferences", { definition: sweep.definition, models, labels, criteria: [...sweep.criteria] });
  if (outcome.ok) return { references: outcome.value, store: true };
  const limited = limitExceeded(outcome, "Computing the references of this sweep", "its front is still shown without them.");
  if (!limited) throw new HttpError(409, `The references of this sweep could not be computed (${outcome.reason}).`);
  if (outcome.kind === "time") throw limited;
  return {
    references: {
      bound: { ok: false, reason: limited.message, points: [] },
      baselines: [],
      skipped: [{ rule: "all", variant: "", label: "Tuning rules", reason: limited.message }],
    },
    store: true,
  };
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
