/**
 * Shapes of the JSON the HTTP API returns. The server builds these and the web app reads them;
 * both import them from here so that one shape has one definition.
 *
 * Every error response is `{ error: ApiErrorBody }` with a 4xx/5xx status.
 */
import type { Role } from "./roles.js";
import type { Plant } from "../plants/plant.js";
import type { StepTestOverview } from "../identification/step-test-overview.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { SweepInputParsed } from "../sweeps/sweep-input.js";
import type { Complex } from "../linear-algebra/complex.js";
import type { FamilyDefinition } from "../families/family-definition.js";
import type { RevisionChange } from "../revisions/revision-diff.js";

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
  /** False until the address is confirmed (the sign-up mail's link, or accepting an invitation mailed to it). */
  emailVerified: boolean;
  memberships: { workspace: WorkspaceDto; role: Role }[];
}

/** One signed-in session of the current user (GET /api/me/sessions); the token never leaves the server. */
export interface SessionDto {
  id: string;
  /** ISO 8601 times. */
  createdAt: string;
  lastSeenAt: string;
  expiresAt: string;
  ipAddress: string | null;
  userAgent: string | null;
  /** True for the session the request was made with. */
  current: boolean;
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
  /** What changed and why, written by its author; null for revisions stored before notes (shown as "no note"). */
  note: string | null;
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
  /** When the plant was archived (hidden from pickers; sweeps on it keep working), or null. */
  archivedAt: string | null;
}

/** GET /api/workspaces/:slug/plants/:plantId[?revision=N] */
export interface PlantDetailDto {
  plant: PlantSummaryDto;
  /** The revision shown (the latest unless ?revision=N). */
  revision: PlantRevisionDto;
  revisions: { id: string; number: number; note: string | null; createdAt: string; createdBy: UserDto }[];
  /**
   * Poles of the shown revision. For a nonlinear plant these are the poles of its linearisation at
   * the operating point (`initial`, `operatingInput`); see polesNote.
   */
  poles: Complex[];
  /** Zeros of the shown revision (of the linearisation for a nonlinear plant); Re z > 0 is a right-half-plane zero. */
  zeros: Complex[];
  /** A sentence saying what `poles` means when it is not the plain plant poles (nonlinear plants); null otherwise. */
  polesNote: string | null;
  /**
   * Open-loop response of the shown revision to a unit step of the input (from the operating point
   * for a nonlinear plant: y − y0 to a step of u from operatingInput by 1), over a horizon from suggestHorizon.
   */
  step: { t: number[]; y: number[] };
}

/**
 * queued → running → finished (possibly with failed chunks, listed in progress.failures) |
 * failed (could not run at all) | cancelled (stopped by a member; finished chunks are kept).
 */
export type SweepStatus = "queued" | "running" | "finished" | "failed" | "cancelled";

/** Live figures of a sweep run as jobs (see the README, "When one machine is not enough"). */
export interface SweepProgressDto {
  /** Candidates stored so far. */
  done: number;
  total: number;
  /** Candidates per second over the chunks finished in the last 30 s; null when none. */
  ratePerSecond: number | null;
  /** (total − done) / rate [s]; null without a rate or once the sweep has stopped. */
  etaSeconds: number | null;
  /** Worker processes with a heartbeat in the last 15 s (all sweeps share them). */
  workersActive: number;
  chunksTotal: number;
  chunksDone: number;
  chunksFailed: number;
  /** Chunks that failed after their last retry, with the error; their candidates are missing. */
  failures: { chunk: number; error: string }[];
}

/** One plant variant of a sweep's family, in the order of CandidateDto.variantScores. */
export interface SweepVariantDto {
  label: string;
  plantId: string;
  revisionId: string;
  revisionNumber: number;
  plantName: string;
}

export interface SweepSummaryDto {
  id: string;
  name: string;
  status: SweepStatus;
  /** The first variant's plant (the only one without a family). */
  plant: { id: string; name: string; kind: Plant["kind"]; revisionId: string; revisionNumber: number };
  total: number;
  done: number;
  progress: SweepProgressDto;
  createdAt: string;
  finishedAt: string | null;
  createdBy: UserDto;
  error: string | null;
}

