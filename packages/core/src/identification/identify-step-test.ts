import { fitStepModel, type StepModelFit } from "./fit-step-model.js";
import { prepareStepTest, type StepTestPrepareOptions } from "./prepare-step-test.js";
import { readStepTest, type StepTest, type StepTestReadOptions } from "./read-step-test.js";
import type { StepModelKind } from "./step-model.js";

/** Everything identifyStepTest needs besides the file's text. */
export interface IdentifyOptions extends StepTestReadOptions, StepTestPrepareOptions {
  model: StepModelKind;
}

/** A fit with the step test it came from. */
export interface Identification {
  test: StepTest;
  fit: StepModelFit | { ok: false; reason: string };
}

/**
 * Reads a step test from the text of a CSV or TSV file (readStepTest), trims it and removes the
 * initial offset (prepareStepTest), and fits the chosen model (fitStepModel). Pure: no I/O.
 * Throws a StepTestFileError (one sentence naming the row and column) for a bad file; a fit that
 * cannot start is returned as { ok: false, reason }.
 */
export function identifyStepTest(text: string, options: IdentifyOptions): Identification {
  const test = readStepTest(text, options);
  const prepared = prepareStepTest(test, options);
  return { test, fit: fitStepModel(prepared, options.model) };
}
