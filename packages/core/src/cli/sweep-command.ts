import { createWriteStream } from "node:fs";
import { once } from "node:events";
import { createEvaluationPool } from "../pool/evaluation-pool.js";
import { evaluateSweepChunkWith, type SweepRow } from "../sweeps/evaluate-sweep-chunk.js";
import { runSweepSearch } from "../sweeps/sweep-search.js";
import { planSweep, type SweepPlan } from "../sweeps/plan-sweep.js";
import { SweepPlanError } from "../sweeps/sweep-plan-error.js";
import { firstSweepIssue } from "../sweeps/sweep-issue.js";
import { CliInputError } from "./cli-error.js";
import { createProgressReporter } from "./progress-reporter.js";
import { readSpec } from "./read-spec.js";
import { sweepSpecSchema, variantModels, variantNames, type SweepSpec } from "./sweep-spec.js";
import { sweepLines, type SweepFormat } from "./sweep-table.js";

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
 * The plan of a sweep spec through core's contract (sweepSpecSchema → planSweep), or a
 * CliInputError whose sentence is the one the server and the web form give for the same sweep.
 */
export function planSweepSpec(value: unknown): { spec: SweepSpec; plan: SweepPlan } {
  const parsed = sweepSpecSchema.safeParse(value);
  if (!parsed.success) {
    const issue = firstSweepIssue(parsed.error);
    throw new CliInputError(`${issue.sentence}.`, issue.field);
  }
  const spec = parsed.data;
  try {
    return { spec, plan: planSweep(spec, variantModels(spec)) };
  } catch (error) {
    if (error instanceof SweepPlanError) throw new CliInputError(`${error.message}.`, error.field);
    throw error;
  }
}

/**
 * `loopyard sweep FILE`: reads a sweep spec, plans it (planSweep), evaluates every candidate of its
 * design on every variant in a worker pool of `workers` threads (evaluateSweepChunkWith; a search
 * design generation by generation, runSweepSearch) and writes one row per candidate and variant
 * (see sweepLines). Throws a CliInputError for a bad file, JSON or spec.
 */
export async function sweepCommand(source: string, options: SweepCommandOptions): Promise<void> {
  const { spec, plan } = planSweepSpec(await readSpec(source));
  const out = options.out === undefined ? process.stdout : await openOutput(options.out);
  const pool = createEvaluationPool({ workers: options.workers });
  const progress = createProgressReporter(options.progress, plan.budget);
  let rows: SweepRow[];
  try {
    if (plan.isSearch) {
      // A search asks for its candidates generation by generation, up to its budget.
      rows = await runSweepSearch(plan, (batch) => pool.evaluate(batch), (done) => progress.update(done));
    } else {
      rows = (await evaluateSweepChunkWith(plan, { start: 0, end: plan.budget }, (batch) => pool.evaluate(batch, { onProgress: (done) => progress.update(done) }))).rows;
    }
  } finally {
    await pool.close();
  }
  progress.finish();
  let pending: string[] = [];
  for (const line of sweepLines({ parameters: plan.parameters, variants: variantNames(spec), criteria: plan.criteria, rows }, options.format)) {
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
