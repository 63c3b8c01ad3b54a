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

type Issue = z.core.$ZodIssue;

/**
 * The issues with each "none of the forms fits" (a union, e.g. a weight given as {num, den} or as a
 * preset) replaced by the issues of the form that came closest — the one with the fewest issues —
 * at their full paths, so that the sentence says what is wrong ("at most 11 coefficients") instead
 * of "Invalid input".
 */
function withUnionsOpened(issues: readonly Issue[]): Issue[] {
  return issues.flatMap((issue) => {
    const branches = issue.code === "invalid_union" ? (issue as { errors?: Issue[][] }).errors : undefined;
    if (!branches || branches.length === 0) return [issue];
    const closest = branches.reduce((best, branch) => (branch.length < best.length ? branch : best));
    if (closest.length === 0) return [issue];
    return withUnionsOpened(closest.map((inner) => ({ ...inner, path: [...issue.path, ...inner.path] }) as Issue));
  });
}

/**
 * The problems of a sweep definition refused by its schema, in zod's order, each with its field and
 * ONE sentence: the web form, the server and the CLI show the same words for the same bad sweep.
 */
export function sweepIssues(error: z.ZodError): SweepIssue[] {
  return withUnionsOpened(error.issues).map((issue) => {
    const field = dottedField(issue.path);
    let reason = issue.message;
    if (issue.code === "invalid_type" && /received undefined$/.test(reason)) reason = "missing; this field is required";
    else if (issue.code === "invalid_type") reason = reason.replace(/^Invalid input: /, "");
    if (issue.code === "unrecognized_keys") {
      const key = (issue as { keys: string[] }).keys[0] as string;
      const keyField = field === "" ? key : `${field}.${key}`;
      return { field: keyField, reason: "unknown field; check its spelling against the sweep format", sentence: `${keyField}: unknown field; check its spelling against the sweep format` };
    }
    return { field, reason, sentence: field === "" ? reason : `${field}: ${reason}` };
  });
}

/**
 * The one problem to report first: an unknown field when there is one (a misspelt key explains the
 * missing one), else zod's first issue. The server answers with its sentence, the CLI prints it and
 * the web form shows its reason at its field.
 */
export function firstSweepIssue(error: z.ZodError): SweepIssue {
  const issues = sweepIssues(error);
  // sweepIssues maps the opened issues one to one, so an index into them is an index into `issues`.
  const unknown = withUnionsOpened(error.issues).findIndex((i) => i.code === "unrecognized_keys");
  return issues[unknown >= 0 ? unknown : 0] ?? { field: "", reason: "the sweep is not valid", sentence: "the sweep is not valid" };
}
