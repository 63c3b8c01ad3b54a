import { describe, expect, it } from "vitest";
import { thinRows } from "../../../src/features/fronts/front-table.js";

describe("thinRows", () => {
  const rows = Array.from({ length: 101 }, (_, i) => ({ index: i * 10 }));

  it("thinRows keeps every row of a short front", () => {
    expect(thinRows(rows.slice(0, 5), 60, null)).toHaveLength(5);
  });

  it("thinRows spreads the limit evenly along a long front, first and last kept (closed form: positions round(k·100/10))", () => {
    const thinned = thinRows(rows, 11, null);
    expect(thinned.map((r) => r.index)).toEqual([0, 100, 200, 300, 400, 500, 600, 700, 800, 900, 1000]);
  });

  it("thinRows adds the selected candidate in its front position", () => {
    const thinned = thinRows(rows, 11, 130);
    expect(thinned).toHaveLength(12);
    expect(thinned.map((r) => r.index).slice(0, 3)).toEqual([0, 100, 130]);
  });
});
