import type { Controller } from "../controllers/controller.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Complex } from "../linear-algebra/complex.js";
import type { Plant } from "../plants/plant.js";
import { evaluateCandidate, type EvaluateCandidateOptions } from "../evaluation/evaluate-candidate.js";
import type { Scenario } from "../simulation/scenario.js";
import { evaluateSpecSchema } from "./evaluate-spec.js";
import { toCliJson } from "./json-output.js";
import { readSpec } from "./read-spec.js";
import { asInputError, validateSpec } from "./validate-spec.js";

/** What `loopyard evaluate` prints: the verdict, the closed-loop poles and the scores (null when not scored). */
export interface EvaluateOutput {
  status: string;
  poles: Complex[];
  criteria: Record<string, number> | null;
}

type Evaluate = (
  plant: Plant,
  controller: Controller,
  scenario: Scenario,
  criteria: readonly CriterionId[],
  options?: EvaluateCandidateOptions,
) => { status: string; poles: Complex[]; scores: Record<string, number> | null };

/**
 * `loopyard evaluate FILE|-`: reads one evaluate spec, evaluates the candidate with
 * evaluateCandidate and returns the JSON text to print (Infinity as "inf", NaN as null).
 * Throws a CliInputError for a bad file, bad JSON or a bad spec.
 */
export async function evaluateCommand(source: string): Promise<string> {
  const spec = validateSpec(evaluateSpecSchema, await readSpec(source), "evaluate spec");
  let result: ReturnType<Evaluate>;
  try {
    result = (evaluateCandidate as unknown as Evaluate)(spec.plant as Plant, spec.controller as Controller, spec.scenario, spec.criteria, {
      ...(spec.criterionOptions === undefined && spec.weight === undefined
        ? {}
        : { criterion: { ...spec.criterionOptions, ...(spec.weight === undefined ? {} : { weight: spec.weight }) } }),
    });
  } catch (error) {
    asInputError(error);
  }
  const output: EvaluateOutput = {
    status: result.status,
    poles: result.poles.map((p) => ({ re: p.re, im: p.im })),
    criteria: result.scores === null ? null : Object.fromEntries(spec.criteria.map((id) => [id, result.scores![id]])),
  };
  return toCliJson(output);
}
