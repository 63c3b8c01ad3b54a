import { boundCurve, controllerFromVector, frequencyResponse, loopTransferFunction, scoreBaselines } from "@loopyard/core";
import type {
  BaselineDto,
  FrequencyDto,
  FrequencyResponse,
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
import { sweepSetup, tunableFromParams, type SweepSetup } from "./sweep-plan.js";
import { getSweep } from "./sweep-service.js";
import { sweepVariantPlant } from "./sweep-variant-plant.js";

/** Most frequencies sent per curve: the adaptive grid thinned to about this many log-spaced points. */
export const MAX_FREQUENCY_POINTS = 600;
/**
 * The plotted band ends one decade above where |L| first stays below this level for good: beyond,
 * |S| = 1 and |T| = |L| to plotting accuracy (a strictly proper loop; common practice).
 */
export const PLOT_TAIL_GAIN = 1e-4;

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
  const setup = sweepSetup(sweep.definition);
  return { bound: boundOf(plant, setup.scenario), ...baselinesOf(plant, setup, sweep.criteria) };
}

function boundOf(plant: Plant, scenario: SweepSetup["scenario"]): ReferencesDto["bound"] {
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

function baselinesOf(plant: Plant, plan: SweepSetup, criteria: SweepDetailDto["criteria"]): Pick<ReferencesDto, "baselines" | "skipped"> {
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
 * |S|, |T| (and 1/|W| when the sweep's criterion options hold a weight) of one candidate's loop on one
 * variant of the family (the first by default), from core frequencyResponse on
 * loopTransferFunction(plant, controller), the controller rebuilt as the runner evaluated it.
 * Linear plants only (400 otherwise). The adaptive grid is thinned to about
 * MAX_FREQUENCY_POINTS log-spaced points, keeping the peaks of |S| and |T|.
 */
export async function getCandidateFrequency(db: Database, access: MemberAccess, sweepId: string, index: number, variant = 0): Promise<FrequencyDto> {
  const sweep = await getSweep(db, access, sweepId);
  const plant = await sweepVariantPlant(db, access.workspace.id, sweep, variant);
  if (plant.kind === "nonlinear") {
    throw badRequest("The frequency response needs a linear plant; this sweep's plant is nonlinear, so only its time response can be shown.");
  }
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) throw notFound(`This sweep has no evaluated candidate ${index}.`);
  const plan = sweepSetup(sweep.definition);
  const controller = controllerFromVector(plan.structure, tunableFromParams(plan, sweep.parameters, stored.params));
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

/** Magnitudes on a thinned log grid over the band where the loop matters. */
export function thinFrequencyResponse(response: FrequencyResponse): Omit<FrequencyDto, "index" | "status"> {
  const { omega, S, T, L, weightMagnitude } = response;
  const n = omega.length;
  const mag = (c: { re: Float64Array; im: Float64Array }, i: number) => Math.hypot(c.re[i] as number, c.im[i] as number);
  // Last index where |L| ≥ PLOT_TAIL_GAIN, then one decade more.
  let last = n - 1;
  for (let i = n - 1; i >= 0; i--) {
    if (mag(L, i) >= PLOT_TAIL_GAIN) {
      last = i;
      break;
    }
  }
  const upper = (omega[last] as number) * 10;
  while (last < n - 1 && (omega[last + 1] as number) <= upper) last++;
  const lo = Math.log(omega[0] as number);
  const step = (Math.log(omega[last] as number) - lo) / (MAX_FREQUENCY_POINTS - 1);
  const keep = new Set<number>([0, last]);
  let next = lo;
  for (let i = 0; i <= last; i++) {
    if (Math.log(omega[i] as number) >= next) {
      keep.add(i);
      next = Math.log(omega[i] as number) + step;
    }
  }
  // Keep the peaks so that the plotted maxima are the true Ms and Mt.
  let peakS = 0;
  let peakT = 0;
  for (let i = 0; i <= last; i++) {
    if (mag(S, i) > mag(S, peakS)) peakS = i;
    if (mag(T, i) > mag(T, peakT)) peakT = i;
  }
  keep.add(peakS).add(peakT);
  const indices = [...keep].sort((a, b) => a - b);
  const result: Omit<FrequencyDto, "index" | "status"> = {
    omega: indices.map((i) => omega[i] as number),
    S: indices.map((i) => mag(S, i)),
    T: indices.map((i) => mag(T, i)),
  };
  if (weightMagnitude) result.invW = indices.map((i) => 1 / (weightMagnitude[i] as number));
  return result;
}
