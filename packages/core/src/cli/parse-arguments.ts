import { CliInputError } from "./cli-error.js";
import { SWEEP_FORMATS, type SweepFormat } from "./sweep-table.js";

/** The parsed command line of `loopyard`. */
export type CliCommand =
  | { command: "help" }
  | { command: "evaluate"; source: string }
  | { command: "bound"; source: string }
  | { command: "baselines"; source: string }
  | { command: "sweep"; source: string; workers: number; format: SweepFormat; out?: string }
  | { command: "compare"; source: string; workers: number };

/** Usage text printed by `loopyard help`. */
export const USAGE = `Usage:
  loopyard evaluate FILE|-        evaluate one candidate; prints { status, poles, criteria } as JSON
  loopyard sweep FILE [options]   evaluate a sweep design on a plant family; writes one row per candidate and variant
    --workers N                   worker threads (default: the number of CPUs)
    --format csv|jsonl            output format (default: csv, or jsonl when --out ends in .jsonl)
    --out FILE                    write to FILE instead of standard output
  loopyard compare FILE|- [--workers N]
                                  pit contending criteria against each other on a family; prints { picks, crossScore, agreement, … } as JSON
  loopyard bound FILE|-           solve the LQR problem { A, B, Q, R, x0 }; prints { K, P, poles, cost } as JSON
  loopyard baselines FILE|-       published tuning rules for a plant, each scored; prints { baselines } as JSON
  loopyard help                   this text
Spec formats: packages/core/README.md, section "CLI". Exit codes: 0 done, 2 bad input, 1 unexpected error.`;

/**
 * Parses argv (without node and the script). Throws a CliInputError (one sentence) for an unknown
 * command or option, a missing FILE or a bad option value.
 */
export function parseArguments(argv: readonly string[], defaultWorkers: number): CliCommand {
  const [command, ...rest] = argv;
  if (command === undefined || command === "help" || command === "--help" || command === "-h") return { command: "help" };
  if (command !== "evaluate" && command !== "sweep" && command !== "bound" && command !== "baselines" && command !== "compare") {
    throw new CliInputError(`${command}: unknown command; use "loopyard evaluate FILE" or "loopyard sweep FILE" (loopyard help lists the options).`);
  }
  const positional: string[] = [];
  const flags: Record<string, string> = {};
  for (let i = 0; i < rest.length; i++) {
    const arg = rest[i];
    if (arg.startsWith("--")) {
      const [name, inline] = arg.slice(2).split("=", 2);
      if (!(command === "sweep" ? ["workers", "format", "out"] : command === "compare" ? ["workers"] : []).includes(name)) {
        throw new CliInputError(`--${name}: unknown option for loopyard ${command}.`);
      }
      const value = inline ?? rest[++i];
      if (value === undefined) throw new CliInputError(`--${name}: give a value.`);
      flags[name] = value;
    } else positional.push(arg);
  }
  if (positional.length === 0) throw new CliInputError(`FILE: give the spec file of loopyard ${command}${command === "sweep" ? "" : " (or - for standard input)"}.`);
  if (positional.length > 1) throw new CliInputError(`${positional[1]}: loopyard ${command} takes one spec file.`);
  const source = positional[0];
  if (command === "evaluate" || command === "bound" || command === "baselines") return { command, source };
  if (command === "compare") return { command, source, workers: workersOption(flags.workers, defaultWorkers) };
  if (source === "-") throw new CliInputError("FILE: loopyard sweep reads its spec from a file, not standard input.");
  const workers = workersOption(flags.workers, defaultWorkers);
  const out = flags.out;
  let format: SweepFormat = out !== undefined && out.endsWith(".jsonl") ? "jsonl" : "csv";
  if (flags.format !== undefined) {
    if (!(SWEEP_FORMATS as readonly string[]).includes(flags.format)) throw new CliInputError(`--format: use csv or jsonl, got "${flags.format}".`);
    format = flags.format as SweepFormat;
  }
  return { command, source, workers, format, ...(out === undefined ? {} : { out }) };
}

/** The --workers value: a whole number from 1 to 256, or the default when not given. */
function workersOption(value: string | undefined, defaultWorkers: number): number {
  if (value === undefined) return defaultWorkers;
  const workers = Number(value);
  if (!/^\d+$/.test(value) || workers < 1 || workers > 256) throw new CliInputError(`--workers: give a whole number from 1 to 256, got "${value}".`);
  return workers;
}
