import { createWriteStream } from "node:fs";
import { once } from "node:events";
import { gridDesign } from "../batch/grid-design.js";
import { latinHypercube } from "../batch/latin-hypercube.js";
import { seededRandomDesign } from "../batch/random-design.js";
import type { Plant } from "../plants/plant.js";
import { createEvaluationPool } from "../pool/evaluation-pool.js";
import { CliInputError } from "./cli-error.js";
import { createProgressReporter } from "./progress-reporter.js";
import { readSpec } from "./read-spec.js";
import { gridCounts, sweepSpecSchema, toParameterSpace, toStructure, variantNames, type SweepSpec } from "./sweep-spec.js";
import { sweepLines, type SweepFormat } from "./sweep-table.js";
import { asInputError, validateSpec } from "./validate-spec.js";

/** Options of `loopyard sweep`. */
export interface SweepCommandOptions {
  workers: number;
  format: SweepFormat;
  /** Output file; standard output when undefined. */
  out?: string;
  /** Where progress goes (standard error). */
  progress: NodeJS.WritableStream & { isTTY?: boolean };
}

/** Lines per write, so a large sweep is written in pieces that respect back-pressure. */
const LINES_PER_WRITE = 2000;

/**
 * `loopyard sweep FILE`: reads a sweep spec, draws the candidates of its design, evaluates them on
 * every variant of the family in a worker pool of `workers` threads and writes one row per
 * candidate and variant (see sweepLines). Throws a CliInputError for a bad file, JSON or spec.
 */
export async function sweepCommand(source: string, options: SweepCommandOptions): Promise<void> {
  const spec = validateSpec(sweepSpecSchema, await readSpec(source), "sweep spec");
  const structure = toStructure(spec);
  let candidates: Float64Array;
  try {
    candidates = designCandidates(spec);
  } catch (error) {
    asInputError(error);
  }
  const n = candidates.length / structure.tunable.length;
  const out = options.out === undefined ? process.stdout : await openOutput(options.out);
  const pool = createEvaluationPool({ workers: options.workers });
  const progress = createProgressReporter(options.progress, n);
  let result;
  try {
    result = await pool.evaluate(
      { family: spec.family.map((v) => v.plant as Plant), structure, candidates, scenario: spec.scenario,
        criteria: spec.criteria,
        ...(spec.criterionOptions === undefined ? {} : { evaluation: { criterion: spec.criterionOptions } }),
      },
      { onProgress: (done) => progress.update(done) },
    );
  } finally {
    await pool.close();
  }
  progress.finish();
  let pending: string[] = [];
  for (const line of sweepLines({ structure, candidates, variants: variantNames(spec), criteria: spec.criteria, result }, options.format)) {
    pending.push(line);
    if (pending.length >= LINES_PER_WRITE) {
      if (!out.write(pending.join(""))) await once(out, "drain");
      pending = [];
    }
  }
  if (pending.length > 0) out.write(pending.join(""));
  if (options.out !== undefined) {
    out.end();
    await once(out, "finish");
  }
}

/** Opens the --out file before the sweep runs, so a bad path fails fast as bad input. */
async function openOutput(path: string): Promise<NodeJS.WritableStream> {
  const stream = createWriteStream(path);
  try {
    await Promise.race([once(stream, "open"), once(stream, "error").then(([e]) => Promise.reject(e as Error))]);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? "error";
    throw new CliInputError(`--out: cannot write ${path} (${code}); give a writable file path.`, "--out");
  }
  return stream;
}

/** The candidate matrix of a validated spec's design. */
function designCandidates(spec: SweepSpec): Float64Array {
  const space = toParameterSpace(spec);
  const d = spec.design;
  if (d.kind === "grid") return gridDesign(space, gridCounts(spec));
  if (d.kind === "latin-hypercube") return latinHypercube(space, d.count, d.seed);
  return seededRandomDesign(space, d.count, d.seed);
}