/** GET /api/workspaces/:slug/sweeps/:sweepId */
export interface SweepDetailDto extends SweepSummaryDto {
  definition: SweepInputParsed;
  /**
   * Parameter names in the order of CandidateDto.params (sweepParameterNames): every parameter of
   * the structure, swept or fixed, e.g. ["kp","ki","kd","tf"] (tf derived from the filter), then
   * "sampleTime" when the sweep has one.
   */
  parameters: string[];
  /** The swept parameters (the keys of definition.ranges, in the order of `parameters`). */
  swept: string[];
  criteria: CriterionId[];
  unstableCount: number;
  divergedCount: number;
  /** The variants the candidates were scored on (one when the definition has no family). */
  family: SweepVariantDto[];
}

/**
 * One score in JSON: a finite number; "inf" or "-inf" for an infinite value (e.g. a settling time
 * not reached within the horizon); null when the criterion does not apply to the run (NaN, e.g.
 * overshoot without a setpoint change). Fronts and rankings ignore everything but finite numbers.
 */
export type ScoreValue = number | "inf" | "-inf" | null;

/**
 * "stable": simulated and scored; "unstable": the stability verdict failed, not simulated;
 * "diverged": the simulation left its bound or became non-finite (nonlinear or saturated loops),
 * or the candidate could not be evaluated (then `error` says why).
 */
export type CandidateStatus = "stable" | "unstable" | "diverged";

