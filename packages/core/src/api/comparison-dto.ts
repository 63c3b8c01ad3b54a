import type { ComparisonInput } from "./comparison-input.js";
import type { UserDto } from "./dto.js";

/**
 * queued → running → finished | failed (a pre-scan chunk or a contender's refinement failed after
 * its last retry, or the definition cannot run) | cancelled (stopped by a member).
 */
export type ComparisonStatus = "queued" | "running" | "finished" | "failed" | "cancelled";

/** Which part of a comparison's work is under way: the shared pre-scan, the contenders' refinements, the analysis. */
export type ComparisonProgressPhase = "prescan" | "refine" | "analyse" | "done";

/** Live figures of a comparison run as jobs. */
export interface ComparisonProgressDto {
  phase: ComparisonProgressPhase;
  /** Pre-scan points evaluated (on every variant) and their total. */
  prescanDone: number;
  prescanTotal: number;
  chunksTotal: number;
  chunksDone: number;
  /** Contenders whose pick is found, and how many contenders. */
  picksDone: number;
  picksTotal: number;
  /** Worker processes with a heartbeat in the last 15 s. */
  workersActive: number;
  /** Pieces of work that failed after their last retry, each with what it was and the error. */
  failures: { what: string; error: string }[];
}

/** One plant variant of a comparison's family, in the order of the result's per-variant scores. */
export interface ComparisonVariantDto {
  label: string;
  plantId: string;
  revisionId: string;
  revisionNumber: number;
  plantName: string;
}

export interface ComparisonSummaryDto {
  id: string;
  name: string;
  status: ComparisonStatus;
  /** Column keys of the contenders (criterion ids or quadratic labels), in definition order. */
  contenders: string[];
  judges: string[];
  structure: string;
  family: ComparisonVariantDto[];
  progress: ComparisonProgressDto;
  createdAt: string;
  finishedAt: string | null;
  createdBy: UserDto;
  error: string | null;
}

/** GET /api/workspaces/:slug/comparisons/:comparisonId */
export interface ComparisonDetailDto extends ComparisonSummaryDto {
  definition: ComparisonInput;
}

/** One trace of GET …/comparisons/:id/responses: a pick's closed loop on one variant (≤ 2000 points). */
export interface PickResponseDto {
  /** Contender key of the pick. */
  contender: string;
  /** Index of the variant simulated (family order) and its label. */
  variant: number;
  variantLabel: string;
  status: "ok" | "failed";
  /** Why there is no trace, when status is "failed". */
  reason?: string;
  t: number[];
  r: number[];
  y: number[];
  u: number[];
  /** |S(jω)| on a log-spaced grid (ω in rad/s); empty when the loop has no frequency response (nonlinear). */
  omega: number[];
  sensitivity: number[];
}

/** GET /api/workspaces/:slug/comparisons/:comparisonId/responses?variant=k (k omitted: each pick on its worst variant). */
export interface ComparisonResponsesDto {
  /** The variant asked for, or null for "each pick's worst variant". */
  variant: number | null;
  picks: PickResponseDto[];
}

/**
 * GET /api/workspaces/:slug/comparisons/across?judge=id — finished comparisons of the workspace
 * lined up by the contenders they share: one column per comparison, one row per contender key,
 * each cell the regret [%] of that contender's pick on the chosen judge (null when the comparison
 * has no such contender or did not score that column).
 */
export interface ComparisonAcrossDto {
  judge: string;
  /** Every column key any finished comparison scored (contenders and judges), for choosing the judge. */
  columns: string[];
  comparisons: { id: string; name: string; family: string; aggregate: string; finishedAt: string | null }[];
  rows: { contender: string; regrets: (number | null)[]; values: (number | null)[] }[];
}
