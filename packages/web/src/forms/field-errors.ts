/** One problem with one input, as zod reports it (path) or as the API reports it (dotted field). */
export interface FieldIssue {
  path: readonly PropertyKey[] | string;
  message: string;
}

/** The key under which a problem no form field claims is shown (at the top of the form). */
export const FORM_LEVEL = "";

export function dottedPath(path: readonly PropertyKey[] | string): string {
  return typeof path === "string" ? path : path.map((p) => String(p)).join(".");
}

/**
 * Assigns each problem to the form field it names: the longest known field that equals the
 * problem's dotted path or is a prefix of it ("model.num.2" → "model.num"). Problems no field
 * claims go under FORM_LEVEL. The first message per field wins.
 */
export function fieldErrors(issues: readonly FieldIssue[], knownFields: readonly string[]): Record<string, string> {
  const byLength = [...knownFields].sort((a, b) => b.length - a.length);
  const result: Record<string, string> = {};
  for (const issue of issues) {
    const dotted = dottedPath(issue.path);
    const field = byLength.find((f) => dotted === f || dotted.startsWith(`${f}.`)) ?? FORM_LEVEL;
    if (!(field in result)) result[field] = field === FORM_LEVEL && dotted ? `${dotted}: ${issue.message}` : issue.message;
  }
  return result;
}

/**
 * The field problems of an API 400 as issues: every `issues` entry, or else the single
 * `field` with the message (the server prefixes messages with "field: ", which is dropped here).
 */
export function apiIssues(error: { field?: string; message: string; issues?: { field: string; message: string }[] }): FieldIssue[] {
  const strip = (field: string, message: string) => (message.startsWith(`${field}: `) ? message.slice(field.length + 2) : message);
  if (error.issues && error.issues.length > 0) return error.issues.map((i) => ({ path: i.field, message: strip(i.field, i.message) }));
  if (error.field) return [{ path: error.field, message: strip(error.field, error.message) }];
  return [];
}
