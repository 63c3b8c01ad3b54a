import { readFile } from "node:fs/promises";
import { identifyStepTest } from "../identification/identify-step-test.js";
import type { IdentifiedTransferFunction } from "../identification/step-model.js";
import { isStepTestFileError } from "../identification/step-test-file-error.js";
import { CliInputError } from "./cli-error.js";
import { IDENTIFY_USAGE, parseIdentifyArguments } from "./identify-arguments.js";
import { toCliJson } from "./json-output.js";

/** What `loopyard identify` prints. */
export interface IdentifyOutput {
  model: IdentifiedTransferFunction;
  parameters: Record<string, number>;
  intervals: Record<string, [number, number]>;
  r2: number;
}

/**
 * `loopyard identify FILE|- --model fopdt|sopdt|ipdt [--time COL --input COL --output COL]
 * [--time-unit U] [--from S --to S]`: reads a step test, fits the model (identifyStepTest) and
 * returns the JSON text `{ model, parameters, intervals, r2 }` (intervals at 95 %). Throws a
 * CliInputError (exit 2, one sentence) for bad arguments, an unreadable file, a bad row or column
 * of the file, or data the model cannot start from. With --help, returns the usage text instead.
 */
export async function identifyCommand(args: readonly string[], stdin: NodeJS.ReadableStream = process.stdin): Promise<string> {
  if (args.includes("--help") || args.includes("-h")) return `Usage:\n${IDENTIFY_USAGE}`;
  const options = parseIdentifyArguments(args);
  const label = options.source === "-" ? "standard input" : options.source;
  const text = await readText(options.source, label, stdin);
  let result: ReturnType<typeof identifyStepTest>;
  try {
    result = identifyStepTest(text, {
      model: options.model,
      columns: { time: options.time, input: options.input, output: options.output },
      ...(options.timeUnit === undefined ? {} : { timeUnit: options.timeUnit }),
      trim: { from: options.from, to: options.to },
    });
  } catch (error) {
    if (isStepTestFileError(error)) throw new CliInputError(`${label}: ${lowerFirst(error.message)}`);
    if (error instanceof RangeError) throw new CliInputError(`${error.message}.`);
    throw error;
  }
  const { fit } = result;
  if (!fit.ok) throw new CliInputError(`${label}: cannot fit ${options.model}: ${fit.reason}.`);
  const output: IdentifyOutput = { model: fit.model, parameters: fit.parameters, intervals: fit.intervals, r2: fit.r2 };
  return toCliJson(output);
}

async function readText(source: string, label: string, stdin: NodeJS.ReadableStream): Promise<string> {
  try {
    if (source !== "-") return await readFile(source, "utf8");
    const chunks: Buffer[] = [];
    for await (const chunk of stdin) chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : (chunk as Buffer));
    return Buffer.concat(chunks).toString("utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "ENOENT") throw new CliInputError(`${label}: no such file; give the path of a CSV or TSV step test, or - to read standard input.`);
    if (code === "EISDIR") throw new CliInputError(`${label}: is a directory; give the path of a CSV or TSV step test.`);
    if (code === "EACCES") throw new CliInputError(`${label}: permission denied; make the step-test file readable.`);
    throw error;
  }
}

function lowerFirst(sentence: string): string {
  return /^(Row|The|Column)\b/.test(sentence) ? sentence[0].toLowerCase() + sentence.slice(1) : sentence;
}
