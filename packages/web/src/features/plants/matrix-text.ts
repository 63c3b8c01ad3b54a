/** Outcome of reading a typed matrix. */
export type MatrixParse = { ok: true; rows: number[][] } | { ok: false; message: string };

/** Rows end at a line break or a semicolon; entries are split on commas and/or whitespace. */
const ROW_SEPARATOR = /[\n;]+/;
const ENTRY_SEPARATOR = /[\s,]+/;
/** A plain decimal number with optional exponent; rejects "1e", "0x10", "Infinity", "". */
const NUMBER_TOKEN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a matrix typed as rows, one row per line (or separated by ";"), numbers separated by
 * spaces or commas: "0 1\n-2 -3" → [[0, 1], [-2, -3]]. Blank lines are skipped; the typographic
 * minus "−" is accepted. Fails with a message naming the first bad entry by row and column.
 * Shapes are not checked here (the shared state-space schema does that).
 */
export function parseMatrix(text: string, name: string): MatrixParse {
  const lines = text
    .replace(/\u2212/g, "-")
    .split(ROW_SEPARATOR)
    .map((line) => line.trim())
    .filter((line) => line.length > 0);
  if (lines.length === 0) return { ok: false, message: `type ${name} as rows of numbers, one row per line` };
  const rows: number[][] = [];
  for (const [r, line] of lines.entries()) {
    const row: number[] = [];
    for (const [c, token] of line.split(ENTRY_SEPARATOR).filter((t) => t.length > 0).entries()) {
      const value = Number(token);
      if (!NUMBER_TOKEN.test(token) || !Number.isFinite(value)) {
        return { ok: false, message: `“${token}” (row ${r + 1}, entry ${c + 1}) is not a number; use digits such as 2, −0.5 or 1e-3` };
      }
      row.push(value);
    }
    rows.push(row);
  }
  return { ok: true, rows };
}

/** Writes a matrix back as form text: one row per line, entries separated by spaces. */
export function formatMatrixText(rows: readonly (readonly number[])[]): string {
  return rows.map((row) => row.map((v) => String(v)).join(" ")).join("\n");
}
