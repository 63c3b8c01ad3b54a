import { describe, expect, it } from "vitest";
import { roleRefusal } from "../../src/workspaces/require-member.js";

describe("roleRefusal", () => {
  it("roleRefusal names the role needed, the workspace and the user's role with its article", () => {
    expect(roleRefusal("Creating plants", "engineer", "Halvard Thermoworks — Ember line", "viewer")).toBe(
      "Creating plants needs the engineer role or higher in Halvard Thermoworks — Ember line; you are a viewer.",
    );
    expect(roleRefusal("Adding members", "admin", "Bench", "engineer")).toBe("Adding members needs the admin role in Bench; you are an engineer.");
  });
});
