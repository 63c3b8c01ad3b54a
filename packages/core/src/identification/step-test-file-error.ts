/**
 * A step-test file that cannot be read as a step test: the message is one sentence naming the
 * row and column where the problem lies, when there is one (rows are the file's lines counted
 * from 1, the header line included; columns are counted from 1).
 */
export class StepTestFileError extends Error {
  override readonly name = "StepTestFileError";
  /** The file's line (1-based) the sentence is about, when there is one. */
  readonly row: number | undefined;
  /** The column (1-based) the sentence is about, when there is one. */
  readonly column: number | undefined;

  constructor(message: string, row?: number, column?: number) {
    super(message);
    this.row = row;
    this.column = column;
  }
}

export function isStepTestFileError(error: unknown): error is StepTestFileError {
  return error instanceof StepTestFileError;
}
