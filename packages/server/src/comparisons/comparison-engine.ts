import {
  assemblePrescan,
  analyseComparison,
  createStabilityRefinements,
  reconcilePicks,
  stabilityEntry,
  stabilityVariations,
  comparisonDefinitionSchema,
  comparisonInputSchema,
  createPickRefinement,
  pickStarts,
  planComparison,
  prescanChunk,
  prescanVectors,
} from "@loopyard/core";
import type {
  BatchResult,
  ComparisonAnalysis,
  ComparisonDefinition,
  ComparisonInput,
  ComparisonPick,
  ComparisonPlan,
  ComparisonVariant,
  CriterionId,
  PrescanChunk,
  PickRefinement,
  PrescanResult,
  RefinementRequest,
  StabilityEntry,
} from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findRevisionById } from "../plants/plant-repository.js";

/**
 * The one place where the server meets core's comparison engine: the stored input turned into a
 * plan, the pre-scan chunk, the refinement and the analysis as steps a job can take, each with its
 * evaluations handed to an evaluator (the worker's thread pool, or in process).
 */

/** A comparison whose stored definition cannot be planned (a missing revision, a structure that does not fit a variant). */
export class ComparisonDefinitionError extends Error {
  override name = "ComparisonDefinitionError";
}

/** Evaluates parameter vectors (m × d) on the plan's family over `criteria` (core evaluateBatch's layout). */
export type VectorEvaluator = (plan: ComparisonPlan, vectors: Float64Array, criteria: readonly CriterionId[]) => Promise<BatchResult>;

/** The family of a stored input resolved from the library: one variant per revision, named by its label (else the plant's name). */
export async function resolveFamily(db: Database, input: ComparisonInput): Promise<ComparisonVariant[]> {
  const variants = input.family.variants;
  const family: ComparisonVariant[] = [];
  const names = new Set<string>();
  for (const [i, variant] of variants.entries()) {
    const revision = await findRevisionById(db, variant.plantRevisionId);
    if (!revision) throw new ComparisonDefinitionError(`family.variants.${i}: its plant revision no longer exists`);
    let name = variant.label && variant.label !== "" ? variant.label : revision.name;
    // Two variants of one plant keep apart by number.
    if (names.has(name)) name = `${name} #${i + 1}`;
    names.add(name);
    // Core applies a nonlinear plant's parameter overrides (and refuses ones that do not fit, naming the field).
    family.push({ name, plant: revision.model, ...(variant.parameters && Object.keys(variant.parameters).length > 0 ? { parameters: variant.parameters } : {}) });
  }
  return family;
}

/** Core's definition inside a stored input (everything but name and family). */
export function definitionOf(input: ComparisonInput): ComparisonDefinition {
  const { name: _name, family: _family, familyRevisionId: _familyRevisionId, ...definition } = input;
  return comparisonDefinitionSchema.parse(definition);
}

/** The plan of a stored input on its resolved family; a definition core refuses is a ComparisonDefinitionError with core's sentence. */
export function planOf(input: ComparisonInput, family: readonly ComparisonVariant[]): ComparisonPlan {
  try {
    return planComparison(definitionOf(input), family);
  } catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) throw new ComparisonDefinitionError(error.message);
    throw error;
  }
}

/** Loads and plans a stored comparison. */
export async function loadPlan(db: Database, input: ComparisonInput): Promise<ComparisonPlan> {
  return planOf(input, await resolveFamily(db, input));
}

/** Pre-scan points [start, end) evaluated on every variant and column (core prescanVectors + prescanChunk). */
export async function runPrescanChunk(plan: ComparisonPlan, start: number, end: number, evaluate: VectorEvaluator): Promise<PrescanChunk> {
  const vectors = prescanVectors(plan, start, end);
  return prescanChunk(plan, start, end, await evaluate(plan, vectors, plan.criteria));
}

/** A stored pre-scan chunk with its typed arrays rebuilt (JSON keeps them as plain arrays). */
export function revivePrescanChunk(stored: PrescanChunk): PrescanChunk {
  return {
    ...stored,
    status: Uint8Array.from(stored.status as ArrayLike<number>),
    scores: Float64Array.from(stored.scores as ArrayLike<number>),
    feasible: Uint8Array.from(stored.feasible as ArrayLike<number>),
    vectors: Float64Array.from(stored.vectors as ArrayLike<number>),
  };
}

