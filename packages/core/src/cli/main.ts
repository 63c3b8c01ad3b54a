#!/usr/bin/env node
// The `loopyard` command line: evaluate one candidate, run a sweep or compare criteria (see packages/core/README.md, "CLI").
import { availableParallelism } from "node:os";
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_UNEXPECTED, isCliInputError } from "./cli-error.js";
import { baselinesCommand } from "./baselines-command.js";
import { boundCommand } from "./bound-command.js";
import { compareCommand } from "./compare-command.js";
import { evaluateCommand } from "./evaluate-command.js";
import { parseArguments, USAGE } from "./parse-arguments.js";
import { sweepCommand } from "./sweep-command.js";

// A reader that stops early (`loopyard sweep spec.json | head`) closes the pipe: stop quietly.
process.stdout.on("error", (error: NodeJS.ErrnoException) => {
  if (error.code === "EPIPE") process.exit(EXIT_OK);
  throw error;
});

async function main(argv: readonly string[]): Promise<number> {
  try {
    const parsed = parseArguments(argv, availableParallelism());
    if (parsed.command === "help") {
      process.stdout.write(`${USAGE}\n`);
      return EXIT_OK;
    }
    if (parsed.command === "evaluate") {
      process.stdout.write(`${await evaluateCommand(parsed.source)}\n`);
      return EXIT_OK;
    }
    if (parsed.command === "baselines") {
      process.stdout.write(`${await baselinesCommand(parsed.source)}\n`);
      return EXIT_OK;
    }
    if (parsed.command === "compare") {
      process.stdout.write(`${await compareCommand(parsed.source, { workers: parsed.workers })}\n`);
      return EXIT_OK;
    }
    if (parsed.command === "bound") {
      process.stdout.write(`${await boundCommand(parsed.source)}\n`);
      return EXIT_OK;
    }
    await sweepCommand(parsed.source, {
      workers: parsed.workers,
      format: parsed.format,
      progress: process.stderr,
      ...(parsed.out === undefined ? {} : { out: parsed.out }),
    });
    return EXIT_OK;
  } catch (error) {
    if (isCliInputError(error)) {
      process.stderr.write(`loopyard: ${error.message}\n`);
      return EXIT_BAD_INPUT;
    }
    process.stderr.write(`loopyard: unexpected error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return EXIT_UNEXPECTED;
  }
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
