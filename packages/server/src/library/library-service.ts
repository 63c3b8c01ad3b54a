import {
  LIBRARY_FILE_FORMAT,
  LIBRARY_FILE_VERSION,
  libraryFileSchema,
  planLibraryImport,
  plantInputSchema,
  familyInputSchema,
  SweepPlanError,
  variantPlant,
} from "@loopyard/core";
import type { FamilyRevisionDto, LibraryFile, LibraryImportPlan, PlantRevisionDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest, notFound } from "../http/http-error.js";
import { zodToHttpError } from "../http/validation.js";
import { findFamilyWithRevisions, insertFamily, insertFamilyRevision, listFamilySummaries } from "../families/family-repository.js";
import { FAMILY_NOT_FOUND } from "../families/family-service.js";
import { findPlantWithRevisions, insertPlant, insertRevision, listPlantSummaries } from "../plants/plant-repository.js";
import { PLANT_NOT_FOUND } from "../plants/plant-service.js";
import type { MemberAccess } from "../workspaces/require-member.js";

/** What to export: one plant, one family (with the plants its revisions use), or everything (neither). */
export interface LibraryExportQuery {
  plant?: string | undefined;
  family?: string | undefined;
}

/**
 * The library (or one plant, or one family with its plants) as a library file: plants by name,
 * keyed p1, p2, … in that order, families f1, f2, …, every revision in order, without ids,
 * authors or dates — so the same library always writes the same file.
 */
export async function exportLibrary(db: Database, access: MemberAccess, query: LibraryExportQuery): Promise<LibraryFile> {
  const workspaceId = access.workspace.id;
  const allPlants = await listPlantSummaries(db, workspaceId);
  const allFamilies = await listFamilySummaries(db, workspaceId);
  let familyIds = query.plant !== undefined ? [] : allFamilies.map((f) => f.id);
  if (query.family !== undefined) {
    if (!allFamilies.some((f) => f.id === query.family)) throw notFound(FAMILY_NOT_FOUND);
    familyIds = [query.family];
  }
  const families: { name: string; revisions: FamilyRevisionDto[] }[] = [];
  for (const id of familyIds) {
    const found = await findFamilyWithRevisions(db, workspaceId, id);
    if (found) families.push({ name: found.summary.name, revisions: found.revisions });
  }
  let plantIds = allPlants.map((p) => p.id);
  if (query.plant !== undefined) {
    if (!plantIds.includes(query.plant)) throw notFound(PLANT_NOT_FOUND);
    plantIds = [query.plant];
  } else if (query.family !== undefined) {
    const used = new Set(families.flatMap((f) => f.revisions.flatMap((r) => r.variants.map((v) => v.plantId))));
    plantIds = plantIds.filter((id) => used.has(id));
  }
  const plants: { key: string; name: string; revisions: PlantRevisionDto[] }[] = [];
  const revisionKeys = new Map<string, { plant: string; number: number }>();
  for (const id of plantIds) {
    const found = await findPlantWithRevisions(db, workspaceId, id);
    if (!found) continue;
    const key = `p${plants.length + 1}`;
    plants.push({ key, name: found.summary.name, revisions: found.revisions });
    for (const r of found.revisions) revisionKeys.set(r.id, { plant: key, number: r.number });
  }
  return {
    format: LIBRARY_FILE_FORMAT,
    version: LIBRARY_FILE_VERSION,
    plants: plants.map((p) => ({
      key: p.key,
      name: p.name,
      revisions: p.revisions.map((r) => ({ number: r.number, name: r.name, unitsNote: r.unitsNote, note: r.note, model: r.model })),
    })),
    families: families.map((f, i) => ({
      key: `f${i + 1}`,
      name: f.name,
      revisions: f.revisions.map((r) => ({
        number: r.number,
        name: r.name,
        description: r.description,
        note: r.note,
        entries: r.definition.entries.map(({ plantRevisionId, ...entry }) => {
          const ref = revisionKeys.get(plantRevisionId);
          if (!ref) throw new Error(`family ${f.name} uses plant revision ${plantRevisionId}, which is not in this workspace`);
          return { plant: ref.plant, plantRevision: ref.number, ...entry };
        }),
      })),
    })),
  };
}

