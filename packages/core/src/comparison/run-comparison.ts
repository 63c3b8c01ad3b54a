import type { BatchResult } from "../batch/evaluate-batch.js";
import { analyseComparison, type ComparisonAnalysis } from "./analyse-comparison.js";
import type { ComparisonPick } from "./comparison-pick.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { createStabilityRefinements, stabilityEntry, stabilityVariations } from "./comparison-stability.js";
import { createPickRefinement, pickStarts, type PickRefinement, type RefinementRequest } from "./pick-refinement.js";
import { assemblePrescan, prescanChunk, prescanVectors, type PrescanChunk } from "./prescan.js";
import { reconcilePicks } from "./reconcile-picks.js";
import { evaluateVectors } from "./sweep-adapter.js";

/** Evaluates one request (vectors on a setup's family over criteria): in process, or on a worker pool. */
export type ComparisonEvaluator = (request: RefinementRequest) => BatchResult | Promise<BatchResult>;

/** The phases of a comparison, in order. */
export type ComparisonPhase = "prescan" | "refine" | "stability";

/** Options of runComparison. */
export interface RunComparisonOptions {
  /** Pre-scan candidates per request (default 32). */
  chunkSize?: number;
  /** Called after each request with the phase and the evaluations (candidates × variants) done so far. */
  onProgress?: (phase: ComparisonPhase, evaluations: number) => void;
}

/** Pre-scan candidates per request by default: small enough to spread over the workers of a pool. */
export const DEFAULT_PRESCAN_CHUNK = 32;

/** Evaluates a request in process (evaluateVectors). */
export const evaluateInProcess: ComparisonEvaluator = (request) => evaluateVectors(request.setup, request.vectors, request.criteria);

/**
 * A whole comparison, step by step — pre-scan (evaluatePrescanChunk's work, in chunks), the
 * refinement of every contender's pick (createPickRefinement, all contenders advanced together),
 * reconcilePicks, the stability variations when budget.stability (each variant left out, each
 * quadratic r halved and doubled), then analyseComparison — with every evaluation handed to
 * `evaluate`, whose requests of one round are in flight together (a pool runs them in parallel).
 * The result does not depend on the evaluator or on the order requests finish in.
 */
export async function runComparison(
  plan: ComparisonPlan,
  evaluate: ComparisonEvaluator = evaluateInProcess,
  options: RunComparisonOptions = {},
): Promise<ComparisonAnalysis> {
  const chunkSize = options.chunkSize ?? DEFAULT_PRESCAN_CHUNK;
  if (!Number.isInteger(chunkSize) || chunkSize < 1) throw new RangeError(`chunkSize must be a whole number ≥ 1, got ${String(chunkSize)}`);
  const nf = plan.variants.length;
  let evaluations = 0;
  const total = plan.budget.prescan;
  const chunks: Promise<PrescanChunk>[] = [];
  for (let start = 0; start < total; start += chunkSize) {
    const end = Math.min(total, start + chunkSize);
    const vectors = prescanVectors(plan, start, end);
    chunks.push(
      Promise.resolve(evaluate({ setup: plan.setup, vectors, criteria: plan.criteria })).then((batch) => {
        evaluations += (end - start) * nf;
        options.onProgress?.("prescan", evaluations);
        return prescanChunk(plan, start, end, batch);
      }),
    );
  }
  const prescan = assemblePrescan(plan, await Promise.all(chunks));

  const refinements = Array.from({ length: plan.contenders }, (_, k) => {
    const starts = pickStarts(plan, k, prescan);
    return createPickRefinement(plan, k, starts.vectors, { startValues: starts.values });
  });
  const count = (done: number) => {
    evaluations += done;
    options.onProgress?.("refine", evaluations);
  };
  const picks = reconcilePicks(plan, await driveRefinements(refinements, evaluate, count));

  const stability = [];
  if (plan.budget.stability) {
    const variations = stabilityVariations(plan).map((variation) => ({ variation, ...createStabilityRefinements(plan, picks, variation) }));
    const all = variations.flatMap((v) => v.refinements);
    const refined = await driveRefinements(all, evaluate, (done) => {
      evaluations += done;
      options.onProgress?.("stability", evaluations);
    });
    let at = 0;
    for (const v of variations) {
      const own = refined.slice(at, at + v.refinements.length);
      at += v.refinements.length;
      stability.push(stabilityEntry(plan, picks, v.variation, v.contenders, own));
    }
  }
  return analyseComparison(plan, prescan, picks, stability);
}

/** Advances every refinement round by round, the requests of a round evaluated together; returns their picks in order. */
async function driveRefinements(refinements: readonly PickRefinement[], evaluate: ComparisonEvaluator, count: (evaluations: number) => void): Promise<ComparisonPick[]> {
  for (;;) {
    const round: { refinement: PickRefinement; request: RefinementRequest }[] = [];
    for (const refinement of refinements) {
      if (refinement.done) continue;
      const request = refinement.ask();
      if (request !== null) round.push({ refinement, request });
    }
    if (round.length === 0) break;
    const results = await Promise.all(round.map(({ request }) => evaluate(request)));
    round.forEach(({ refinement, request }, i) => {
      refinement.tell(results[i]);
      count((request.vectors.length / request.setup.structure.tunable.length) * request.setup.family.length);
    });
  }
  return refinements.map((r) => r.result());
}