/** The whole pre-scan from its stored chunks (core assemblePrescan checks they cover it exactly). */
export function prescanOf(plan: ComparisonPlan, chunks: readonly PrescanChunk[]): PrescanResult {
  return assemblePrescan(plan, chunks.map(revivePrescanChunk));
}

/**
 * The pick of contender k: core's refinement from its best pre-scan points, each request of the
 * ask/tell loop evaluated by `evaluate` (a few vectors at a time; the simplexes of all starts advance together).
 */
export async function runRefinement(plan: ComparisonPlan, k: number, prescan: PrescanResult, evaluate: VectorEvaluator): Promise<ComparisonPick> {
  const starts = pickStarts(plan, k, prescan);
  const [pick] = await driveRefinements([createPickRefinement(plan, k, starts.vectors, { startValues: starts.values })], plan, evaluate);
  return pick as ComparisonPick;
}

/**
 * A stored definition as the current comparisonInputSchema reads it (defaults filled in); one that
 * no longer parses is used as stored, and planning it then says what is wrong.
 */
export function storedInput(raw: unknown): ComparisonInput {
  const parsed = comparisonInputSchema.safeParse(raw);
  return parsed.success ? parsed.data : (raw as ComparisonInput);
}

/** Advances refinements round by round, the requests of a round evaluated together (a pool runs them side by side); returns their picks in order. */
export async function driveRefinements(refinements: readonly PickRefinement[], plan: ComparisonPlan, evaluate: VectorEvaluator): Promise<ComparisonPick[]> {
  for (;;) {
    const round: { refinement: PickRefinement; request: RefinementRequest }[] = [];
    for (const refinement of refinements) {
      if (refinement.done) continue;
      const request = refinement.ask();
      if (request !== null) round.push({ refinement, request });
    }
    if (round.length === 0) break;
    // A request carries its own setup (a stability variation may leave a variant out).
    const results = await Promise.all(round.map(({ request }) => evaluate({ ...plan, setup: request.setup }, request.vectors, request.criteria)));
    round.forEach(({ refinement }, i) => refinement.tell(results[i] as BatchResult));
  }
  return refinements.map((r) => r.result());
}

/**
 * The analysis of a comparison, stored as its result: the picks reconciled (a contender takes
 * over another's pick that is better on its own column), the stability variations when the budget
 * asks for them (each variant left out, each quadratic r halved and doubled: core's re-refinements,
 * evaluated by `evaluate`), then core's analyseComparison (cross-score, per variant, agreement,
 * summary).
 */
export async function runAnalysis(plan: ComparisonPlan, prescan: PrescanResult, stored: readonly ComparisonPick[], evaluate: VectorEvaluator): Promise<ComparisonAnalysis> {
  const picks = reconcilePicks(plan, stored);
  const stability: StabilityEntry[] = [];
  if (plan.budget.stability) {
    const variations = stabilityVariations(plan).map((variation) => ({ variation, ...createStabilityRefinements(plan, picks, variation) }));
    const refined = await driveRefinements(variations.flatMap((v) => v.refinements), plan, evaluate);
    let at = 0;
    for (const v of variations) {
      const own = refined.slice(at, at + v.refinements.length);
      at += v.refinements.length;
      stability.push(stabilityEntry(plan, picks, v.variation, v.contenders, own));
    }
  }
  return analyseComparison(plan, prescan, picks, stability);
}

/**
 * The variant that sets a pick's aggregate on column k: the one with the worst value there (the
 * largest, or the smallest for a larger-is-better column); 0 when none is a number or k is unknown.
 */
export function worstVariantOf(plan: ComparisonPlan, pick: ComparisonPick, k: number): number {
  const column = plan.columns[k];
  if (!column) return 0;
  const sign = column.better === "larger" ? -1 : 1;
  let worst = 0;
  let value = -Infinity;
  pick.perVariant.forEach((row, f) => {
    const v = sign * (row[k] as number);
    if (!Number.isNaN(v) && v > value) {
      value = v;
      worst = f;
    }
  });
  return worst;
}
