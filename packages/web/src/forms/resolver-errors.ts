import type { FieldErrors, FieldValues } from "react-hook-form";
import { FORM_LEVEL } from "./field-errors.js";

/**
 * Turns `{ "model.num": "message" }` into the nested error object react-hook-form expects
 * (`{ model: { num: { type, message } } }`); the form-level message goes to `root`.
 */
export function toResolverErrors<T extends FieldValues>(byField: Record<string, string>): FieldErrors<T> {
  const errors: Record<string, unknown> = {};
  for (const [field, message] of Object.entries(byField)) {
    if (field === FORM_LEVEL) {
      errors.root = { type: "validate", message };
      continue;
    }
    // A parent ("ranges") and its children ("ranges.kd.max") may both have problems: merge, never overwrite.
    const parts = field.split(".");
    let node = errors;
    parts.slice(0, -1).forEach((part) => {
      node[part] = (node[part] as Record<string, unknown> | undefined) ?? {};
      node = node[part] as Record<string, unknown>;
    });
    const leaf = parts[parts.length - 1];
    node[leaf] = Object.assign((node[leaf] as Record<string, unknown> | undefined) ?? {}, { type: "validate", message });
  }
  return errors as FieldErrors<T>;
}
