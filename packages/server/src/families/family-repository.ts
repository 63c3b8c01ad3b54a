import { and, asc, desc, eq, inArray, max, sql } from "drizzle-orm";
import { expandFamily } from "@loopyard/core";
import type { FamilyDefinition, FamilyInputParsed, FamilyRevisionDto, FamilySummaryDto, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { comparison, family, familyRevision, plantRevision, sweep, user } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";

const revisionColumns = {
  id: familyRevision.id,
  familyId: familyRevision.familyId,
  number: familyRevision.number,
  name: familyRevision.name,
  description: familyRevision.description,
  definition: familyRevision.definition,
  note: familyRevision.note,
  createdAt: familyRevision.createdAt,
  createdBy: userDtoColumns,
};

interface RevisionRow {
  id: string;
  familyId: string;
  number: number;
  name: string;
  description: string;
  definition: unknown;
  note: string | null;
  createdAt: Date;
  createdBy: UserDto;
}

/** Plant name and revision number of each plant revision id (any workspace; ids come from stored families). */
async function plantRevisionNames(db: Database, ids: readonly string[]): Promise<Map<string, { plantId: string; name: string; number: number }>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = await db
    .select({ id: plantRevision.id, plantId: plantRevision.plantId, name: plantRevision.name, number: plantRevision.number })
    .from(plantRevision)
    .where(inArray(plantRevision.id, unique));
  return new Map(rows.map((r) => [r.id, r]));
}

/** Revision rows as DTOs, each with the variant list it expands to (core expandFamily) and its plants' names. */
async function toRevisionDtos(db: Database, rows: RevisionRow[]): Promise<FamilyRevisionDto[]> {
  // Stored only after familyDefinitionSchema parsed it; revisions are never changed afterwards.
  const expanded = rows.map((row) => expandFamily(row.definition as FamilyDefinition).variants);
  const names = await plantRevisionNames(db, expanded.flat().map((v) => v.plantRevisionId));
  return rows.map((row, i) => ({
    id: row.id,
    familyId: row.familyId,
    number: row.number,
    name: row.name,
    description: row.description,
    definition: row.definition as FamilyDefinition,
    variants: (expanded[i] ?? []).map((v) => {
      const plant = names.get(v.plantRevisionId);
      return { ...v, plantId: plant?.plantId ?? "", plantName: plant?.name ?? "(missing revision)", revisionNumber: plant?.number ?? 0 };
    }),
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdBy,
  }));
}

async function revisionsOf(db: Database, familyIds: readonly string[]): Promise<Map<string, FamilyRevisionDto[]>> {
  const byFamily = new Map<string, FamilyRevisionDto[]>(familyIds.map((id) => [id, []]));
  if (familyIds.length === 0) return byFamily;
  const rows = await db
    .select(revisionColumns)
    .from(familyRevision)
    .innerJoin(user, eq(user.id, familyRevision.createdBy))
    .where(inArray(familyRevision.familyId, [...familyIds]))
    .orderBy(asc(familyRevision.familyId), asc(familyRevision.number));
  for (const dto of await toRevisionDtos(db, rows)) byFamily.get(dto.familyId)?.push(dto);
  return byFamily;
}

const familyColumns = { id: family.id, createdAt: family.createdAt, archivedAt: family.archivedAt };

function toSummary(row: { id: string; createdAt: Date; archivedAt: Date | null }, revisions: FamilyRevisionDto[]): FamilySummaryDto {
  const latest = revisions[revisions.length - 1];
  if (!latest) throw new Error(`family ${row.id} has no revision`);
  return {
    id: row.id,
    name: latest.name,
    latestRevision: latest,
    revisionCount: revisions.length,
    createdAt: row.createdAt.toISOString(),
    archivedAt: row.archivedAt?.toISOString() ?? null,
  };
}

/** The families of a workspace, by name. */
export async function listFamilySummaries(db: Database, workspaceId: string): Promise<FamilySummaryDto[]> {
  const rows = await db.select(familyColumns).from(family).where(eq(family.workspaceId, workspaceId)).orderBy(asc(family.name), asc(family.createdAt));
  const revisions = await revisionsOf(db, rows.map((r) => r.id));
  return rows.map((row) => toSummary(row, revisions.get(row.id) ?? []));
}

/** One family of the workspace with all its revisions (ascending), or null. */
export async function findFamilyWithRevisions(
  db: Database,
  workspaceId: string,
  familyId: string,
): Promise<{ summary: FamilySummaryDto; revisions: FamilyRevisionDto[] } | null> {
  const [row] = await db
    .select(familyColumns)
    .from(family)
    .where(and(eq(family.workspaceId, workspaceId), eq(family.id, familyId)))
    .limit(1);
  if (!row) return null;
  const revisions = (await revisionsOf(db, [row.id])).get(row.id) ?? [];
  return { summary: toSummary(row, revisions), revisions };
}

