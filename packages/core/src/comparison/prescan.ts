import type { BatchResult } from "../batch/evaluate-batch.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { comparisonRows, type ComparisonRows } from "./comparison-rows.js";
import { designVectors, evaluateVectors } from "./sweep-adapter.js";

/**
 * Pre-scan candidates start … end − 1 with their scores on every column and variant (see
 * ComparisonRows; n = end − start) and their parameter vectors (n × d row-major).
 */
export interface PrescanChunk extends ComparisonRows {
  start: number;
  end: number;
  vectors: Float64Array;
}

/** The whole pre-scan: one chunk from 0 to budget.prescan. */
export type PrescanResult = PrescanChunk;

/**
 * Parameter vectors of pre-scan candidates start … end − 1: the sweep plan's Sobol design of
 * budget.prescan points over the box, scrambled by a digital shift from the comparison's seed
 * (sobolDesign: evenly in log(value) on a log axis). One design shared by every contender; any
 * split into chunks gives the same points. Throws a RangeError for a range outside 0 … budget.prescan.
 */
export function prescanVectors(plan: ComparisonPlan, start: number, end: number): Float64Array {
  checkRange(plan, start, end);
  return designVectors(plan.setup, start, end);
}

/**
 * One step of the pre-scan: evaluates candidates start … end − 1 in process on every variant, for
 * every contender, judge and constraint (plan.criteria). A candidate the engine rejects is a row
 * with status "invalid", never an exception (evaluateBatch). Deterministic.
 */
export function evaluatePrescanChunk(plan: ComparisonPlan, start: number, end: number): PrescanChunk {
  const vectors = prescanVectors(plan, start, end);
  return prescanChunk(plan, start, end, evaluateVectors(plan.setup, vectors, plan.criteria));
}

/**
 * The chunk of candidates start … end − 1 from a batch result over plan.criteria computed
 * elsewhere (e.g. a worker pool given vectorsBatch(plan.setup, prescanVectors(…), plan.criteria)).
 */
export function prescanChunk(plan: ComparisonPlan, start: number, end: number, batch: BatchResult): PrescanChunk {
  checkRange(plan, start, end);
  const rows = comparisonRows(plan, plan.criteria, batch, end - start);
  return { ...rows, start, end, vectors: prescanVectors(plan, start, end) };
}

/**
 * Joins the chunks of a pre-scan, in any order, into one PrescanResult covering 0 … budget.prescan.
 * Throws a RangeError when the chunks overlap, leave a gap or do not belong to this plan's shape.
 */
export function assemblePrescan(plan: ComparisonPlan, chunks: readonly PrescanChunk[]): PrescanResult {
  const total = plan.budget.prescan;
  const sorted = [...chunks].sort((a, b) => a.start - b.start);
  let next = 0;
  for (const c of sorted) {
    if (c.start !== next) throw new RangeError(`chunks: candidates ${next} … ${c.start - 1} are missing or overlap`);
    next = c.end;
  }
  if (next !== total) throw new RangeError(`chunks: cover 0 … ${next - 1}, the pre-scan has ${total} candidates`);
  const nf = plan.variants.length;
  const nk = plan.columns.length;
  const d = plan.space.length;
  const out: PrescanResult = {
    n: total,
    variants: nf,
    columns: plan.columns.map((c) => c.key),
    status: new Uint8Array(total * nf),
    scores: new Float64Array(total * nf * nk),
    feasible: new Uint8Array(total * nf),
    start: 0,
    end: total,
    vectors: new Float64Array(total * d),
  };
  for (const c of sorted) {
    if (c.variants !== nf || c.columns.length !== nk) throw new RangeError(`chunks: chunk ${c.start} … ${c.end - 1} has another shape than this comparison`);
    out.status.set(c.status, c.start * nf);
    out.scores.set(c.scores, c.start * nf * nk);
    out.feasible.set(c.feasible, c.start * nf);
    out.vectors.set(c.vectors, c.start * d);
  }
  return out;
}

function checkRange(plan: ComparisonPlan, start: number, end: number): void {
  const total = plan.budget.prescan;
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end > total || end <= start) {
    throw new RangeError(`range: give whole numbers 0 ≤ start < end ≤ ${total}, got ${String(start)} … ${String(end)}`);
  }
}
