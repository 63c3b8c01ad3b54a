// One short line per set-up step; a failed step says what failed and how to fix it.
import { spawn } from "node:child_process";
import { createWriteStream, mkdirSync } from "node:fs";
import { join } from "node:path";
import { LOG_DIR, REPO_ROOT, rel } from "./paths.mjs";

/** A set-up step that failed, with a sentence on how to fix it. */
export class StepError extends Error {
  /** @param {string} message what failed  @param {string} [hint] how to fix it  @param {string} [detail] extra output */
  constructor(message, hint, detail) {
    super(message);
    this.name = "StepError";
    this.hint = hint;
    this.detail = detail;
  }
}

const PREFIX = "loopyard ·";

/** The npm command the user ran ("npm start", "npm test"), for hints that say "run it again with …". */
export function rerunCommand() {
  const event = process.env.npm_lifecycle_event;
  return event === "test" || event === "start" ? `npm ${event}` : "npm start";
}

export function say(line) {
  process.stdout.write(`${PREFIX} ${line}\n`);
}

/**
 * Runs one step: prints "label …" and then "done (1.2 s)" or the failure.
 * The function may return a short note, printed instead of "done".
 */
export async function step(label, fn) {
  const started = Date.now();
  process.stdout.write(`${PREFIX} ${label} … `);
  try {
    const note = await fn();
    const seconds = ((Date.now() - started) / 1000).toFixed(1);
    process.stdout.write(`${note ?? "done"} (${seconds} s)\n`);
    return note;
  } catch (error) {
    process.stdout.write("failed\n");
    throw error;
  }
}

/** Prints a failure (StepError or anything else) and exits non-zero. */
export function failAndExit(error) {
  if (error instanceof StepError) {
    process.stderr.write(`\n✗ ${error.message}\n`);
    if (error.detail) process.stderr.write(`${indent(error.detail.trimEnd())}\n`);
    if (error.hint) process.stderr.write(`→ ${error.hint}\n`);
  } else {
    process.stderr.write(`\n✗ Unexpected error: ${error?.stack ?? error}\n`);
  }
  process.exit(1);
}

function indent(text) {
  return text
    .split("\n")
    .map((line) => `    ${line}`)
    .join("\n");
}

/** Last `count` lines of a text. */
export function tail(text, count = 20) {
  const lines = text.trimEnd().split("\n");
  return lines.slice(-count).join("\n");
}


/**
 * Runs a command with its output captured into .data/logs/<logName>.log.
 * Resolves with { code, output }; never throws on a non-zero exit (callers decide).
 */
export function runCaptured(command, args, { logName, env, cwd = REPO_ROOT } = {}) {
  mkdirSync(LOG_DIR, { recursive: true });
  const logPath = join(LOG_DIR, `${logName}.log`);
  const log = createWriteStream(logPath);
  log.write(`$ ${command} ${args.join(" ")}\n`);
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd,
      env: { ...process.env, ...env },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let output = "";
    const collect = (chunk) => {
      output += chunk;
      log.write(chunk);
    };
    child.stdout.on("data", collect);
    child.stderr.on("data", collect);
    child.on("error", (error) => {
      log.end();
      reject(new StepError(`Could not run ${command}: ${error.message}`, `Check that ${command} is installed and on PATH.`));
    });
    child.on("close", (code) => {
      log.end(() => resolve({ code: code ?? 1, output, logPath: rel(logPath) }));
    });
  });
}

/**
 * The lines of a build's output that say what went wrong (compiler and bundler errors), without
 * stack frames and npm's own lifecycle noise; the output's tail when none match.
 */
export function errorLines(output, count = 20) {
  const picked = output
    .split("\n")
    .filter((line) => /error/i.test(line) && !/npm error|ERR!|^\s*at |\bat async\b|errors: \[/.test(line) && !/\s+at\s/.test(line.replace(/^[^:]*:/, "")));
  return picked.length > 0 ? picked.slice(0, count).join("\n") : tail(output, count);
}

/** Like runCaptured but throws a StepError (with the output's tail, or its error lines) on a non-zero exit. */
export async function runOrFail(command, args, { logName, env, cwd, what, hint, errorsOnly = false }) {
  const result = await runCaptured(command, args, { logName, env, cwd });
  if (result.code !== 0) {
    throw new StepError(
      `${what} failed (exit code ${result.code}); full output in ${result.logPath}.`,
      hint,
      errorsOnly ? errorLines(result.output) : tail(result.output, 25),
    );
  }
  return result;
}
