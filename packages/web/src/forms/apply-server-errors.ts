import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { isApiError } from "../api/api-error.js";
import { FORM_LEVEL, apiIssues, fieldErrors } from "./field-errors.js";

/**
 * Puts the field problems of an API 400 next to the fields they name (the rest under root.server).
 * Returns false when the error names no field (403, 404, network…), so that the caller shows it whole.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  knownFields: readonly string[],
  setError: UseFormSetError<T>,
  /** Maps an API field path to the form's path when they differ (e.g. "ranges.k[0].min" → "ranges.k0.min"). */
  toField: (path: string) => string = (path) => path,
): boolean {
  if (!isApiError(error) || error.status !== 400) return false;
  const byField = fieldErrors(
    apiIssues(error).map((issue) => ({ path: toField(String(issue.path)), message: issue.message })),
    knownFields,
  );
  const entries = Object.entries(byField);
  if (entries.length === 0) return false;
  for (const [field, message] of entries) {
    if (field === FORM_LEVEL) setError("root.server", { type: "server", message });
    else setError(field as Path<T>, { type: "server", message });
  }
  return true;
}
