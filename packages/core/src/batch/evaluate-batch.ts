import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import { evaluateCandidate, type CandidateEvaluation, type EvaluateCandidateOptions } from "../simulation/evaluate-candidate.js";
import type { Scenario } from "../simulation/scenario.js";
import { STATUS_DIVERGED, STATUS_INVALID, STATUS_STABLE, STATUS_UNSTABLE } from "./batch-status.js";
import { assertValidStructure, controllerFromVector, type Structure } from "./structure.js";

/**
 * The options of evaluateCandidate for every candidate of a batch. evaluateBatch does not report
 * poles, so it passes `poles: false` unless told otherwise.
 */
export type EvaluationOptions = EvaluateCandidateOptions;

/**
 * Scores of a batch: n candidates × F variants (the family's plants) × C criteria.
 * status[i·F + f]: BATCH_STATUSES code of candidate i on variant f.
 * scores[(i·F + f)·C + c]: criterion c of candidate i on variant f; NaN when unscored (unstable,
 * diverged, invalid) or when the criterion does not apply.
 */
export interface BatchResult {
  status: Uint8Array;
  scores: Float64Array;
  /**
   * Why a candidate was rejected, by row i·F + f of an "invalid" status: the RangeError's or
   * TypeError's sentence as a value (never swallowed). Absent or empty when none was rejected.
   */
  reasons?: Map<number, string>;
}

/** Options of evaluateBatch. */
export interface BatchOptions {
  /** Passed to evaluateCandidate for every candidate (criterion options); poles default to false. */
  evaluation?: EvaluationOptions;
  /** Preallocated outputs to fill (lengths n·F and n·F·C); fresh arrays when omitted. */
  into?: BatchResult;
}

/**
 * Evaluates every candidate of a structure on every plant of a family, in process:
 * candidate i is controllerFromVector(structure, candidates, i·d), d = structure.tunable.length,
 * and its result on variant f is exactly evaluateCandidate(family[f], controller, scenario,
 * criteria, { poles: false, ...options.evaluation }), written into typed arrays (see BatchResult). A candidate whose
 * controller is rejected (evaluateCandidate throws a RangeError or TypeError) gets status
 * "invalid", NaN scores and its sentence in `reasons` instead of stopping the batch; any other
 * exception propagates.
 *
 * Each candidate's result depends only on its own parameter vector, never on the others or on
 * their order, so any split of the rows into chunks gives the same bytes (the worker pool relies
 * on it).
 *
 * family: at least one plant; candidates: n × d row-major, length a multiple of d; criteria:
 * known ids. Throws a RangeError naming `family`, `structure…`, `candidates`, `criteria` or `into`.
 */
export function evaluateBatch(
  family: readonly Plant[],
  structure: Structure,
  candidates: Float64Array,
  scenario: Scenario,
  criteria: readonly CriterionId[],
  options: BatchOptions = {},
): BatchResult {
  if (!Array.isArray(family) || family.length === 0) throw new RangeError("family: give at least one plant");
  assertValidStructure(structure);
  if (!(candidates instanceof Float64Array)) throw new TypeError("candidates must be a Float64Array (n × tunable parameters, row-major)");
  const d = structure.tunable.length;
  if (d === 0 ? candidates.length !== 0 : candidates.length % d !== 0) {
    throw new RangeError(`candidates: length ${candidates.length} is not a multiple of the ${d} tunable parameters`);
  }
  if (!Array.isArray(criteria) || criteria.length === 0) throw new RangeError("criteria: choose at least one criterion");
  for (const id of criteria) {
    if (!(CRITERION_IDS as readonly string[]).includes(id)) throw new RangeError(`criteria: unknown criterion "${String(id)}"`);
  }
  const n = d === 0 ? 0 : candidates.length / d;
  const nf = family.length;
  const nc = criteria.length;
  const out = options.into ?? { status: new Uint8Array(n * nf), scores: new Float64Array(n * nf * nc) };
  if (out.status.length !== n * nf || out.scores.length !== n * nf * nc) {
    throw new RangeError(`into: needs status of length ${n * nf} and scores of length ${n * nf * nc}`);
  }
  const reasons = out.reasons ?? new Map<number, string>();
  const evaluationOptions: EvaluationOptions = { poles: false, ...options.evaluation };
  for (let i = 0; i < n; i++) {
    const controller = controllerFromVector(structure, candidates, i * d);
    for (let f = 0; f < nf; f++) {
      const row = i * nf + f;
      const base = row * nc;
      let evaluation: CandidateEvaluation;
      try {
        evaluation = evaluateCandidate(family[f], controller, scenario, criteria, evaluationOptions);
      } catch (error) {
        if (!(error instanceof RangeError || error instanceof TypeError)) throw error;
        out.status[row] = STATUS_INVALID;
        reasons.set(row, error.message);
        out.scores.fill(NaN, base, base + nc);
        continue;
      }
      out.status[row] = statusCode(evaluation.status);
      const scores = evaluation.scores;
      if (scores === null) out.scores.fill(NaN, base, base + nc);
      else for (let c = 0; c < nc; c++) out.scores[base + c] = scores[criteria[c] as CriterionId];
    }
  }
  if (reasons.size > 0) out.reasons = reasons;
  return out;
}

function statusCode(status: string): number {
  if (status === "stable") return STATUS_STABLE;
  if (status === "unstable") return STATUS_UNSTABLE;
  if (status === "diverged") return STATUS_DIVERGED;
  throw new Error(`evaluateCandidate returned an unknown status "${status}"`);
}