/** A family revision by id when its family belongs to this workspace, or null. */
export async function findFamilyRevisionInWorkspace(db: Database, workspaceId: string, revisionId: string): Promise<FamilyRevisionDto | null> {
  const rows = await db
    .select(revisionColumns)
    .from(familyRevision)
    .innerJoin(family, eq(family.id, familyRevision.familyId))
    .innerJoin(user, eq(user.id, familyRevision.createdBy))
    .where(and(eq(familyRevision.id, revisionId), eq(family.workspaceId, workspaceId)))
    .limit(1);
  return rows[0] ? ((await toRevisionDtos(db, rows))[0] ?? null) : null;
}

/** The family with this name in the workspace (exact match), or null. */
export async function findFamilyIdByName(db: Database, workspaceId: string, name: string): Promise<string | null> {
  const rows = await db.select({ id: family.id }).from(family).where(and(eq(family.workspaceId, workspaceId), eq(family.name, name))).limit(1);
  return rows[0]?.id ?? null;
}

/** Creates a family and its revision 1 in one transaction; returns the family id. */
export async function insertFamily(db: Database, workspaceId: string, userId: string, input: FamilyInputParsed): Promise<string> {
  return db.transaction(async (tx) => {
    const [created] = await tx.insert(family).values({ workspaceId, name: input.name, createdBy: userId }).returning({ id: family.id });
    if (!created) throw new Error("insert into family returned no row");
    await tx.insert(familyRevision).values({
      familyId: created.id,
      number: 1,
      name: input.name,
      description: input.description,
      definition: input.definition,
      note: input.note ?? null,
      createdBy: userId,
    });
    return created.id;
  });
}

/** Appends revision max+1 to a family (the family row locked, so simultaneous edits get consecutive numbers); returns its number. */
export async function insertFamilyRevision(db: Database, familyId: string, userId: string, input: FamilyInputParsed): Promise<number> {
  return db.transaction(async (tx) => {
    await tx.select({ id: family.id }).from(family).where(eq(family.id, familyId)).for("update");
    const [last] = await tx.select({ number: max(familyRevision.number) }).from(familyRevision).where(eq(familyRevision.familyId, familyId));
    const number = (last?.number ?? 0) + 1;
    await tx.insert(familyRevision).values({
      familyId,
      number,
      name: input.name,
      description: input.description,
      definition: input.definition,
      note: input.note ?? null,
      createdBy: userId,
    });
    await tx.update(family).set({ name: input.name, updatedAt: new Date() }).where(eq(family.id, familyId));
    return number;
  });
}

/** Archives (a date) or restores (null) a family of the workspace; false when there is no such family. */
export async function setFamilyArchived(db: Database, workspaceId: string, familyId: string, archivedAt: Date | null): Promise<boolean> {
  const rows = await db
    .update(family)
    .set({ archivedAt })
    .where(and(eq(family.workspaceId, workspaceId), eq(family.id, familyId)))
    .returning({ id: family.id });
  return rows.length > 0;
}

/** Sweeps and comparisons of the workspace whose family came from this family (definition.family.source), newest first. */
export async function findFamilyUses(
  db: Database,
  workspaceId: string,
  familyId: string,
): Promise<{ kind: "sweep" | "comparison"; id: string; name: string; revisionNumber: number }[]> {
  const sweeps = await db
    .select({ id: sweep.id, name: sweep.name, number: sql<string>`${sweep.definition}->'family'->'source'->>'number'`, createdAt: sweep.createdAt })
    .from(sweep)
    .where(and(eq(sweep.workspaceId, workspaceId), sql`${sweep.definition}->'family'->'source'->>'familyId' = ${familyId}`))
    .orderBy(desc(sweep.createdAt));
  const comparisons = await db
    .select({ id: comparison.id, name: comparison.name, number: sql<string>`${comparison.definition}->'family'->'source'->>'number'`, createdAt: comparison.createdAt })
    .from(comparison)
    .where(and(eq(comparison.workspaceId, workspaceId), sql`${comparison.definition}->'family'->'source'->>'familyId' = ${familyId}`))
    .orderBy(desc(comparison.createdAt));
  return [
    ...sweeps.map((r) => ({ kind: "sweep" as const, ...r })),
    ...comparisons.map((r) => ({ kind: "comparison" as const, ...r })),
  ]
    .sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime())
    .map(({ kind, id, name, number }) => ({ kind, id, name, revisionNumber: Number(number) }));
}
