import { controllerFromVector, CRITERION_IDS, IllPosedLoopError, orientForMinimisation, paretoFront, simulateLoop, sweepCandidateCount } from "@loopyard/core";
import type {
  CandidateListDto,
  CriterionId,
  FrontDto,
  ResponseDto,
  SweepDetailDto,
  SweepInputParsed,
  SweepSummaryDto,
} from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import { findRevisionInWorkspace } from "../plants/plant-repository.js";
import { downsampleIndices, pick } from "../traces/downsample.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findCandidate, listCandidates as listStoredCandidates } from "./candidate-repository.js";
import { fromScoreValue } from "./score-value.js";
import { structureProblem, sweepPlan, tunableFromParams } from "./sweep-plan.js";
import { findSweepDetail, insertSweep, listSweepSummaries } from "./sweep-repository.js";
import type { SweepRunner } from "./sweep-runner.js";

export const SWEEP_NOT_FOUND = "There is no such sweep in this workspace.";

export async function listSweeps(db: Database, access: MemberAccess): Promise<SweepSummaryDto[]> {
  return listSweepSummaries(db, access.workspace.id);
}

export async function getSweep(db: Database, access: MemberAccess, sweepId: string): Promise<SweepDetailDto> {
  const detail = await findSweepDetail(db, access.workspace.id, sweepId);
  if (!detail) throw notFound(SWEEP_NOT_FOUND);
  return detail;
}

/** Stores a queued sweep on a revision of this workspace and hands it to the runner. */
export async function createSweep(
  db: Database,
  runner: SweepRunner,
  access: MemberAccess,
  input: SweepInputParsed,
): Promise<SweepDetailDto> {
  const revision = await findRevisionInWorkspace(db, access.workspace.id, input.plantRevisionId);
  if (!revision) {
    throw badRequest("plantRevisionId: there is no such plant revision in this workspace", "plantRevisionId");
  }
  const problem = structureProblem(sweepPlan(input).structure, revision.model);
  if (problem) throw badRequest(`ranges: ${problem}`, "ranges");
  const sweepId = await insertSweep(db, {
    workspaceId: access.workspace.id,
    createdBy: access.user.id,
    definition: input,
    total: sweepCandidateCount(input),
  });
  runner.enqueue(sweepId);
  return getSweep(db, access, sweepId);
}

export async function listCandidates(db: Database, access: MemberAccess, sweepId: string): Promise<CandidateListDto> {
  const sweep = await getSweep(db, access, sweepId);
  return { parameters: sweep.parameters, criteria: sweep.criteria, candidates: await listStoredCandidates(db, sweepId) };
}

/** Checks that a front axis names one of the sweep's criteria; otherwise a 400 naming the parameter. */
function frontAxis(parameter: "x" | "y", value: string | undefined, criteria: readonly CriterionId[], fallback: CriterionId): CriterionId {
  if (value === undefined || value === "") return fallback;
  if ((criteria as readonly string[]).includes(value)) return value as CriterionId;
  const known = (CRITERION_IDS as readonly string[]).includes(value);
  const problem = known ? `this sweep did not score “${value}”` : `“${value}” is not a criterion`;
  throw badRequest(`${parameter}: ${problem}; choose one of ${criteria.join(", ")}`, parameter);
}

/**
 * The non-dominated stable candidates for criteria x and y, by x ascending of the oriented values
 * (larger-is-better criteria — margins, crossover, bandwidth — are negated first with
 * orientForMinimisation, so the front keeps the largest margin; paretoFront minimises both).
 * Defaults: x = the sweep's first criterion, y = its last.
 */
export async function getFront(
  db: Database,
  access: MemberAccess,
  sweepId: string,
  query: { x?: string; y?: string },
): Promise<FrontDto> {
  const sweep = await getSweep(db, access, sweepId);
  const { criteria } = sweep;
  const x = frontAxis("x", query.x, criteria, criteria[0] as CriterionId);
  const y = frontAxis("y", query.y, criteria, criteria[criteria.length - 1] as CriterionId);
  const xi = criteria.indexOf(x);
  const yi = criteria.indexOf(y);
  // Only finite scores of stable candidates count; paretoFront ignores the rest (NaN for null, ±inf).
  const scored = (await listStoredCandidates(db, sweepId)).filter((c) => c.status === "stable" && c.scores !== null);
  const xs = orientForMinimisation(Float64Array.from(scored, (c) => fromScoreValue(c.scores?.[xi])), x);
  const ys = orientForMinimisation(Float64Array.from(scored, (c) => fromScoreValue(c.scores?.[yi])), y);
  const positions = paretoFront(xs, ys);
  return { x, y, indices: positions.map((p) => (scored[p] as { index: number }).index) };
}

/**
 * Closed-loop response of one candidate under the sweep's scenario, simulated on demand with core
 * simulateLoop (≤ 2000 points per trace). The controller is rebuilt from the stored parameters
 * with the sweep's structure (controllerFromVector), exactly as the runner evaluated it.
 */
export async function getCandidateResponse(
  db: Database,
  access: MemberAccess,
  sweepId: string,
  index: number,
): Promise<ResponseDto> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) {
    throw notFound(
      index < sweep.total
        ? `Candidate ${index} of this sweep has not been evaluated yet; try again when the sweep has progressed.`
        : `This sweep has candidates 0 to ${sweep.total - 1}; there is no candidate ${index}.`,
    );
  }
  const revision = await findRevisionInWorkspace(db, access.workspace.id, sweep.plant.revisionId);
  if (!revision) throw notFound("The plant revision of this sweep no longer exists.");
  const plan = sweepPlan(sweep.definition);
  const controller = controllerFromVector(plan.structure, tunableFromParams(plan, sweep.parameters, stored.params));
  const trace = simulateOrExplain(() => simulateLoop(revision.model, controller, plan.scenario));
  const indices = downsampleIndices(trace.t.length);
  return {
    index,
    params: Object.fromEntries(sweep.parameters.map((name, i) => [name, stored.params[i] as number])),
    status: stored.status,
    t: pick(trace.t, indices),
    r: pick(trace.r, indices),
    y: pick(trace.y, indices),
    u: pick(trace.u, indices),
  };
}

function simulateOrExplain<T>(simulate: () => T): T {
  try {
    return simulate();
  } catch (error) {
    if (error instanceof IllPosedLoopError) {
      throw new HttpError(
        409,
        "This candidate makes the loop ill-posed (1 + C·G vanishes at high frequency), so it has no response to show; choose another candidate.",
      );
    }
    if (error instanceof RangeError || error instanceof TypeError) {
      throw new HttpError(409, `This candidate could not be simulated (${error.message}); choose another candidate.`);
    }
    throw error;
  }
}
