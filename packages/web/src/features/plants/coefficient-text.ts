/** Outcome of reading a typed coefficient list. */
export type CoefficientParse = { ok: true; values: number[] } | { ok: false; message: string };

/** Tokens split on commas and/or whitespace: "1, 3 2" and "1,3,2" and "1 3 2" read alike. */
const SEPARATOR = /[\s,;]+/;
/** A plain decimal number with optional exponent; rejects "1e", "0x10", "Infinity", "". */
const NUMBER_TOKEN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads coefficients typed in descending powers of s, e.g. "16 10 1" → [16, 10, 1].
 * Accepts the typographic minus "−". Fails with a message naming the first bad token.
 */
export function parseCoefficients(text: string): CoefficientParse {
  const trimmed = text.replace(/\u2212/g, "-").trim();
  if (trimmed.length === 0) return { ok: false, message: "type at least one coefficient, e.g. 1 3 2 for s² + 3s + 2" };
  const tokens = trimmed.split(SEPARATOR).filter((t) => t.length > 0);
  const values: number[] = [];
  for (const [position, token] of tokens.entries()) {
    if (!NUMBER_TOKEN.test(token)) {
      return { ok: false, message: `“${token}” (coefficient ${position + 1}) is not a number; use digits such as 2, 0.5 or 1e-3` };
    }
    const value = Number(token);
    if (!Number.isFinite(value)) return { ok: false, message: `“${token}” (coefficient ${position + 1}) is too large` };
    values.push(value);
  }
  return { ok: true, values };
}

/** Writes coefficients back as text for a prefilled form: [1, 3, 2] → "1 3 2". */
export function formatCoefficientText(values: readonly number[]): string {
  return values.map((v) => String(v)).join(" ");
}
