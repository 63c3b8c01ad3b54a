import { describe, expect, it } from "vitest";
import { canCancelSweep } from "../../src/index.js";

describe("canCancelSweep", () => {
  // The rule of issue 11 (GLOSSARY roles): its author, a lead or an admin; never a viewer.
  it("canCancelSweep lets the author, a lead and an admin cancel, not another engineer or a viewer", () => {
    expect(canCancelSweep({ role: "engineer", userId: "a" }, "a")).toBe(true);
    expect(canCancelSweep({ role: "engineer", userId: "b" }, "a")).toBe(false);
    expect(canCancelSweep({ role: "lead", userId: "b" }, "a")).toBe(true);
    expect(canCancelSweep({ role: "admin", userId: "b" }, "a")).toBe(true);
    expect(canCancelSweep({ role: "viewer", userId: "a" }, "a")).toBe(false);
  });
});
