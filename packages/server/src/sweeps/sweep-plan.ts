import { assertValidStructure, controllerFromVector, linearPlantModel, sweepCandidates, sweepParameterNames, sweepStructure } from "@loopyard/core";
import type { Controller, EvaluationOptions, Plant, Scenario, Structure, SweepInputParsed } from "@loopyard/core";

/**
 * How a sweep evaluates a candidate, derived from its definition with core's shared helpers: the
 * structure, the names of the stored parameters, the scenario and the evaluation options.
 */
export interface SweepSetup {
  structure: Structure;
  /** Number of tunable parameters per candidate. */
  d: number;
  /** Names of CandidateDto.params (sweepParameterNames). */
  parameters: string[];
  scenario: Scenario;
  evaluation: EvaluationOptions;
}

/** What a sweep evaluates: its setup and the grid of tunable values (n × d, row-major). */
export interface SweepPlan extends SweepSetup {
  /** Tunable values, candidate i at i·d … i·d + d − 1 (sweepCandidates). */
  candidates: Float64Array;
}

/** The setup alone, for readers of stored results (no candidate list is generated: 10⁶ × d values for a large design). */
export function sweepSetup(definition: SweepInputParsed): SweepSetup {
  const structure = sweepStructure(definition);
  const evaluation: EvaluationOptions = { poles: false };
  // Without options the loop keeps core's fast scoring path.
  if (definition.criterionOptions !== undefined) evaluation.criterion = definition.criterionOptions;
  return {
    structure,
    d: structure.tunable.length,
    parameters: sweepParameterNames(definition),
    scenario: definition.scenario as Scenario,
    evaluation,
  };
}

export function sweepPlan(definition: SweepInputParsed): SweepPlan {
  // Search designs choose their candidates as they run (sweep-search-job.ts): no fixed list.
  const values = definition.design?.kind === "search" ? new Float64Array(0) : sweepCandidates(definition).values;
  return { ...sweepSetup(definition), candidates: values };
}

/** Number of states a state-feedback controller sees on this plant (its gains k[0] … k[n−1]). */
export function plantStateCount(plant: Plant): number {
  return plant.kind === "nonlinear" ? plant.states.length : linearPlantModel(plant).ss.n;
}

/**
 * Checks the structure against the plant (state feedback needs one gain per plant state);
 * returns the RangeError's sentence, or null when the structure fits.
 */
export function structureProblem(structure: Structure, plant: Plant): string | null {
  try {
    assertValidStructure(structure, structure.kind === "state-feedback" ? plantStateCount(plant) : undefined);
    return null;
  } catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) return error.message.replace(/^structure\.(tunable|fixed)[^:]*: /, "");
    throw error;
  }
}

/** The controller of candidate `index` of a plan. */
export function planController(plan: SweepPlan, index: number): Controller {
  return controllerFromVector(plan.structure, plan.candidates, index * plan.d);
}

/** The value of one named parameter of a controller (k[i] for state-feedback gains). */
export function controllerParameter(controller: Controller, name: string): number {
  const gain = /^k\[(\d+)\]$/.exec(name);
  if (gain && controller.kind === "state-feedback") return controller.k[Number(gain[1])] ?? Number.NaN;
  const value = (controller as unknown as Record<string, unknown>)[name];
  return typeof value === "number" ? value : Number.NaN;
}

/** The stored parameter vector of a candidate, in the order of plan.parameters. */
export function candidateParams(plan: SweepPlan, controller: Controller): number[] {
  return plan.parameters.map((name) => controllerParameter(controller, name));
}

/**
 * The tunable vector of a stored candidate, read by name from its stored params (in the order of
 * `parameters`), so that a stored candidate rebuilds exactly its controller.
 */
export function tunableFromParams(plan: SweepSetup, parameters: readonly string[], params: readonly number[]): Float64Array {
  return Float64Array.from(plan.structure.tunable, (name) => params[parameters.indexOf(name)] ?? Number.NaN);
}
