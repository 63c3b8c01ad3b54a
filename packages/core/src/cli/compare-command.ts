import { comparisonSpecSchema } from "../comparison/comparison-definition.js";
import { planComparison, type ComparisonPlan } from "../comparison/comparison-plan.js";
import { runComparison } from "../comparison/run-comparison.js";
import { familyVariants, vectorsBatch } from "../comparison/sweep-adapter.js";
import { createEvaluationPool } from "../pool/evaluation-pool.js";
import { comparisonOutput } from "./compare-output.js";
import { toCliJson } from "./json-output.js";
import { readSpec } from "./read-spec.js";
import { asInputError, validateSpec } from "./validate-spec.js";

/** Options of `loopyard compare`. */
export interface CompareCommandOptions {
  /** Worker threads evaluating the candidates. */
  workers: number;
}

/**
 * `loopyard compare FILE|-`: reads a comparison spec (comparisonSpecSchema: family, structure,
 * ranges, fixed?, filter?, sampleTime?, antiWindup?, scenario, criterionOptions?, aggregate,
 * contenders, judges, constraints?, budget?, seed?), runs
 * the comparison with its evaluations on a worker pool of `workers` threads (the picks do not
 * depend on the number) and returns its JSON text (see comparisonOutput). Throws a CliInputError
 * (one sentence, exit code 2) for a bad file, JSON or spec.
 */
export async function compareCommand(source: string, options: CompareCommandOptions): Promise<string> {
  const spec = validateSpec(comparisonSpecSchema, await readSpec(source), "comparison spec");
  let plan: ComparisonPlan;
  try {
    plan = planComparison(spec, familyVariants(spec.family));
  } catch (error) {
    asInputError(error);
  }
  const pool = createEvaluationPool({ workers: options.workers });
  try {
    const analysis = await runComparison(plan, (request) => {
      const n = request.vectors.length / request.setup.structure.tunable.length;
      // Small requests (a simplex step) go whole to one worker; pre-scan chunks are spread.
      return pool.evaluate(vectorsBatch(request.setup, request.vectors, request.criteria), { chunkSize: Math.max(1, Math.ceil(n / options.workers)) });
    });
    return toCliJson(comparisonOutput(analysis));
  } finally {
    await pool.close();
  }
}
