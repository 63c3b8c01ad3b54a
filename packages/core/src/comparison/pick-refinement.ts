import type { BatchResult } from "../batch/evaluate-batch.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { NelderMeadSimplex } from "../search/nelder-mead.js";
import { boxValues, missingPick, scorePick, unitCoordinate, type ComparisonPick } from "./comparison-pick.js";
import { refinementCriteria, type ComparisonPlan } from "./comparison-plan.js";
import { aggregateRows, comparisonRows, oriented } from "./comparison-rows.js";
import type { PrescanResult } from "./prescan.js";
import { evaluateVectors, type ComparisonSetup } from "./sweep-adapter.js";

/**
 * A simplex stops when every vertex lies within this of the best in unit coordinates (a
 * ten-thousandth of each axis; on a log axis of two decades, 0.05 % of the value) …
 */
export const REFINE_X_TOLERANCE = 1e-4;
/** … and the values span at most this fraction of the start's value (absolute when it is 0). */
export const REFINE_F_TOLERANCE = 1e-9;
/** Initial simplex edge in unit coordinates: half the pre-scan's spacing N^(−1/d), at most … */
export const REFINE_MAX_STEP = 0.1;
/** … and at least this. */
export const REFINE_MIN_STEP = 0.01;

/** What a refinement wants evaluated next: these vectors (m × d) on this setup's family, over these criteria. */
export interface RefinementRequest {
  setup: ComparisonSetup;
  vectors: Float64Array;
  criteria: readonly CriterionId[];
}

/**
 * The local refinement of one contender's pick as an ask/tell object, so a job system or a worker
 * pool can evaluate its points: ask() gives a request (null when done), tell() takes the batch
 * result of exactly that request; result() gives the pick once done.
 */
export interface PickRefinement {
  readonly contender: string;
  readonly done: boolean;
  ask(): RefinementRequest | null;
  tell(batch: BatchResult): void;
  result(): ComparisonPick;
}

/** Options of createPickRefinement. */
export interface PickRefinementOptions {
  /** Initial simplex edge in unit coordinates (default: from the pre-scan's spacing, see REFINE_MAX_STEP). */
  step?: number;
  /** Most evaluations per start (default plan.budget.evaluations). */
  evaluations?: number;
  /** Objective values of the starts (oriented, smaller is better), to scale the value tolerance. */
  startValues?: readonly number[];
}

/**
 * The best `plan.budget.starts` pre-scan candidates of contender k: stable on every variant, within
 * every constraint, with a finite aggregate of k's column, ordered best first (ties by index).
 * Returns their vectors (s × d), indices and oriented aggregate values; s may be 0.
 */
export function pickStarts(plan: ComparisonPlan, k: number, prescan: PrescanResult): { vectors: Float64Array; indices: number[]; values: number[] } {
  const column = plan.columns[k];
  const aggregates = aggregateRows(plan, prescan, true);
  const nk = prescan.columns.length;
  const kk = prescan.columns.indexOf(column.key);
  if (kk < 0) throw new RangeError(`prescan: holds no column "${column.key}"`);
  const ranked: { index: number; value: number }[] = [];
  for (let i = 0; i < prescan.n; i++) {
    const value = oriented(column, aggregates[i * nk + kk]);
    if (Number.isFinite(value)) ranked.push({ index: i, value });
  }
  ranked.sort((a, b) => a.value - b.value || a.index - b.index);
  const chosen = ranked.slice(0, plan.budget.starts);
  const d = plan.space.length;
  const vectors = new Float64Array(chosen.length * d);
  chosen.forEach((c, s) => vectors.set(prescan.vectors.subarray(c.index * d, (c.index + 1) * d), s * d));
  return { vectors, indices: chosen.map((c) => c.index), values: chosen.map((c) => c.value) };
}

/**
 * Refines contender k's pick from start vectors (s × d, inside the box): one Nelder–Mead simplex
 * per start (nelder-mead.ts: Nelder & Mead 1965, Lagarias et al. 1998), all advanced together.
 *
 * The simplexes live in unit coordinates w ∈ [0, 1]^d of the box (v = axisValue(axis, w), so a log
 * axis is searched in log v), and the box is kept by clamping every point onto it. The objective
 * is k's column aggregated over the family (the plan's aggregate), oriented so smaller is better,
 * with the constraints as an extreme barrier: a point that is unstable on some variant or breaks a
 * constraint on some variant counts as +∞, so the simplex never accepts it and the pick always
 * meets the constraints (C. Audet and J. E. Dennis, "Mesh adaptive direct search algorithms for
 * constrained optimization", SIAM J. Optim. 17(1), 188–217, 2006, §4: the extreme barrier).
 * Only k's criteria and the constraints' are evaluated while refining; the final point is then
 * scored on every column (one more evaluation). Deterministic: no random numbers.
 */
