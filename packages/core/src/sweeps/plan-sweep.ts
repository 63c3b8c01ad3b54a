import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { EvaluationOptions } from "../batch/evaluate-batch.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { assertValidStructure, controllerFromVector, StructureError, type Structure } from "../batch/structure.js";
import type { Controller } from "../controllers/controller.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import { sweepCandidateCount, sweepCandidates, sweepParameterNames, sweepSpace, sweepStructure, type SweepShape } from "./sweep-input.js";
import { SweepPlanError } from "./sweep-plan-error.js";

/**
 * Everything a sweep needs, derived once from its parsed definition and its plants (planSweep).
 * The web app, the server's jobs, the comparison engine and the CLI read the same plan.
 */
export interface SweepPlan {
  /** The parsed definition (sweepInputSchema or the CLI's sweepSpecSchema output). */
  readonly definition: SweepShape;
  /** One plant per variant, in family order, the variant's parameter overrides applied. */
  readonly family: readonly Plant[];
  /** The batch structure: kind, tunable names in candidate-vector order, fixed values, filter, anti-windup. */
  readonly structure: Structure;
  /** One axis per tunable name, with its bounds and scale. */
  readonly space: ParameterSpace;
  /** Tunable parameters per candidate (structure.tunable.length). */
  readonly d: number;
  /** Every parameter of a candidate's controller in display order (stored params, CandidateDto.params). */
  readonly parameters: readonly string[];
  readonly scenario: Scenario;
  /** Options of evaluateCandidate for every candidate (poles off; criterion options when given). */
  readonly evaluation: EvaluationOptions;
  readonly criteria: readonly CriterionId[];
  readonly aggregate: Aggregate;
  /** Candidate count: grid product, design count or search budget (sweepCandidateCount). */
  readonly budget: number;
  /** True for search designs (candidates come from the search as it runs; no index → vector). */
  readonly isSearch: boolean;
  /** Tunable vectors of candidates [start, end), n × d row-major (sampling designs only). */
  vectors(start: number, end: number): Float64Array;
  /** The controller of candidate `index` (sampling designs only). */
  controllerAt(index: number): Controller;
  /** The controller of the tunable vector at `values[offset …]`. */
  controllerOf(values: ArrayLike<number>, offset?: number): Controller;
  /** Controller → its parameters in `parameters` order (NaN for a name it lacks). */
  parametersOf(controller: Controller): number[];
  /** Stored parameters (in `parameters` order) → the tunable vector, so a stored candidate rebuilds its controller. */
  tunableOf(params: readonly number[]): Float64Array;
  /** Stored parameters → the controller (controllerOf ∘ tunableOf). */
  controllerFromParameters(params: readonly number[]): Controller;
}

/** Number of states a state-feedback controller sees on this plant (its gains k[0] … k[n−1]). */
export function plantStateCount(plant: Plant): number {
  return plant.kind === "nonlinear" ? plant.states.length : linearPlantModel(plant).ss.n;
}

/**
 * A variant's plant: the model, a nonlinear plant's parameters overridden by the variant's.
 * Throws a SweepPlanError on `family.variants.<i>.parameters` for overrides of a linear plant or
 * of a parameter the plant does not have.
 */
export function variantPlant(model: Plant, parameters: Readonly<Record<string, number>> | undefined, i = 0): Plant {
  if (!parameters || Object.keys(parameters).length === 0) return model;
  const field = `family.variants.${i}.parameters`;
  if (model.kind !== "nonlinear") throw new SweepPlanError(field, "variant parameters apply to nonlinear plants only; give a separate revision for a linear variant");
  for (const name of Object.keys(parameters)) {
    if (!(name in (model.parameters ?? {}))) {
      throw new SweepPlanError(field, `the plant has no parameter “${name}”; use ${Object.keys(model.parameters ?? {}).join(", ") || "none"}`);
    }
  }
  return { ...model, parameters: { ...model.parameters, ...parameters } };
}

