import { describe, expect, it } from "vitest";
import { libraryFileSchema } from "../../src/library-file/library-file.js";
import { importedName, planLibraryImport } from "../../src/library-file/plan-library-import.js";

// A small file written by hand after docs/library-file.md (version 1): one transfer function with two
// revisions, one nonlinear plate, one family over both with a grid spread.
const FILE = {
  format: "loopyard.library",
  version: 1,
  plants: [
    {
      key: "p1",
      name: "Plate",
      revisions: [
        { number: 1, name: "Plate", unitsNote: "", note: null, model: { kind: "transfer-function", num: [1], den: [5, 1], delay: 0 } },
        { number: 2, name: "Plate", unitsNote: "u: W", note: "dead time", model: { kind: "transfer-function", num: [1], den: [5, 1], delay: 0.4 } },
      ],
    },
    {
      key: "p2",
      name: "Radiating plate",
      revisions: [
        {
          number: 1,
          name: "Radiating plate",
          unitsNote: "",
          note: null,
          model: { kind: "nonlinear", states: ["T"], parameters: { c: 400, h: 2 }, derivatives: ["(800*u - h*T)/c"], output: "T", initial: [0] },
        },
      ],
    },
  ],
  families: [
    {
      key: "f1",
      name: "Line",
      revisions: [
        {
          number: 1,
          name: "Line",
          description: "",
          note: null,
          entries: [
            { plant: "p1", plantRevision: 2, label: "plate" },
            { plant: "p2", plantRevision: 1, spread: { ranges: { c: { min: 360, max: 440, count: 3 } }, design: { kind: "grid" } } },
          ],
        },
      ],
    },
  ],
};

const issueOf = (value: unknown) => {
  const parsed = libraryFileSchema.safeParse(value);
  expect(parsed.success).toBe(false);
  const issue = parsed.error!.issues[0]!;
  return { path: issue.path.join("."), message: issue.message };
};

describe("libraryFileSchema", () => {
  it("libraryFileSchema reads a version-1 file as written (common practice: a reader keeps what it is given)", () => {
    const parsed = libraryFileSchema.parse(FILE);
    expect(JSON.parse(JSON.stringify(parsed))).toEqual(FILE);
  });

  it("libraryFileSchema refuses an unknown version, another format and an unknown field, naming the field", () => {
    expect(issueOf({ ...FILE, version: 2 })).toMatchObject({ path: "version", message: expect.stringContaining("version 1") });
    expect(issueOf({ ...FILE, format: "other" }).path).toBe("format");
    expect(issueOf({ ...FILE, plants: [{ ...FILE.plants[0], colour: "red" }, FILE.plants[1]] }).path).toBe("plants.0");
    const badDen = structuredClone(FILE);
    (badDen.plants[0]!.revisions[0]!.model as { den: number[] }).den = [0, 1];
    expect(issueOf(badDen).path).toBe("plants.0.revisions.0.model.den");
  });

  it("libraryFileSchema refuses a family entry naming a plant or revision the file does not hold, and revisions out of order", () => {
    const ghost = structuredClone(FILE);
    ghost.families[0]!.revisions[0]!.entries[0]!.plant = "p9";
    expect(issueOf(ghost)).toEqual({ path: "families.0.revisions.0.entries.0.plant", message: "no plant with key p9 in this file" });
    const late = structuredClone(FILE);
    late.families[0]!.revisions[0]!.entries[0]!.plantRevision = 3;
    expect(issueOf(late).path).toBe("families.0.revisions.0.entries.0.plantRevision");
    const order = structuredClone(FILE);
    order.plants[0]!.revisions[1]!.number = 5;
    expect(issueOf(order).path).toBe("plants.0.revisions.1.number");
  });
});

describe("planLibraryImport", () => {
  it("planLibraryImport creates into an empty workspace, renames with a suffix or skips on a clash, and skips a family whose plant is skipped", () => {
    const file = libraryFileSchema.parse(FILE);
    const empty = planLibraryImport(file, { plants: new Set(), families: new Set() }, "rename");
    expect(empty.plants.map((p) => [p.action, p.finalName])).toEqual([
      ["create", "Plate"],
      ["create", "Radiating plate"],
    ]);
    const clash = { plants: new Set(["Plate", "Plate (imported)"]), families: new Set(["Line"]) };
    const renamed = planLibraryImport(file, clash, "rename");
    expect(renamed.plants[0]).toMatchObject({ action: "rename", finalName: "Plate (imported 2)" });
    expect(renamed.families[0]).toMatchObject({ action: "rename", finalName: "Line (imported)" });
    const skipped = planLibraryImport(file, { plants: new Set(["Plate"]), families: new Set() }, "skip");
    expect(skipped.plants.map((p) => p.action)).toEqual(["skip", "create"]);
    expect(skipped.families[0]).toMatchObject({ action: "skip", reason: "its variants use Plate, which this import skips" });
  });

  it("importedName keeps within the name limit", () => {
    expect(importedName("x".repeat(120), new Set()).length).toBe(120);
    expect(importedName("x".repeat(120), new Set()).endsWith(" (imported)")).toBe(true);
  });
});
