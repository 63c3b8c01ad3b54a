import type { BatchResult } from "../batch/evaluate-batch.js";
import { BATCH_STATUSES } from "../batch/batch-status.js";
import { scorePick, type ComparisonPick } from "./comparison-pick.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { crossScore } from "./cross-score.js";
import { createPickRefinement, runPickRefinement, type PickRefinement } from "./pick-refinement.js";

/** One change of a comparison that a robust answer should survive. */
export type StabilityVariation =
  | { kind: "leave-out"; variant: number }
  | { kind: "weight"; contender: number; factor: number };

/** Factors applied to every quadratic contender's weight r (halved, doubled). */
export const WEIGHT_FACTORS = [0.5, 2] as const;

/** How one pick moved under a variation. */
export interface StabilityPick {
  contender: string;
  found: boolean;
  params: Record<string, number>;
  /** Relative change of each parameter, in per cent of its value in the pick (of the axis span when that value is 0). */
  moves: Record<string, number>;
  /** The largest of `moves`. */
  maxMove: number;
  /** The varied comparison's aggregates and regrets of this pick, column by column (plan order). */
  aggregates: number[];
  regrets: number[];
  /** The largest change of regret over the columns, in percentage points (varied − original). */
  regretShift: number;
}

/** The picks of a comparison under one variation. */
export interface StabilityEntry {
  variation: StabilityVariation;
  /** e.g. "without v3", "J(r=0.1) with r = 0.05". */
  label: string;
  picks: StabilityPick[];
}

/**
 * The variations a comparison's stability is checked under: each variant left out in turn (when
 * the family has two or more), then each quadratic contender's r halved and doubled (when r > 0).
 */
export function stabilityVariations(plan: ComparisonPlan): StabilityVariation[] {
  const out: StabilityVariation[] = [];
  if (plan.variants.length >= 2) plan.variants.forEach((_, f) => out.push({ kind: "leave-out", variant: f }));
  for (let k = 0; k < plan.contenders; k++) {
    const w = plan.columns[k].weights;
    if (w && w.r > 0) for (const factor of WEIGHT_FACTORS) out.push({ kind: "weight", contender: k, factor });
  }
  return out;
}

/** The comparison with one variation applied (a variant left out, or one contender's r scaled). */
export function variationPlan(plan: ComparisonPlan, variation: StabilityVariation): ComparisonPlan {
  if (variation.kind === "leave-out") {
    const f = variation.variant;
    if (!(Number.isInteger(f) && f >= 0 && f < plan.variants.length) || plan.variants.length < 2) {
      throw new RangeError(`variation.variant: leave out one of variants 0 … ${plan.variants.length - 1} of a family of two or more`);
    }
    const keep = <T>(list: readonly T[]) => list.filter((_, i) => i !== f);
    return { ...plan, variants: keep(plan.variants), setup: { ...plan.setup, family: keep(plan.setup.family), variants: keep(plan.setup.variants) } };
  }
  const k = variation.contender;
  const w = plan.columns[k]?.weights;
  if (!(k >= 0 && k < plan.contenders) || !w) throw new RangeError(`variation.contender: ${String(k)} is not a quadratic contender`);
  if (!(Number.isFinite(variation.factor) && variation.factor > 0)) throw new RangeError("variation.factor must be a finite number > 0");
  const columns = plan.columns.map((c, i) => (i === k ? { ...c, weights: { q: w.q, r: w.r * variation.factor } } : c));
  return { ...plan, columns };
}

/** A variation in words: "without v3", "J(r=0.1) with r = 0.05". */
export function variationLabel(plan: ComparisonPlan, variation: StabilityVariation): string {
  if (variation.kind === "leave-out") return `without ${plan.variants[variation.variant]}`;
  const column = plan.columns[variation.contender];
  return `${column.label} with r = ${formatWeight((column.weights?.r ?? NaN) * variation.factor)}`;
}

/**
 * The re-refinements of one variation, as ask/tell objects for a job system or a pool: every found
 * pick for a left-out variant, the scaled contender's pick for a weight. Each starts from the pick
 * itself with one simplex of half the pre-scan step, so it measures how far the answer moves.
 */
