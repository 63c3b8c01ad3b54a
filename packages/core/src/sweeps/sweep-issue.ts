import type { z } from "zod";

/** One problem of a sweep definition: the dotted field path, the reason, and both as one sentence. */
export interface SweepIssue {
  /** Dotted path, array positions as numbers: "ranges.ki.max", "family.variants.0.plantRevisionId"; "" for the whole definition. */
  field: string;
  /** What is wrong and how to fix it, readable on its own beside the field (the web form shows it there). */
  reason: string;
  /** "<field>: <reason>" — the sentence the server answers with and the CLI prints. */
  sentence: string;
}

/** Dotted path of a zod issue path: ["ranges", "k[0]", "min"] → "ranges.k[0].min". */
export function dottedField(path: readonly PropertyKey[]): string {
  return path.map((part) => String(part)).join(".");
}

/**
 * The problems of a sweep definition refused by its schema, in zod's order, each with its field and
 * ONE sentence: the web form, the server and the CLI show the same words for the same bad sweep.
 */
export function sweepIssues(error: z.ZodError): SweepIssue[] {
  return error.issues.map((issue) => {
    const field = dottedField(issue.path);
    let reason = issue.message;
    if (issue.code === "invalid_type" && /received undefined$/.test(reason)) reason = "missing; this field is required";
    else if (issue.code === "unrecognized_keys") reason = `unknown field ${(issue as { keys: string[] }).keys.map((k) => `“${k}”`).join(", ")}; check its spelling`;
    return { field, reason, sentence: field === "" ? reason : `${field}: ${reason}` };
  });
}
