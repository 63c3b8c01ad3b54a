// The one place where a comparison meets the sweep machinery: the spec pieces it shares with
// `loopyard sweep` (family, structure with its box, scenario, criterion options, aggregate), the
// structure and box they stand for, and the evaluation of parameter vectors on the family.
// When the one sweep contract (planSweep / evaluateSweepChunk) lands, only this file changes.
import type { z } from "zod";
import { evaluateBatch, type BatchResult, type EvaluationOptions } from "../batch/evaluate-batch.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { assertValidStructure, type Structure } from "../batch/structure.js";
import { sweepSpecSchema } from "../cli/sweep-spec.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { CriterionOptions } from "../criteria/criterion-definition.js";
import type { Plant } from "../plants/plant.js";
import type { ChunkTask } from "../pool/chunk-task.js";
import type { Scenario } from "../simulation/scenario.js";
import { criterionOptionsSchema, sweepAggregateSchema } from "../sweeps/sweep-input.js";

/** One plant variant written inline, as in the `loopyard sweep` spec: { name?, plant }. */
export const comparisonVariantSchema = sweepSpecSchema.shape.family.element;
/** The structure with its bounded box, as in `loopyard sweep`: { kind, tunable: { name: {min, max, scale?} }, fixed?, filter?, antiWindup? }. */
export const comparisonStructureSchema = sweepSpecSchema.shape.structure;
/** The scenario, as in `loopyard sweep`. */
export const comparisonScenarioSchema = sweepSpecSchema.shape.scenario;
/** Criterion options (q, r, settlingBand, horizon, weight), as in `loopyard sweep`. */
export const comparisonCriterionOptionsSchema = criterionOptionsSchema.strict();
/** The aggregate over the family, as in sweeps: {kind:"worst"} | {kind:"mean"} | {kind:"percentile", p}. */
export const comparisonAggregateSchema = sweepAggregateSchema;

export type ComparisonStructureSpec = z.output<typeof comparisonStructureSchema>;
export type ComparisonScenarioSpec = z.output<typeof comparisonScenarioSchema>;

/** One resolved variant of a comparison's family: its name and plant. */
export interface ComparisonVariant {
  name: string;
  plant: Plant;
}

/** What evaluating a comparison's candidates needs, derived once from its definition and family. */
export interface ComparisonSetup {
  family: readonly Plant[];
  variants: readonly string[];
  structure: Structure;
  /** The box: one axis per tunable parameter, in the structure's tunable order. */
  space: ParameterSpace;
  scenario: Scenario;
  /** Criterion options for evaluateCandidate; absent when the definition gives none (keeps the fast paths). */
  evaluation?: EvaluationOptions;
}

/**
 * The setup of a comparison: the batch Structure (tunable in the spec's key order), its box and
 * the family's plants. Throws a RangeError naming `structure…` or `family` when the engine
 * rejects them (the schema has already checked the shapes).
 */
export function comparisonSetup(
  structure: ComparisonStructureSpec,
  scenario: ComparisonScenarioSpec,
  criterionOptions: CriterionOptions | undefined,
  family: readonly ComparisonVariant[],
): ComparisonSetup {
  if (!Array.isArray(family) || family.length === 0) throw new RangeError("family: give at least one plant variant");
  const batchStructure: Structure = {
    kind: structure.kind,
    tunable: Object.keys(structure.tunable),
    fixed: structure.fixed,
    ...(structure.filter ? { filter: structure.filter } : {}),
    ...(structure.antiWindup ? { antiWindup: structure.antiWindup } : {}),
  };
  assertValidStructure(batchStructure);
  const space: ParameterSpace = Object.entries(structure.tunable).map(([name, a]) => ({ name, min: a.min, max: a.max, scale: a.scale }));
  return {
    family: family.map((v) => v.plant),
    variants: family.map((v) => v.name),
    structure: batchStructure,
    space,
    scenario: scenario as Scenario,
    ...(criterionOptions === undefined ? {} : { evaluation: { criterion: criterionOptions } }),
  };
}

/** Scores of `vectors` (m × d row-major) on every variant, in process (see evaluateBatch for the layout). */
export function evaluateVectors(setup: ComparisonSetup, vectors: Float64Array, criteria: readonly CriterionId[]): BatchResult {
  return evaluateBatch(setup.family, setup.structure, vectors, setup.scenario, criteria, setup.evaluation === undefined ? {} : { evaluation: setup.evaluation });
}

/** The same evaluation as one batch for the worker pool (@loopyard/core/pool): its result is evaluateVectors' byte for byte. */
export function vectorsBatch(setup: ComparisonSetup, vectors: Float64Array, criteria: readonly CriterionId[]): ChunkTask {
  return {
    family: setup.family,
    structure: setup.structure,
    candidates: vectors,
    scenario: setup.scenario,
    criteria,
    ...(setup.evaluation === undefined ? {} : { evaluation: setup.evaluation }),
  };
}