export interface CandidateDto {
  index: number;
  /** Values in the order of SweepDetailDto.parameters. */
  params: number[];
  status: CandidateStatus;
  /**
   * The AGGREGATE over the family (definition.aggregate; with one variant, its scores), in the
   * order of SweepDetailDto.criteria; null unless the candidate is stable on every variant.
   */
  scores: ScoreValue[] | null;
  /**
   * Scores per variant (SweepDetailDto.family order), each in criteria order; null for a variant
   * where it is not stable. Absent for single-variant sweeps, and in the candidate list of sweeps
   * over 20,000 candidates (GET …/candidates/:index returns them).
   */
  variantScores?: (ScoreValue[] | null)[];
  /** Why the candidate could not be evaluated, when that is the reason for "diverged". */
  error?: string;
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/candidates */
export interface CandidateListDto {
  parameters: string[];
  criteria: CriterionId[];
  candidates: CandidateDto[];
  /**
   * True when the sweep holds more than 100,000 candidates: `candidates` is then a deterministic
   * sample of 100,000 plus every candidate of the front for the default axes, by index.
   */
  sampled?: boolean;
  /** Candidates stored for the sweep (equal to candidates.length unless sampled). */
  total?: number;
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/front?x=iae&y=effort */
export interface FrontDto {
  x: CriterionId;
  y: CriterionId;
  /**
   * Indices (CandidateDto.index) of the non-dominated stable candidates on the aggregate scores,
   * larger-is-better criteria turned, sorted by x ascending. With ?criteria=a,b,c: the rank-0
   * candidates of the k-objective sort, by index.
   */
  indices: number[];
  /** The criteria of a k-objective front (?criteria=a,b,c); absent for an x–y front. */
  criteria?: CriterionId[];
  /**
   * Non-dominated ranks of a k-objective front (0 = the front): ranks.indices[i] has rank
   * ranks.ranks[i]; candidates without finite aggregate scores are left out.
   */
  ranks?: { indices: number[]; ranks: number[] };
  /** The candidates of `indices`, in full (per-variant scores included), in the order of `indices`. */
  candidates?: CandidateDto[];
}

/**
 * GET /api/workspaces/:slug/sweeps/:sweepId/points?x=iae&y=effort — the cloud of a front chart in
 * columns: the stable candidates with finite aggregate x and y scores, by index. Over 100,000 stored
 * candidates, the same deterministic sample as the candidate list (every ⌈total / 100,000⌉-th index)
 * plus every candidate of the front on these axes. xs, ys and params are ROUNDED to 6 significant
 * digits, enough to draw; exact values come from the candidate endpoints.
 */
export interface PointsDto {
  x: CriterionId;
  y: CriterionId;
  /** Candidates stored for the sweep. */
  total: number;
  /** True when the candidates were sampled (more than 100,000 stored). */
  sampled: boolean;
  /** CandidateDto.index of each point, ascending. */
  indices: number[];
  xs: number[];
  ys: number[];
  /** One array per swept parameter (SweepDetailDto.swept order), aligned with `indices`. */
  params: number[][];
  /** The sweep's criteria with at least one finite aggregate score among its stable candidates. */
  plottable: CriterionId[];
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/candidates/:index/response */
export interface ResponseDto {
  index: number;
  params: Record<string, number>;
  status: CandidateStatus;
  t: number[];
  r: number[];
  y: number[];
  u: number[];
}

/** One point of the bound curve: the LQR design for the weight ratio r/q and its ISE and effort. */
export interface BoundPointDto {
  ratio: number;
  ise: number;
  effort: number;
}

/** One published tuning rule computed from the sweep's plant and scored like any candidate. */
export interface BaselineDto {
  /** Rule id, e.g. "simc", "ziegler-nichols". */
  rule: string;
  /** "p", "pi" or "pid". */
  variant: string;
  /** Display name, e.g. "SIMC PI". */
  label: string;
  /** Source and model fit, e.g. "Skogestad 2003, SIMC PI on the half-rule FOPDT fit". */
  note?: string;
  /** Parallel gains of the rule's controller: kp, ki, kd, tf. */
  params: Record<string, number>;
  status: CandidateStatus;
  /** In the order of SweepDetailDto.criteria; every entry null unless the baseline is stable. */
  scores: ScoreValue[];
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/references — the bound and the baselines drawn beside a front. */
export interface ReferencesDto {
  /**
   * The bound curve on the (ISE, effort) plane for the sweep's aggregate over its family (the
   * sweep's setpoint step; the scenario's horizon, or infinite when the criteria are scored over an
   * infinite horizon): every candidate's aggregated point lies on or above-right of it. ok: false with a reason when there is none
   * (nonlinear plant, zero at s = 0, a scenario it does not cover).
   */
  bound: {
    ok: boolean;
    reason?: string;
    points: BoundPointDto[];
    /** What the bound is: which variants and aggregate, which horizon (familyBoundCurve's note). */
    note?: string;
  };
  baselines: BaselineDto[];
  /** How the baselines were placed: for a family, designed on the first variant and scored on every variant, aggregated like the candidates. */
  baselinesNote?: string;
  /** Rules that do not apply to this plant, with the reason. */
  skipped: { rule: string; variant: string; label: string; reason: string }[];
}

/** GET /api/workspaces/:slug/sweeps/:sweepId/candidates/:index/frequency — |S|, |T| (and 1/|W|) of a linear loop. */
export interface FrequencyDto {
  index: number;
  status: CandidateStatus;
  /** ω [rad/s], ascending. */
  omega: number[];
  /** |S(jω)|, the sensitivity's magnitude. */
  S: number[];
  /** |T(jω)|, the complementary sensitivity's magnitude. */
  T: number[];
  /** 1/|W(jω)| when the sweep's criterion options hold a sensitivity weight. */
  invW?: number[];
}

/** One revision of a saved family: its variants as entries, and what they expand to. */
export interface FamilyRevisionDto {
  id: string;
  familyId: string;
  number: number;
  name: string;
  description: string;
  definition: FamilyDefinition;
  /** The variant list a sweep or comparison on this revision uses (expandFamily), each with its plant's name and revision number. */
  variants: { plantRevisionId: string; label?: string; parameters?: Record<string, number>; plantId: string; plantName: string; revisionNumber: number }[];
  note: string | null;
  createdAt: string;
  createdBy: UserDto;
}

/** One row of GET /api/workspaces/:slug/families */
export interface FamilySummaryDto {
  id: string;
  name: string;
  latestRevision: FamilyRevisionDto;
  revisionCount: number;
  createdAt: string;
  archivedAt: string | null;
}

/** GET /api/workspaces/:slug/families/:familyId[?revision=N] */
export interface FamilyDetailDto {
  family: FamilySummaryDto;
  /** The revision shown (the latest unless ?revision=N). */
  revision: FamilyRevisionDto;
  revisions: { id: string; number: number; note: string | null; createdAt: string; createdBy: UserDto }[];
  /** Sweeps and comparisons that use one of its revisions (newest first). */
  usedBy: { kind: "sweep" | "comparison"; id: string; name: string; revisionNumber: number }[];
}

/** GET …/plants/:plantId/diff?from=A&to=B and …/families/:familyId/diff?from=A&to=B */
export interface RevisionDiffDto {
  from: number;
  to: number;
  changes: RevisionChange[];
}

/** POST /api/workspaces/:slug/step-tests (multipart, field "file") and GET …/step-tests/:stepTestId */
export interface StepTestDto {
  id: string;
  fileName: string;
  sizeBytes: number;
  createdAt: string;
  createdBy: UserDto;
  /** Columns, row count, the first rows and the suggested time, input and output columns. */
  overview: StepTestOverview;
}
