import { describe, expect, it } from "vitest";
import { formatParametersText, parseNames, parseParameters } from "../../../src/features/plants/nonlinear-text.js";

describe("nonlinear plant text", () => {
  it("parseNames reads names split on spaces or commas and refuses repeats and non-names", () => {
    expect(parseNames("T1, T2 q")).toEqual({ ok: true, value: ["T1", "T2", "q"] });
    expect(parseNames("h h").ok).toBe(false);
    const bad = parseNames("2h");
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toContain("“2h”");
    expect(parseNames("   ").ok).toBe(false);
  });

  it("parseParameters reads name = value lines and names the line at fault", () => {
    expect(parseParameters("a = 0.5\n\nA: 2\nb=−1")).toEqual({ ok: true, value: { a: 0.5, A: 2, b: -1 } });
    const bad = parseParameters("a = 0.5\nb = half");
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/^line 2: “half”/);
    const twice = parseParameters("a = 1\na = 2");
    expect(twice.ok).toBe(false);
    const noEquals = parseParameters("a 1");
    expect(noEquals.ok).toBe(false);
    if (!noEquals.ok) expect(noEquals.message).toMatch(/name = value/);
  });

  it("formatParametersText writes parameters back so that parseParameters reads them unchanged", () => {
    const parameters = { a: 0.5, A: 2, k_1: -3e-4 };
    expect(parseParameters(formatParametersText(parameters))).toEqual({ ok: true, value: parameters });
  });
});
