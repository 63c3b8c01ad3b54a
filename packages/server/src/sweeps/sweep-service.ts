import { CRITERION_IDS, IllPosedLoopError, paretoFront, simulateLoop } from "@loopyard/core";
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
import { findSweepDetail, insertSweep, listSweepSummaries, PID_PARAMETERS } from "./sweep-repository.js";
import type { SweepRunner } from "./sweep-runner.js";

export const SWEEP_NOT_FOUND = "There is no such sweep in this workspace.";

/** Number of candidates of a grid: the product of the three counts. */
export function gridSize(ranges: SweepInputParsed["ranges"]): number {
  return ranges.kp.count * ranges.ki.count * ranges.kd.count;
}

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
  const sweepId = await insertSweep(db, {
    workspaceId: access.workspace.id,
    createdBy: access.user.id,
    definition: input,
    total: gridSize(input.ranges),
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
 * The non-dominated stable candidates for criteria x and y (both minimised), by x ascending.
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
  const scored = (await listStoredCandidates(db, sweepId)).filter((c) => c.status === "stable" && c.scores !== null);
  const xs = Float64Array.from(scored, (c) => (c.scores as number[])[xi] ?? Number.NaN);
  const ys = Float64Array.from(scored, (c) => (c.scores as number[])[yi] ?? Number.NaN);
  const positions = paretoFront(xs, ys);
  return { x, y, indices: positions.map((p) => (scored[p] as { index: number }).index) };
}

/** Closed-loop setpoint-step response of one candidate, simulated on demand (≤ 2000 points per trace). */
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
  const [kp, ki, kd, tf] = stored.params as [number, number, number, number];
  const trace = simulateOrExplain(() => simulateLoop(revision.model, { kind: "pid", kp, ki, kd, tf }, sweep.definition.scenario));
  const indices = downsampleIndices(trace.t.length);
  return {
    index,
    params: Object.fromEntries(PID_PARAMETERS.map((name, i) => [name, stored.params[i] as number])),
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
    throw error;
  }
}