/** The controller's value of one named parameter (k[i] for state-feedback gains); NaN when absent. */
export function controllerParameterValue(controller: Controller, name: string): number {
  const gain = /^k\[(\d+)\]$/.exec(name);
  if (gain && controller.kind === "state-feedback") return controller.k[Number(gain[1])] ?? Number.NaN;
  const value = (controller as unknown as Record<string, unknown>)[name];
  return typeof value === "number" ? value : Number.NaN;
}

/**
 * Plans a sweep once: its structure, parameter space and names, scenario, evaluation options,
 * budget and the maps candidate index → tunable vector → controller ⇄ stored parameters.
 *
 * definition: a parsed sweep definition (sweepInputSchema, or the CLI spec; already checked by
 * checkSweepDefinition). models: the plant of each variant in family order (one plant without a
 * family), before the variant's overrides.
 * Throws a SweepPlanError (a RangeError with `field` and `reason`) when the plants do not fit the
 * definition: a count that differs from the variants, overrides that do not apply, a state-feedback
 * structure whose gains are not one per plant state. Allocates nothing in proportion to the budget
 * until candidates are asked for.
 */
export function planSweep(definition: SweepShape, models: readonly Plant[]): SweepPlan {
  const variants = definition.family?.variants ?? [{}];
  if (!Array.isArray(models) || models.length !== variants.length) {
    throw new SweepPlanError("family", `the sweep has ${variants.length} variants but ${Array.isArray(models) ? models.length : 0} plants were given`);
  }
  const family = models.map((model, i) => variantPlant(model, variants[i]?.parameters, i));
  const structure = sweepStructure(definition);
  for (const plant of family) {
    try {
      assertValidStructure(structure, structure.kind === "state-feedback" ? plantStateCount(plant) : undefined);
    } catch (error) {
      if (!(error instanceof StructureError)) throw error;
      throw new SweepPlanError("ranges", error.reason);
    }
  }
  const parameters = sweepParameterNames(definition);
  const d = structure.tunable.length;
  const evaluation: EvaluationOptions = { poles: false };
  // Without options the loop keeps core's fast scoring path.
  if (definition.criterionOptions !== undefined) evaluation.criterion = definition.criterionOptions;
  const budget = sweepCandidateCount(definition);
  const isSearch = definition.design.kind === "search";
  let candidates: Float64Array | null = null;
  const all = (): Float64Array => {
    if (isSearch) throw new RangeError("design: a search design chooses its candidates as it runs; it has no candidate by index");
    candidates ??= sweepCandidates(definition).values;
    return candidates;
  };
  const checkRange = (start: number, end: number) => {
    if (!(Number.isInteger(start) && Number.isInteger(end) && 0 <= start && start <= end && end <= budget)) {
      throw new RangeError(`chunk [${start}, ${end}) lies outside the sweep's ${budget} candidates`);
    }
  };
  const controllerOf = (values: ArrayLike<number>, offset = 0) => controllerFromVector(structure, values, offset);
  const tunableOf = (params: readonly number[]) => Float64Array.from(structure.tunable, (name) => params[parameters.indexOf(name)] ?? Number.NaN);
  return {
    definition,
    family,
    structure,
    space: sweepSpace(definition),
    d,
    parameters,
    scenario: definition.scenario as Scenario,
    evaluation,
    criteria: [...definition.criteria],
    aggregate: definition.aggregate ?? { kind: "worst" },
    budget,
    isSearch,
    vectors(start, end) {
      checkRange(start, end);
      return all().subarray(start * d, end * d);
    },
    controllerAt(index) {
      checkRange(index, index + 1);
      return controllerOf(all(), index * d);
    },
    controllerOf,
    parametersOf: (controller) => parameters.map((name) => controllerParameterValue(controller, name)),
    tunableOf,
    controllerFromParameters: (params) => controllerOf(tunableOf(params)),
  };
}