export function createStabilityRefinements(
  plan: ComparisonPlan,
  picks: readonly ComparisonPick[],
  variation: StabilityVariation,
): { plan: ComparisonPlan; contenders: number[]; refinements: PickRefinement[] } {
  const varied = variationPlan(plan, variation);
  const contenders = picks.map((_, k) => k).filter((k) => picks[k].found && (variation.kind === "leave-out" || variation.contender === k));
  const d = plan.space.length;
  const step = 0.5 * Math.min(0.1, Math.max(0.01, 0.5 * plan.budget.prescan ** (-1 / d)));
  const refinements = contenders.map((k) => createPickRefinement(varied, k, Float64Array.from(picks[k].vector), { step, startValues: [picks[k].aggregates[k]] }));
  return { plan: varied, contenders, refinements };
}

/**
 * The stability entry of a variation from the re-refined picks (in the order of
 * createStabilityRefinements' contenders); the other picks keep their parameters and are rescored
 * under the varied plan from their stored registry scores.
 */
export function stabilityEntry(
  plan: ComparisonPlan,
  picks: readonly ComparisonPick[],
  variation: StabilityVariation,
  contenders: readonly number[],
  refined: readonly ComparisonPick[],
): StabilityEntry {
  const varied = variationPlan(plan, variation);
  const variedPicks = picks.map((pick, k) => {
    const at = contenders.indexOf(k);
    return at >= 0 ? refined[at] : rescorePick(varied, pick, variation);
  });
  const before = crossScore(plan, picks);
  const after = crossScore(varied, variedPicks);
  return {
    variation,
    label: variationLabel(plan, variation),
    picks: variedPicks.map((pick, k) => {
      const moves: Record<string, number> = {};
      let maxMove = pick.found ? 0 : NaN;
      if (pick.found && picks[k].found) {
        plan.space.forEach((axis, j) => {
          const was = picks[k].vector[j];
          const scale = was !== 0 ? Math.abs(was) : axis.max - axis.min;
          moves[axis.name] = (100 * Math.abs(pick.vector[j] - was)) / scale;
          maxMove = Math.max(maxMove, moves[axis.name]);
        });
      }
      let regretShift = 0;
      after.regrets[k].forEach((r, c) => {
        const shift = Math.abs(r - before.regrets[k][c]);
        if (Number.isFinite(shift)) regretShift = Math.max(regretShift, shift);
      });
      return { contender: pick.contender, found: pick.found, params: pick.params, moves, maxMove, aggregates: pick.aggregates, regrets: after.regrets[k], regretShift };
    }),
  };
}

/**
 * One step of a comparison: the stability entry of one variation, with the re-refinements run in
 * process. Deterministic.
 */
export function checkStability(plan: ComparisonPlan, picks: readonly ComparisonPick[], variation: StabilityVariation): StabilityEntry {
  const { contenders, refinements } = createStabilityRefinements(plan, picks, variation);
  return stabilityEntry(plan, picks, variation, contenders, refinements.map(runPickRefinement));
}

/** A pick rescored under a varied plan from its stored registry scores (no evaluation). */
export function rescorePick(varied: ComparisonPlan, pick: ComparisonPick, variation: StabilityVariation): ComparisonPick {
  if (!pick.found) return pick;
  const keep = (f: number) => variation.kind !== "leave-out" || f !== variation.variant;
  const scores = pick.base.scores.filter((_, f) => keep(f));
  const status = pick.status.filter((_, f) => keep(f));
  const nc = pick.base.criteria.length;
  if (pick.base.criteria.join() !== varied.criteria.join()) throw new RangeError("pick: its stored scores are over other criteria than the varied plan's");
  const batch: BatchResult = {
    status: Uint8Array.from(status, (s) => BATCH_STATUSES.indexOf(s)),
    scores: Float64Array.from({ length: scores.length * nc }, (_, i) => scores[Math.floor(i / nc)][i % nc]),
  };
  return { ...scorePick(varied, pick.contender, pick.vector, batch, pick), ...(pick.adoptedFrom ? { adoptedFrom: pick.adoptedFrom } : {}) };
}

function formatWeight(r: number): string {
  return Number(r.toPrecision(6)).toString();
}