export function createPickRefinement(plan: ComparisonPlan, k: number, starts: Float64Array, options: PickRefinementOptions = {}): PickRefinement {
  const column = plan.columns[k];
  if (!column || column.role !== "contender") throw new RangeError(`contender: ${String(k)} is not a contender of this comparison`);
  const d = plan.space.length;
  const s = starts.length / d;
  const criteria = refinementCriteria(plan, k);
  const evaluations = options.evaluations ?? plan.budget.evaluations;
  const step = options.step ?? Math.min(REFINE_MAX_STEP, Math.max(REFINE_MIN_STEP, 0.5 * plan.budget.prescan ** (-1 / d)));
  const lower = new Float64Array(d);
  const upper = new Float64Array(d).fill(1);
  const simplexes = Array.from({ length: s }, (_, i) => {
    const w = Float64Array.from(plan.space, (axis, j) => unitCoordinate(axis, starts[i * d + j]));
    const scale = Math.abs(options.startValues?.[i] ?? 0);
    return new NelderMeadSimplex(w, {
      lower,
      upper,
      step,
      maxEvaluations: evaluations,
      maxIterations: evaluations,
      xTolerance: REFINE_X_TOLERANCE,
      fTolerance: Number.isFinite(scale) ? REFINE_F_TOLERANCE * scale : 0,
    });
  });
  let pending: { counts: number[] } | { final: Float64Array } | null = null;
  let pick: ComparisonPick | null = s === 0 ? missingPick(plan, column.key, noStartReason(plan)) : null;
  let spent = 0;

  const objective = (batch: BatchResult, m: number): Float64Array => {
    const rows = comparisonRows(plan, criteria, batch, m, [column]);
    const aggregates = aggregateRows(plan, rows, true);
    return Float64Array.from(aggregates, (v) => {
      const o = oriented(column, v);
      return Number.isNaN(o) ? Infinity : o;
    });
  };

  return {
    contender: column.key,
    get done() {
      return pick !== null;
    },
    ask() {
      if (pick !== null) return null;
      if (pending !== null) throw new Error("ask: the previous request has not been told yet");
      const lists = simplexes.map((x) => x.ask());
      const m = lists.reduce((a, l) => a + l.length, 0);
      if (m > 0) {
        const vectors = new Float64Array(m * d);
        let row = 0;
        for (const list of lists) for (const w of list) vectors.set(boxValues(plan.space, w), d * row++);
        pending = { counts: lists.map((l) => l.length) };
        return { setup: plan.setup, vectors, criteria };
      }
      // Every simplex is done: score the best vertex of all starts on every column.
      let best = -1;
      simplexes.forEach((x, i) => {
        if (Number.isFinite(x.best.value) && (best < 0 || x.best.value < simplexes[best].best.value)) best = i;
      });
      if (best < 0) {
        pick = missingPick(plan, column.key, noStartReason(plan), spent);
        return null;
      }
      const final = boxValues(plan.space, simplexes[best].best.x);
      pending = { final };
      return { setup: plan.setup, vectors: final, criteria: plan.criteria };
    },
    tell(batch: BatchResult) {
      if (pending === null) throw new Error("tell: call ask() first");
      if ("final" in pending) {
        spent += 1;
        const converged = simplexes.some((x) => x.result().converged);
        pick = scorePick(plan, column.key, pending.final, batch, { evaluations: spent, converged });
        pending = null;
        return;
      }
      const counts = pending.counts;
      const m = counts.reduce((a, b) => a + b, 0);
      const values = objective(batch, m);
      spent += m;
      let offset = 0;
      counts.forEach((count, i) => {
        if (count > 0) simplexes[i].tell(values.subarray(offset, offset + count));
        offset += count;
      });
      pending = null;
    },
    result() {
      if (pick === null) throw new Error("result: the refinement is not done; keep asking");
      return pick;
    },
  };
}

/**
 * Runs a refinement to the end, evaluating in process (evaluateVectors), and returns the pick.
 */
export function runPickRefinement(refinement: PickRefinement): ComparisonPick {
  for (let request = refinement.ask(); request !== null; request = refinement.ask()) {
    refinement.tell(evaluateVectors(request.setup, request.vectors, request.criteria));
  }
  return refinement.result();
}

/**
 * One step of a comparison: the pick of contender `contender` (its column key or index), refined
 * in process from its best pre-scan candidates (pickStarts, createPickRefinement). Seeded through
 * the pre-scan and otherwise deterministic: the same plan and pre-scan give the same pick.
 */
export function refinePick(plan: ComparisonPlan, contender: string | number, prescan: PrescanResult): ComparisonPick {
  const k = typeof contender === "number" ? contender : plan.columns.findIndex((c) => c.key === contender && c.role === "contender");
  if (!(k >= 0 && k < plan.contenders)) throw new RangeError(`contender: "${String(contender)}" is not a contender of this comparison`);
  const starts = pickStarts(plan, k, prescan);
  return runPickRefinement(createPickRefinement(plan, k, starts.vectors, { startValues: starts.values }));
}

function noStartReason(plan: ComparisonPlan): string {
  return plan.constraints.length > 0
    ? "no pre-scan candidate is stable on every variant and within the constraints; widen the box, relax a constraint or raise budget.prescan"
    : "no pre-scan candidate is stable on every variant; widen or move the box, or raise budget.prescan";
}
