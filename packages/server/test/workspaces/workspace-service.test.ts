import { describe, expect, it } from "vitest";
import { slugify } from "../../src/workspaces/workspace-service.js";
import { SLUG_PATTERN } from "../../src/workspaces/workspace-input.js";

describe("slugify", () => {
  it("slugify turns a workspace name into lower-case words joined by hyphens", () => {
    expect(slugify("Halvard Thermoworks — Ember line")).toBe("halvard-thermoworks-ember-line");
    expect(slugify("  Café  Bench #2 ")).toBe("cafe-bench-2");
  });

  it("slugify always gives a valid slug, even from symbols only", () => {
    for (const name of ["—", "a", "x".repeat(200), "Ember 200 / 400"]) expect(slugify(name)).toMatch(SLUG_PATTERN);
  });
});
