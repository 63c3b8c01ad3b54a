import type { z } from "zod";
import { CliInputError } from "./cli-error.js";
import { issueSentence } from "./format-issue.js";

/** Parses a spec with its schema, or throws a CliInputError with one sentence naming the first bad field. */
export function validateSpec<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const { field, message } = issueSentence(result.error, what);
  throw new CliInputError(message, field);
}

/**
 * Turns a RangeError or TypeError thrown by the engine for a spec that passed the schema (the
 * message names its field, e.g. "controller.k: …") into a CliInputError; rethrows anything else.
 */
export function asInputError(error: unknown): never {
  if (error instanceof RangeError || error instanceof TypeError) {
    const text = error.message.replace(/\.$/, "");
    const field = /^([\w.[\]]+)[: ]/.exec(text)?.[1];
    throw new CliInputError(`${text}.`, field);
  }
  throw error;
}
