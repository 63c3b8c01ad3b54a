import { describe, expect, it } from "vitest";
import { formatMatrixText, parseMatrix } from "../../../src/features/plants/matrix-text.js";

describe("parseMatrix", () => {
  it("parseMatrix reads one row per line or per semicolon, entries split on spaces and commas", () => {
    expect(parseMatrix("0 1\n-2, -3", "A")).toEqual({ ok: true, rows: [[0, 1], [-2, -3]] });
    expect(parseMatrix("0 1; −2 −3", "A")).toEqual({ ok: true, rows: [[0, 1], [-2, -3]] });
    expect(parseMatrix("\n 1e-3 \n\n", "D")).toEqual({ ok: true, rows: [[0.001]] });
  });

  it("parseMatrix names the bad entry by row and entry, and asks for rows when empty", () => {
    const bad = parseMatrix("0 1\n-2 x3", "A");
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toContain("“x3” (row 2, entry 2)");
    const empty = parseMatrix("  ", "B");
    expect(empty.ok).toBe(false);
    if (!empty.ok) expect(empty.message).toMatch(/type B as rows/);
  });

  it("formatMatrixText writes rows back so that parseMatrix reads them unchanged", () => {
    const rows = [[0, 1.5], [-2, -3e-4]];
    expect(parseMatrix(formatMatrixText(rows), "A")).toEqual({ ok: true, rows });
  });
});
