/** Outcome of reading declared names or parameter lines of a nonlinear plant. */
export type TextParse<T> = { ok: true; value: T } | { ok: false; message: string };

const NAME_SEPARATOR = /[\s,]+/;
const NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;
const NUMBER_TOKEN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads state names typed as a list, "h" or "x1, x2" or "T q": letters, digits and "_", starting
 * with a letter or "_", each once. The expression compiler checks the rest (reserved words, length).
 */
export function parseNames(text: string): TextParse<string[]> {
  const names = text.split(NAME_SEPARATOR).filter((n) => n.length > 0);
  if (names.length === 0) return { ok: false, message: "name at least one state, e.g. h" };
  const seen = new Set<string>();
  for (const name of names) {
    if (!NAME.test(name)) return { ok: false, message: `“${name}” is not a usable name; use letters, digits and _, starting with a letter` };
    if (seen.has(name)) return { ok: false, message: `“${name}” is named twice` };
    seen.add(name);
  }
  return { ok: true, value: names };
}

/** State names for display while the user types: the valid-looking names, at most `limit`. */
export function previewNames(text: string, limit: number): string[] {
  return text
    .split(NAME_SEPARATOR)
    .filter((n) => n.length > 0)
    .slice(0, limit);
}

/**
 * Reads parameters typed one per line as "name = value" (":" also accepted; blank lines skipped):
 * "a = 0.8\nA = 2.5" → { a: 0.8, A: 2.5 }. Fails naming the line.
 */
export function parseParameters(text: string): TextParse<Record<string, number>> {
  const parameters: Record<string, number> = {};
  const lines = text.replace(/\u2212/g, "-").split("\n");
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (line.length === 0) continue;
    const match = /^([^=:]*)[=:](.*)$/.exec(line);
    if (!match) return { ok: false, message: `line ${i + 1} (“${line}”): write name = value, e.g. a = 0.8` };
    const name = match[1].trim();
    const valueText = match[2].trim();
    if (!NAME.test(name)) return { ok: false, message: `line ${i + 1}: “${name}” is not a usable name; use letters, digits and _, starting with a letter` };
    if (Object.hasOwn(parameters, name)) return { ok: false, message: `line ${i + 1}: “${name}” is given twice` };
    const value = Number(valueText);
    if (!NUMBER_TOKEN.test(valueText) || !Number.isFinite(value)) {
      return { ok: false, message: `line ${i + 1}: “${valueText}” is not a number; use digits such as 2, 0.5 or 1e-3` };
    }
    parameters[name] = value;
  }
  return { ok: true, value: parameters };
}

/** Writes parameters back as form text, one "name = value" per line. */
export function formatParametersText(parameters: Readonly<Record<string, number>>): string {
  return Object.entries(parameters)
    .map(([name, value]) => `${name} = ${value}`)
    .join("\n");
}