/** The file checked with core's libraryFileSchema (a 400 naming `file.<field>`), and each family's parameters against the file's plants. */
function readFile(raw: unknown): LibraryFile {
  const parsed = libraryFileSchema.safeParse(raw);
  if (!parsed.success) throw zodToHttpError(parsed.error, ["file"]);
  const file = parsed.data;
  const models = new Map(file.plants.map((p) => [p.key, p.revisions]));
  file.families.forEach((f, i) =>
    f.revisions.forEach((r, j) =>
      r.entries.forEach((e, k) => {
        const model = models.get(e.plant)?.[e.plantRevision - 1]?.model;
        const named: Record<string, number> = { ...(e.parameters ?? {}) };
        for (const [name, range] of Object.entries(e.spread?.ranges ?? {})) named[name] = range.min;
        if (!model) return;
        try {
          variantPlant(model, named, k);
        } catch (error) {
          if (!(error instanceof SweepPlanError)) throw error;
          const field = `file.families.${i}.revisions.${j}.entries.${k}.parameters`;
          throw badRequest(`${field}: ${error.reason}`, field);
        }
      }),
    ),
  );
  return file;
}

async function planFor(db: Database, access: MemberAccess, file: LibraryFile, onClash: "rename" | "skip"): Promise<LibraryImportPlan> {
  const plants = new Set((await listPlantSummaries(db, access.workspace.id)).map((p) => p.name));
  const families = new Set((await listFamilySummaries(db, access.workspace.id)).map((f) => f.name));
  return planLibraryImport(file, { plants, families }, onClash);
}

/** What importing the file would create, rename and skip (core planLibraryImport); changes nothing. */
export async function previewLibraryImport(db: Database, access: MemberAccess, raw: unknown, onClash: "rename" | "skip"): Promise<LibraryImportPlan> {
  return planFor(db, access, readFile(raw), onClash);
}

/**
 * Imports the file as previewed, in one transaction (a failure creates nothing): each plant not
 * skipped with every revision (its name as planned), then each family not skipped, its entries
 * pointing at the revisions just created. Returns the plan it carried out.
 */
export async function importLibrary(db: Database, access: MemberAccess, raw: unknown, onClash: "rename" | "skip"): Promise<LibraryImportPlan> {
  const file = readFile(raw);
  return db.transaction(async (tx) => {
    const plan = await planFor(tx, access, file, onClash);
    const revisionIds = new Map<string, string[]>();
    for (const [i, item] of plan.plants.entries()) {
      const plant = file.plants[i];
      if (!plant || item.action === "skip") continue;
      const inputs = plant.revisions.map((r) =>
        plantInputSchema.parse({ name: r.name === plant.name ? item.finalName : r.name, unitsNote: r.unitsNote, note: r.note ?? undefined, model: r.model }),
      );
      const [first, ...rest] = inputs;
      if (!first) continue;
      const plantId = await insertPlant(tx, access.workspace.id, access.user.id, first);
      for (const input of rest) await insertRevision(tx, plantId, access.user.id, input);
      const found = await findPlantWithRevisions(tx, access.workspace.id, plantId);
      revisionIds.set(plant.key, found?.revisions.map((r) => r.id) ?? []);
    }
    for (const [i, item] of plan.families.entries()) {
      const family = file.families[i];
      if (!family || item.action === "skip") continue;
      let familyId: string | null = null;
      for (const r of family.revisions) {
        const input = familyInputSchema.parse({
          name: r.name === family.name ? item.finalName : r.name,
          description: r.description,
          note: r.note ?? undefined,
          definition: {
            entries: r.entries.map(({ plant, plantRevision, ...entry }) => ({ ...entry, plantRevisionId: revisionIds.get(plant)?.[plantRevision - 1] })),
          },
        });
        if (familyId === null) familyId = await insertFamily(tx, access.workspace.id, access.user.id, input);
        else await insertFamilyRevision(tx, familyId, access.user.id, input);
      }
    }
    return plan;
  });
}
