/**
 * A problem with what the user gave the CLI (a bad spec, a missing file, invalid JSON, a bad
 * option): printed as one sentence, exit code 2. Anything else is unexpected (exit code 1).
 */
export class CliInputError extends Error {
  override readonly name = "CliInputError";
  /** The dotted field path the sentence is about, when there is one (e.g. "plant.den"). */
  readonly field: string | undefined;

  constructor(message: string, field?: string) {
    super(message);
    this.field = field;
  }
}

export function isCliInputError(error: unknown): error is CliInputError {
  return error instanceof CliInputError;
}

/** Exit codes of the loopyard CLI. */
export const EXIT_OK = 0;
export const EXIT_UNEXPECTED = 1;
export const EXIT_BAD_INPUT = 2;
