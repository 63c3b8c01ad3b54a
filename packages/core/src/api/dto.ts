/**
 * Shapes of the JSON the HTTP API returns. The server builds these and the web app reads them;
 * both import them from here so that one shape has one definition.
 *
 * Every error response is `{ error: ApiErrorBody }` with a 4xx/5xx status.
 */
import type { Role } from "./roles.js";
import type { Plant } from "../plants/plant.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { SweepInputParsed } from "../sweeps/sweep-input.js";
import type { Complex } from "../linear-algebra/complex.js";

export interface ApiErrorBody {
  /** A sentence the user can act on. */
  message: string;
  /** Dotted path of the offending input field, e.g. "model.den", when one field is at fault. */
  field?: string;
  /** Every field problem found, for forms that show all of them. */
  issues?: { field: string; message: string }[];
}

export interface UserDto {
  id: string;
  name: string;
  email: string;
}

export interface WorkspaceDto {
  id: string;
  slug: string;
  name: string;
}

/** GET /api/me */
export interface MeDto {
  user: UserDto;
  memberships: { workspace: WorkspaceDto; role: Role }[];
}

/** GET /api/workspaces/:slug */
export interface WorkspaceHomeDto {
  workspace: WorkspaceDto;
  role: Role;
  counts: { plants: number; sweeps: number; members: number };
  members: { user: UserDto; role: Role }[];
  recentSweeps: SweepSummaryDto[];
}

export interface PlantRevisionDto {
  id: string;
  plantId: string;
  number: number;
  name: string;
  unitsNote: string;
  model: Plant;
  createdAt: string;
  createdBy: UserDto;
}

/** One row of GET /api/workspaces/:slug/plants */
export interface PlantSummaryDto {
  id: string;
  name: string;
  kind: Plant["kind"];
  latestRevision: PlantRevisionDto;
  revisionCount: number;
  createdAt: string;
}

/** GET /api/workspaces/:slug/plants/:plantId[?revision=N] */
export interface PlantDetailDto {
  plant: PlantSummaryDto;
  /** The revision shown (the latest unless ?revision=N). */
  revision: PlantRevisionDto;
  revisions: { id: string; number: number; createdAt: string; createdBy: UserDto }[];
  poles: Complex[];
  /** Open-loop unit step response of the shown revision. */
  step: { t: number[]; y: number[] };
}

export type SweepStatus = "queued" | "running" | "finished" | "failed";

export interface SweepSummaryDto {
  id: string;
  name: string;
  status: SweepStatus;
  plant: { id: string; name: string; revisionId: string; revisionNumber: number };
  total: number;
  done: number;
  createdAt: string;
  finishedAt: string | null;
  createdBy: UserDto;
  error: string | null;
}

/** GET /api/workspaces/:slug/sweeps/:sweepId */
export interface SweepDetailDto extends SweepSummaryDto {
  definition: SweepInputParsed;
  /** Parameter names in the order of CandidateDto.params, e.g. ["kp","ki","kd","tf"]. */
  parameters: string[];
  criteria: CriterionId[];
  unstableCount: number;
}

export interface CandidateDto {
  index: number;
  /** Values in the order of SweepDetailDto.parameters. */
  params: number[];
  status: "stable" | "unstable";
  /** Values in the order of SweepDetailDto.criteria; null when the candidate is unstable. */
  scores: number[] | null;
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/candidates */
export interface CandidateListDto {
  parameters: string[];
  criteria: CriterionId[];
  candidates: CandidateDto[];
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/front?x=iae&y=effort */
export interface FrontDto {
  x: CriterionId;
  y: CriterionId;
  /** Indices (CandidateDto.index) of the non-dominated stable candidates, sorted by x ascending. */
  indices: number[];
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/candidates/:index/response */
export interface ResponseDto {
  index: number;
  params: Record<string, number>;
  status: "stable" | "unstable";
  t: number[];
  r: number[];
  y: number[];
  u: number[];
}
