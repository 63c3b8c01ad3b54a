// The one place where a comparison meets the sweep machinery (the one sweep contract): the
// definition fields it shares with a sweep (structure, ranges = the box, fixed, filter, sampleTime,
// antiWindup, scenario, criterionOptions) and their checks, the family written inline as in
// `loopyard sweep`, planSweep for the structure, box, plants and the pre-scan's Sobol design, and
// the evaluation of parameter vectors on the family.
import type { z } from "zod";
import { evaluateBatch, type BatchResult, type EvaluationOptions } from "../batch/evaluate-batch.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import type { Structure } from "../batch/structure.js";
import { sweepSpecSchema } from "../cli/sweep-spec.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import type { SweepBatch } from "../sweeps/evaluate-sweep-chunk.js";
import { planSweep, type SweepPlan } from "../sweeps/plan-sweep.js";
import { checkSweepDefinition, sweepAggregateSchema, sweepDefinitionFields, withDefaultFilter, type SweepShape } from "../sweeps/sweep-input.js";

/**
 * The sweep definition fields a comparison shares, exactly as a sweep reads them: structure (the
 * controller kind), ranges (the box: { <param>: { min, max, scale? } }; a range's count is
 * ignored), fixed, filter, sampleTime, antiWindup, scenario, criterionOptions.
 */
export const comparisonSweepFields = {
  structure: sweepDefinitionFields.structure,
  ranges: sweepDefinitionFields.ranges,
  fixed: sweepDefinitionFields.fixed,
  filter: sweepDefinitionFields.filter,
  sampleTime: sweepDefinitionFields.sampleTime,
  antiWindup: sweepDefinitionFields.antiWindup,
  scenario: sweepDefinitionFields.scenario,
  criterionOptions: sweepDefinitionFields.criterionOptions,
};
/** The aggregate over the family, as in sweeps: {kind:"worst"} | {kind:"mean"} | {kind:"percentile", p}. */
export const comparisonAggregateSchema = sweepAggregateSchema;
/** The family written inline, as in `loopyard sweep`: { name?, variants: [{ label?, plant, parameters? }] }. */
export const comparisonFamilySchema = sweepSpecSchema.shape.family;

/** What a comparison definition holds of a sweep's fields, once parsed. */
export type ComparisonSweepFields = Pick<SweepShape, "structure" | "ranges" | "fixed" | "filter" | "sampleTime" | "antiWindup" | "scenario" | "criterionOptions">;
export type ComparisonFamilySpec = z.output<typeof comparisonFamilySchema>;

/** One resolved variant of a comparison's family: its name, its plant and, for a nonlinear plant, parameter overrides. */
export interface ComparisonVariant {
  name: string;
  plant: Plant;
  parameters?: Record<string, number>;
}

/** The sweep fields with the default derivative filter of a pid or pid2dof that gives neither a filter nor tf (withDefaultFilter). */
export function withComparisonDefaults<S extends ComparisonSweepFields>(fields: S): S {
  const { filter } = withDefaultFilter({ ...fields, criteria: [], design: { kind: "grid" }, aggregate: { kind: "worst" } });
  return filter === fields.filter ? fields : { ...fields, filter };
}

/**
 * Checks the sweep fields of a comparison with the sweeps' own rules and sentences
 * (checkSweepDefinition): parameter names of the structure, signs, required parameters, the
 * weight wsNorm needs among `criteria`, the scenario's size. `prescan` and `seed` make the check
 * see the pre-scan as a Sobol design.
 */
export function checkComparisonSweepFields(fields: ComparisonSweepFields, criteria: readonly CriterionId[], prescan: number, seed: number, ctx: z.RefinementCtx): void {
  checkSweepDefinition(sweepShape(fields, criteria, prescan, seed, []), ctx);
}

/** The inline family of a spec as resolved variants: labels, else v1, v2, …. */
export function familyVariants(family: ComparisonFamilySpec): ComparisonVariant[] {
  return family.variants.map((v, i) => ({ name: v.label || `v${i + 1}`, plant: v.plant as Plant, ...(v.parameters ? { parameters: v.parameters } : {}) }));
}

/** What evaluating a comparison's candidates needs, derived once by planSweep. */
export interface ComparisonSetup {
  /** One plant per variant, overrides applied. */
  family: readonly Plant[];
  variants: readonly string[];
  structure: Structure;
  /** The box: one axis per tunable parameter, in the structure's tunable order. */
  space: ParameterSpace;
  scenario: Scenario;
  /** evaluateCandidate's options (poles off; criterion options only when given, which keeps the fast paths). */
  evaluation: EvaluationOptions;
  /** The sweep plan of the pre-scan: a Sobol design of `prescan` points scrambled by the seed. */
  sweep: SweepPlan;
}

/**
 * The setup of a comparison through planSweep: a sweep of the comparison's fields over a Sobol
 * design of `prescan` points scrambled by `seed`, scoring `criteria`. Throws a SweepPlanError (a
 * RangeError naming the field) when the plants do not fit (variant overrides, state-feedback gains).
 */
export function comparisonSetup(
  fields: ComparisonSweepFields,
  family: readonly ComparisonVariant[],
  criteria: readonly CriterionId[],
  prescan: number,
  seed: number,
): ComparisonSetup {
  if (!Array.isArray(family) || family.length === 0) throw new RangeError("family: give at least one plant variant");
  const sweep = planSweep(sweepShape(fields, criteria, prescan, seed, family), family.map((v) => v.plant));
  return {
    family: sweep.family,
    variants: family.map((v) => v.name),
    structure: sweep.structure,
    space: sweep.space,
    scenario: sweep.scenario,
    evaluation: sweep.evaluation,
    sweep,
  };
}

/** Pre-scan candidates start … end − 1 (the sweep plan's Sobol design), n × d, a fresh copy. */
export function designVectors(setup: ComparisonSetup, start: number, end: number): Float64Array {
  return setup.sweep.vectors(start, end).slice();
}

/** Scores of `vectors` (m × d row-major) on every variant, in process (see evaluateBatch for the layout). */
export function evaluateVectors(setup: ComparisonSetup, vectors: Float64Array, criteria: readonly CriterionId[]): BatchResult {
  return evaluateBatch(setup.family, setup.structure, vectors, setup.scenario, criteria, { evaluation: setup.evaluation });
}

/** The same evaluation as one SweepBatch for a worker pool (@loopyard/core/pool): its result is evaluateVectors' byte for byte. */
export function vectorsBatch(setup: ComparisonSetup, vectors: Float64Array, criteria: readonly CriterionId[]): SweepBatch {
  return { family: setup.family, structure: setup.structure, candidates: vectors, scenario: setup.scenario, criteria, evaluation: setup.evaluation };
}

function sweepShape(fields: ComparisonSweepFields, criteria: readonly CriterionId[], prescan: number, seed: number, family: readonly ComparisonVariant[]): SweepShape {
  return {
    ...fields,
    criteria: [...criteria],
    design: { kind: "sobol", count: prescan, seed },
    aggregate: { kind: "worst" },
    ...(family.length > 0 ? { family: { variants: family.map((v) => ({ label: v.name, ...(v.parameters ? { parameters: v.parameters } : {}) })) } } : {}),
  };
}
