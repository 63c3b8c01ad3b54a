import { and, asc, eq, inArray, isNull, max } from "drizzle-orm";
import type { Plant, PlantInputParsed, PlantRevisionDto, PlantSummaryDto, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { plant, plantRevision, user } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";
import { forgetPlantLists } from "./plant-list-cache.js";

/** A plant revision row joined with its author, as the API shows it. */
const revisionColumns = {
  id: plantRevision.id,
  plantId: plantRevision.plantId,
  number: plantRevision.number,
  name: plantRevision.name,
  unitsNote: plantRevision.unitsNote,
  model: plantRevision.model,
  note: plantRevision.note,
  createdAt: plantRevision.createdAt,
  createdBy: userDtoColumns,
};

interface RevisionRow {
  id: string;
  plantId: string;
  number: number;
  name: string;
  unitsNote: string;
  model: unknown;
  note: string | null;
  createdAt: Date;
  createdBy: UserDto;
}

function toRevisionDto(row: RevisionRow): PlantRevisionDto {
  return {
    id: row.id,
    plantId: row.plantId,
    number: row.number,
    name: row.name,
    unitsNote: row.unitsNote,
    // Stored only after plantModelSchema parsed it; revisions are never changed afterwards.
    model: row.model as Plant,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdBy,
  };
}

interface PlantRow {
  id: string;
  name: string;
  kind: string;
  createdAt: Date;
  archivedAt: Date | null;
}

const plantColumns = { id: plant.id, name: plant.name, kind: plant.kind, createdAt: plant.createdAt, archivedAt: plant.archivedAt };

function toSummary(row: PlantRow, revisions: PlantRevisionDto[]): PlantSummaryDto {
  const latest = revisions[revisions.length - 1];
  if (!latest) throw new Error(`plant ${row.id} has no revision`);
  return {
    id: row.id,
    name: latest.name,
    kind: latest.model.kind,
    latestRevision: latest,
    revisionCount: revisions.length,
    createdAt: row.createdAt.toISOString(),
    archivedAt: row.archivedAt?.toISOString() ?? null,
  };
}

/** Every revision of the given plants with its author, by plant and ascending number. */
async function revisionsOf(db: Database, plantIds: readonly string[]): Promise<Map<string, PlantRevisionDto[]>> {
  const byPlant = new Map<string, PlantRevisionDto[]>(plantIds.map((id) => [id, []]));
  if (plantIds.length === 0) return byPlant;
  const rows = await db
    .select(revisionColumns)
    .from(plantRevision)
    .innerJoin(user, eq(user.id, plantRevision.createdBy))
    .where(inArray(plantRevision.plantId, [...plantIds]))
    .orderBy(asc(plantRevision.plantId), asc(plantRevision.number));
  for (const row of rows) byPlant.get(row.plantId)?.push(toRevisionDto(row));
  return byPlant;
}

/** The library of a workspace, by name. */
export async function listPlantSummaries(db: Database, workspaceId: string): Promise<PlantSummaryDto[]> {
  const plants = await db.select(plantColumns).from(plant).where(eq(plant.workspaceId, workspaceId)).orderBy(asc(plant.name), asc(plant.createdAt));
  const revisions = await revisionsOf(db, plants.map((p) => p.id));
  return plants.map((row) => toSummary(row, revisions.get(row.id) ?? []));
}

/** One plant of the workspace with all its revisions (ascending), or null. */
export async function findPlantWithRevisions(
  db: Database,
  workspaceId: string,
  plantId: string,
): Promise<{ summary: PlantSummaryDto; revisions: PlantRevisionDto[] } | null> {
  const rows = await db
    .select(plantColumns)
    .from(plant)
    .where(and(eq(plant.workspaceId, workspaceId), eq(plant.id, plantId)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  const revisions = (await revisionsOf(db, [row.id])).get(row.id) ?? [];
  return { summary: toSummary(row, revisions), revisions };
}

/** The plant with this name in the workspace (exact match), or null. */
export async function findPlantIdByName(db: Database, workspaceId: string, name: string): Promise<string | null> {
  const rows = await db.select({ id: plant.id }).from(plant).where(and(eq(plant.workspaceId, workspaceId), eq(plant.name, name))).limit(1);
  return rows[0]?.id ?? null;
}

/** A revision by id when its plant belongs to this workspace, or null. */
export async function findRevisionInWorkspace(
  db: Database,
  workspaceId: string,
  revisionId: string,
): Promise<PlantRevisionDto | null> {
  const rows = await db
    .select(revisionColumns)
    .from(plantRevision)
    .innerJoin(plant, eq(plant.id, plantRevision.plantId))
    .innerJoin(user, eq(user.id, plantRevision.createdBy))
    .where(and(eq(plantRevision.id, revisionId), eq(plant.workspaceId, workspaceId)))
    .limit(1);
  return rows[0] ? toRevisionDto(rows[0]) : null;
}

/** A revision by id whatever its workspace (for the sweep runner), or null. */
export async function findRevisionById(db: Database, revisionId: string): Promise<PlantRevisionDto | null> {
  const rows = await db
    .select(revisionColumns)
    .from(plantRevision)
    .innerJoin(user, eq(user.id, plantRevision.createdBy))
    .where(eq(plantRevision.id, revisionId))
    .limit(1);
  return rows[0] ? toRevisionDto(rows[0]) : null;
}

/** Creates a plant and its revision 1 in one transaction; returns the plant id. */
export async function insertPlant(db: Database, workspaceId: string, userId: string, input: PlantInputParsed, preview: unknown = null): Promise<string> {
  // Kept plant lists are forgotten once the plant is committed (and if the transaction fails: harmless).
  return afterwards(forgetPlantLists, db.transaction(async (tx) => {
    const [created] = await tx
      .insert(plant)
      .values({ workspaceId, name: input.name, kind: input.model.kind, createdBy: userId })
      .returning({ id: plant.id });
    if (!created) throw new Error("insert into plant returned no row");
    await tx.insert(plantRevision).values({
      plantId: created.id,
      number: 1,
      name: input.name,
      unitsNote: input.unitsNote,
      model: input.model,
      preview,
      note: input.note ?? null,
      createdBy: userId,
    });
    return created.id;
  }));
}

/** `work`, then `then()` whether it succeeded or not. */
async function afterwards<T>(then: () => void, work: Promise<T>): Promise<T> {
  try {
    return await work;
  } finally {
    then();
  }
}

/**
 * Appends revision max+1 to a plant; older revisions are left untouched. The plant row is
 * locked for the transaction so that two simultaneous edits get consecutive numbers.
 * Returns the new revision number.
 */
export async function insertRevision(db: Database, plantId: string, userId: string, input: PlantInputParsed, preview: unknown = null): Promise<number> {
  return afterwards(forgetPlantLists, db.transaction(async (tx) => {
    await tx.select({ id: plant.id }).from(plant).where(eq(plant.id, plantId)).for("update");
    const [last] = await tx.select({ number: max(plantRevision.number) }).from(plantRevision).where(eq(plantRevision.plantId, plantId));
    const number = (last?.number ?? 0) + 1;
    await tx.insert(plantRevision).values({
      plantId,
      number,
      name: input.name,
      unitsNote: input.unitsNote,
      model: input.model,
      preview,
      note: input.note ?? null,
      createdBy: userId,
    });
    await tx.update(plant).set({ name: input.name, kind: input.model.kind, updatedAt: new Date() }).where(eq(plant.id, plantId));
    return number;
  }));
}

/** The stored preview of a revision (poles and open-loop step), null when none is stored yet. */
export async function findRevisionPreview(db: Database, revisionId: string): Promise<unknown> {
  const rows = await db.select({ preview: plantRevision.preview }).from(plantRevision).where(eq(plantRevision.id, revisionId)).limit(1);
  return rows[0]?.preview ?? null;
}

/**
 * Stores the preview of a revision stored without one (or with an outdated one: `replace` true).
 * The preview is derived from the model alone, so the model itself is never changed.
 */
export async function storeRevisionPreview(db: Database, revisionId: string, preview: unknown, replace: boolean): Promise<void> {
  const where = replace ? eq(plantRevision.id, revisionId) : and(eq(plantRevision.id, revisionId), isNull(plantRevision.preview));
  await db.update(plantRevision).set({ preview }).where(where);
}

/** Archives (a date) or restores (null) a plant of the workspace; false when there is no such plant. */
export async function setPlantArchived(db: Database, workspaceId: string, plantId: string, archivedAt: Date | null): Promise<boolean> {
  const rows = await db
    .update(plant)
    .set({ archivedAt })
    .where(and(eq(plant.workspaceId, workspaceId), eq(plant.id, plantId)))
    .returning({ id: plant.id });
  return rows.length > 0;
}
