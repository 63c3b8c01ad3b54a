import type { z } from "zod";

/**
 * A field path as the user wrote it: object keys joined by dots, array positions in brackets,
 * e.g. ["family", 0, "plant", "den"] → "family[0].plant.den".
 */
export function fieldPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out;
}

/**
 * ONE sentence for the first problem zod found, naming the field: "plant.den: the leading
 * denominator coefficient must be non-zero." Unknown keys come first (a misspelt key explains the
 * missing one), then the issues in zod's order. `what` names the whole document for root issues.
 */
export function issueSentence(error: z.ZodError, what = "spec"): { field: string; message: string } {
  const issues = error.issues;
  const unknown = issues.find((i) => i.code === "unrecognized_keys");
  const issue = unknown ?? issues[0];
  const base = fieldPath(issue.path);
  if (issue.code === "unrecognized_keys") {
    const key = (issue as { keys: string[] }).keys[0];
    const field = base === "" ? key : `${base}.${key}`;
    return { field, message: `${field}: unknown field; check its spelling against the ${what} format in packages/core/README.md.` };
  }
  const field = base === "" ? what : base;
  let text = issue.message;
  if (issue.code === "invalid_type" && /received undefined$/.test(text)) text = "missing; this field is required";
  else if (issue.code === "invalid_type") text = text.replace(/^Invalid input: /, "");
  return { field, message: `${field}: ${text.replace(/\.$/, "")}.` };
}
