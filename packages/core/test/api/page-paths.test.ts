import { describe, expect, it } from "vitest";
import { isDrawingPage } from "../../src/api/page-paths.js";

describe("isDrawingPage", () => {
  it("is true for a sweep's and a plant's page, with or without a trailing slash", () => {
    expect(isDrawingPage("/w/halvard-thermal/sweeps/3f2c9a7e-1d2b-4c5d-8e9f-0a1b2c3d4e5f")).toBe(true);
    expect(isDrawingPage("/w/halvard-thermal/plants/7b1e/")).toBe(true);
  });

  it("is false for lists, new-item forms, the revise form and pages outside a workspace", () => {
    for (const path of ["/w/halvard-thermal/sweeps", "/w/halvard-thermal/sweeps/new", "/w/halvard-thermal/plants/new", "/w/halvard-thermal/plants/7b1e/revise", "/sign-in", "/", "/w/halvard-thermal"]) {
      expect(isDrawingPage(path), path).toBe(false);
    }
  });
});
