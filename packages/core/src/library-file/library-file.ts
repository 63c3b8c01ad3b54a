import { z } from "zod";
import { familyEntrySchema, familyDefinitionSchema } from "../families/family-definition.js";
import { MAX_FAMILY_VARIANTS, MAX_TITLE_LENGTH } from "../limits.js";
import { plantModelSchema } from "../plants/plant.js";
import { textField } from "../schemas/text.js";

/** The name of the format, first field of every library file. */
export const LIBRARY_FILE_FORMAT = "loopyard.library";
/** The version this Loopyard writes and reads. */
export const LIBRARY_FILE_VERSION = 1;

/** Most plants, and most families, in one file; most revisions per plant or family. */
export const MAX_LIBRARY_FILE_ITEMS = 500;
export const MAX_LIBRARY_FILE_REVISIONS = 200;

const key = z
  .string({ error: "key must be a text such as p1" })
  .regex(/^[a-z][a-z0-9-]{0,39}$/, "key must be lower-case letters, digits and dashes, starting with a letter (e.g. p1)");
const revisionNumber = z.number({ error: "number must be a whole number" }).int("number must be a whole number").min(1, "revisions start at 1");
const note = textField({ label: "change note", max: 500 }).nullable();

/** One plant revision in a file: as stored, without ids, authors or dates. */
const plantRevisionFileSchema = z.strictObject({
  number: revisionNumber,
  name: textField({ label: "name", min: 1, required: "give the revision a name", max: 120 }),
  unitsNote: textField({ label: "units note", max: 500 }),
  note,
  model: plantModelSchema,
});

/** A plant with every revision, in ascending numbers 1, 2, … */
const plantFileSchema = z
  .strictObject({
    key,
    name: textField({ label: "name", min: 1, required: "give the plant a name", max: 120 }),
    revisions: z.array(plantRevisionFileSchema).min(1, "a plant has at least one revision").max(MAX_LIBRARY_FILE_REVISIONS, `at most ${MAX_LIBRARY_FILE_REVISIONS} revisions`),
  })
  .superRefine((plant, ctx) => {
    plant.revisions.forEach((r, i) => {
      if (r.number !== i + 1) ctx.addIssue({ code: "custom", path: ["revisions", i, "number"], message: `revisions are numbered 1, 2, … in order; expected ${i + 1}` });
    });
  });

/** A family entry in a file: the plant by its key in the file and its revision number, instead of a revision id. */
const familyEntryFileSchema = familyEntrySchema.omit({ plantRevisionId: true }).extend({ plant: key, plantRevision: revisionNumber }).strict();

const familyRevisionFileSchema = z.strictObject({
  number: revisionNumber,
  name: textField({ label: "name", min: 1, required: "give the family a name", max: MAX_TITLE_LENGTH }),
  description: textField({ label: "description", max: 500 }),
  note,
  entries: z.array(familyEntryFileSchema).min(1, "give at least one variant").max(MAX_FAMILY_VARIANTS, `a family holds at most ${MAX_FAMILY_VARIANTS} variants`),
});

const familyFileSchema = z
  .strictObject({
    key,
    name: textField({ label: "name", min: 1, required: "give the family a name", max: MAX_TITLE_LENGTH }),
    revisions: z.array(familyRevisionFileSchema).min(1, "a family has at least one revision").max(MAX_LIBRARY_FILE_REVISIONS, `at most ${MAX_LIBRARY_FILE_REVISIONS} revisions`),
  })
  .superRefine((family, ctx) => {
    family.revisions.forEach((r, i) => {
      if (r.number !== i + 1) ctx.addIssue({ code: "custom", path: ["revisions", i, "number"], message: `revisions are numbered 1, 2, … in order; expected ${i + 1}` });
      // The same checks as a saved family revision (a parameter fixed and spread, more than MAX_FAMILY_VARIANTS variants).
      const check = familyDefinitionSchema.safeParse({ entries: r.entries.map(({ plant: _p, plantRevision: _n, ...rest }) => ({ ...rest, plantRevisionId: "00000000-0000-4000-8000-000000000000" })) });
      if (!check.success) for (const issue of check.error.issues) ctx.addIssue({ code: "custom", path: ["revisions", i, ...issue.path.map((p) => (typeof p === "symbol" ? String(p) : p))], message: issue.message });
    });
  });

/**
 * A Loopyard library file, version 1: plants (every revision) and families (every revision, their
 * variants naming plants of the same file by key and revision number), without ids, authors or
 * dates, so that the same library always writes the same file. `format` and `version` come first;
 * a reader refuses another format or version, and any field it does not know (strict objects).
 * Documented in docs/library-file.md.
 */
export const libraryFileSchema = z
  .strictObject({
    format: z.literal(LIBRARY_FILE_FORMAT, { error: `format must be "${LIBRARY_FILE_FORMAT}"; this is not a Loopyard library file` }),
    version: z.literal(LIBRARY_FILE_VERSION, { error: `version ${LIBRARY_FILE_VERSION} is the only version this Loopyard reads; export the library again from a matching Loopyard` }),
    plants: z.array(plantFileSchema).max(MAX_LIBRARY_FILE_ITEMS, `at most ${MAX_LIBRARY_FILE_ITEMS} plants in one file`),
    families: z.array(familyFileSchema).max(MAX_LIBRARY_FILE_ITEMS, `at most ${MAX_LIBRARY_FILE_ITEMS} families in one file`),
  })
  .superRefine((file, ctx) => {
    const plants = new Map<string, number>();
    file.plants.forEach((p, i) => {
      if (plants.has(p.key)) ctx.addIssue({ code: "custom", path: ["plants", i, "key"], message: `key ${p.key} is used twice; each plant needs its own` });
      plants.set(p.key, p.revisions.length);
    });
    const families = new Set<string>();
    file.families.forEach((f, i) => {
      if (families.has(f.key)) ctx.addIssue({ code: "custom", path: ["families", i, "key"], message: `key ${f.key} is used twice; each family needs its own` });
      families.add(f.key);
      f.revisions.forEach((r, j) =>
        r.entries.forEach((e, k) => {
          const count = plants.get(e.plant);
          const path = ["families", i, "revisions", j, "entries", k];
          if (count === undefined) ctx.addIssue({ code: "custom", path: [...path, "plant"], message: `no plant with key ${e.plant} in this file` });
          else if (e.plantRevision > count) ctx.addIssue({ code: "custom", path: [...path, "plantRevision"], message: `plant ${e.plant} has revisions 1 to ${count} in this file` });
        }),
      );
    });
  });

export type LibraryFile = z.infer<typeof libraryFileSchema>;
export type LibraryFilePlant = LibraryFile["plants"][number];
export type LibraryFileFamily = LibraryFile["families"][number];

/** How an import treats a plant or family whose name the workspace already holds. */
export const libraryImportOptionsSchema = z.object({
  file: z.unknown(),
  onClash: z.enum(["rename", "skip"], { error: 'onClash must be "rename" (add a suffix) or "skip" (keep the workspace\'s)' }).default("rename"),
});
