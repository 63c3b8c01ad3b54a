import { STEP_MODEL_KINDS, type StepModelKind } from "../identification/step-model.js";
import { TIME_UNITS, type TimeUnit } from "../identification/read-step-test.js";
import { CliInputError } from "./cli-error.js";

/** The parsed command line of `loopyard identify`. */
export interface IdentifyArguments {
  source: string;
  model: StepModelKind;
  time?: string;
  input?: string;
  output?: string;
  timeUnit?: TimeUnit;
  from?: number;
  to?: number;
}

/** Usage of `loopyard identify`. */
export const IDENTIFY_USAGE = `  loopyard identify FILE|- --model fopdt|sopdt|ipdt [options]
                                  fit a model to a step test (CSV or TSV); prints { model, parameters, intervals, r2 } as JSON
    --time COL --input COL --output COL   columns by header name or number from 1 (default 1, 2, 3)
    --time-unit s|ms|min|h        unit of the time column (default s)
    --from S --to S               keep only samples with from ≤ t ≤ to, in seconds`;

const OPTIONS = ["model", "time", "input", "output", "time-unit", "from", "to"] as const;

/**
 * Parses the arguments after `identify`. Throws a CliInputError (one sentence naming the option)
 * for an unknown option, a missing value, a missing FILE or a bad model, unit or time.
 */
export function parseIdentifyArguments(args: readonly string[]): IdentifyArguments {
  const positional: string[] = [];
  const flags: Record<string, string> = {};
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg.startsWith("--")) {
      const [name, inline] = arg.slice(2).split("=", 2);
      if (!(OPTIONS as readonly string[]).includes(name)) throw new CliInputError(`--${name}: unknown option for loopyard identify (use ${OPTIONS.map((o) => `--${o}`).join(", ")}).`);
      const value = inline ?? args[++i];
      if (value === undefined) throw new CliInputError(`--${name}: give a value.`);
      flags[name] = value;
    } else positional.push(arg);
  }
  if (positional.length === 0) throw new CliInputError("FILE: give the step-test file (CSV or TSV) of loopyard identify, or - for standard input.");
  if (positional.length > 1) throw new CliInputError(`${positional[1]}: loopyard identify takes one step-test file.`);
  const model = flags.model;
  if (model === undefined) throw new CliInputError("--model: give the model to fit, fopdt, sopdt or ipdt.");
  if (!(STEP_MODEL_KINDS as readonly string[]).includes(model)) throw new CliInputError(`--model: use fopdt, sopdt or ipdt, got "${model}".`);
  const timeUnit = flags["time-unit"];
  if (timeUnit !== undefined && !(timeUnit in TIME_UNITS)) throw new CliInputError(`--time-unit: use s, ms, min or h, got "${timeUnit}".`);
  const parsed: IdentifyArguments = { source: positional[0], model: model as StepModelKind };
  if (flags.time !== undefined) parsed.time = flags.time;
  if (flags.input !== undefined) parsed.input = flags.input;
  if (flags.output !== undefined) parsed.output = flags.output;
  if (timeUnit !== undefined) parsed.timeUnit = timeUnit as TimeUnit;
  for (const name of ["from", "to"] as const) {
    const text = flags[name];
    if (text === undefined) continue;
    const value = Number(text);
    if (text.trim() === "" || !Number.isFinite(value)) throw new CliInputError(`--${name}: give a time in seconds, got "${text}".`);
    parsed[name] = value;
  }
  return parsed;
}
