import type { RevisionChangeGroup } from "@loopyard/core";

/** Headings of the diff's groups. */
export const GROUP_LABELS: Record<RevisionChangeGroup, string> = {
  description: "Name and notes",
  coefficients: "Coefficients and dead time",
  matrices: "Matrices",
  expressions: "Expressions and states",
  parameters: "Parameters",
  limits: "Actuator limits",
  variants: "Variants",
};

/**
 * A changed value as one line: numbers with their sign (−1, not 1), strings quoted, lists and
 * matrices in brackets, a variant as its label and parameters. At most `max` characters.
 */
export function changeValueText(value: unknown, max = 160): string {
  const text = valueText(value);
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

function valueText(value: unknown): string {
  if (value === undefined) return "—";
  if (typeof value === "number") return Object.is(value, -0) ? "0" : String(value).replace("-", "−");
  if (typeof value === "string") return `“${value}”`;
  if (Array.isArray(value)) return `[${value.map(valueText).join(", ")}]`;
  if (value !== null && typeof value === "object") {
    const record = value as Record<string, unknown>;
    if (typeof record.plantRevisionId === "string") {
      const params = record.parameters as Record<string, number> | undefined;
      const list = params ? Object.entries(params).map(([k, v]) => `${k} ${valueText(v)}`).join(", ") : "";
      return `${typeof record.label === "string" ? record.label : "variant"}${list ? ` (${list})` : ""}`;
    }
    return `{ ${Object.entries(record).map(([k, v]) => `${k}: ${valueText(v)}`).join(", ")} }`;
  }
  return String(value);
}
