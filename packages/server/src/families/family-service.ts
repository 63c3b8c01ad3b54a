import { diffFamilyRevisions, SweepPlanError, variantPlant } from "@loopyard/core";
import type { FamilyDetailDto, FamilyInputParsed, FamilySummaryDto, RevisionDiffDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest, notFound } from "../http/http-error.js";
import { findRevisionInWorkspace } from "../plants/plant-repository.js";
import { assertChangeNote, diffNumbers, revisionRangeSentence } from "../revisions/revision-rules.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import {
  findFamilyUses,
  findFamilyWithRevisions,
  insertFamily,
  insertFamilyRevision,
  listFamilySummaries,
  setFamilyArchived,
} from "./family-repository.js";

export const FAMILY_NOT_FOUND = "There is no such family in this workspace.";

export async function listFamilies(db: Database, access: MemberAccess): Promise<FamilySummaryDto[]> {
  return listFamilySummaries(db, access.workspace.id);
}

/** A family with one revision (the latest unless `revisionNumber`), its revision list and the studies on it. */
export async function getFamilyDetail(db: Database, access: MemberAccess, familyId: string, revisionNumber?: number): Promise<FamilyDetailDto> {
  const found = await findFamilyWithRevisions(db, access.workspace.id, familyId);
  if (!found) throw notFound(FAMILY_NOT_FOUND);
  const revision = revisionNumber === undefined ? found.summary.latestRevision : found.revisions.find((r) => r.number === revisionNumber);
  if (!revision) throw notFound(revisionRangeSentence(found.summary.name, revisionNumber ?? 0, found.revisions.length));
  return {
    family: found.summary,
    revision,
    revisions: found.revisions.map(({ id, number, note, createdAt, createdBy }) => ({ id, number, note, createdAt, createdBy })),
    usedBy: await findFamilyUses(db, access.workspace.id, familyId),
  };
}

/**
 * Every entry names a plant revision of this workspace, and its fixed and spread parameters are
 * parameters of that plant (core variantPlant: nonlinear plants only) — else a 400 naming
 * `definition.entries.<i>.…`.
 */
async function assertEntriesFit(db: Database, access: MemberAccess, input: FamilyInputParsed): Promise<void> {
  for (const [i, entry] of input.definition.entries.entries()) {
    const revision = await findRevisionInWorkspace(db, access.workspace.id, entry.plantRevisionId);
    const field = `definition.entries.${i}`;
    if (!revision) throw badRequest(`${field}.plantRevisionId: there is no such plant revision in this workspace`, `${field}.plantRevisionId`);
    const named: Record<string, number> = { ...(entry.parameters ?? {}) };
    for (const [name, range] of Object.entries(entry.spread?.ranges ?? {})) named[name] = range.min;
    try {
      variantPlant(revision.model, named, i);
    } catch (error) {
      if (!(error instanceof SweepPlanError)) throw error;
      const where = entry.spread && !entry.parameters ? `${field}.spread.ranges` : `${field}.parameters`;
      throw badRequest(`${where}: ${error.reason} (${revision.name} revision ${revision.number})`, where);
    }
  }
}

/** Saves a new family with its revision 1 (engineer+ checked by the route). */
export async function createFamily(db: Database, access: MemberAccess, input: FamilyInputParsed): Promise<FamilyDetailDto> {
  await assertEntriesFit(db, access, input);
  const familyId = await insertFamily(db, access.workspace.id, access.user.id, input);
  return getFamilyDetail(db, access, familyId);
}

/** Adds a new immutable revision with its change note; sweeps and comparisons on earlier revisions keep theirs. */
export async function createFamilyRevision(db: Database, access: MemberAccess, familyId: string, input: FamilyInputParsed): Promise<FamilyDetailDto> {
  const found = await findFamilyWithRevisions(db, access.workspace.id, familyId);
  if (!found) throw notFound(FAMILY_NOT_FOUND);
  assertChangeNote(input.note);
  await assertEntriesFit(db, access, input);
  const number = await insertFamilyRevision(db, familyId, access.user.id, input);
  return getFamilyDetail(db, access, familyId, number);
}

/** What changed from revision `from` to revision `to` of a family (core diffFamilyRevisions). */
export async function getFamilyDiff(
  db: Database,
  access: MemberAccess,
  familyId: string,
  query: { from?: number | undefined; to?: number | undefined },
): Promise<RevisionDiffDto> {
  const found = await findFamilyWithRevisions(db, access.workspace.id, familyId);
  if (!found) throw notFound(FAMILY_NOT_FOUND);
  const pick = (n: number) => {
    const revision = found.revisions.find((r) => r.number === n);
    if (!revision) throw notFound(revisionRangeSentence(found.summary.name, n, found.revisions.length));
    return revision;
  };
  const { from, to } = diffNumbers(query, found.revisions.length);
  return { from, to, changes: diffFamilyRevisions(pick(from), pick(to)) };
}

/** Archives (hidden from pickers, kept for the studies on it) or restores a family. Idempotent. */
export async function setFamilyArchive(db: Database, access: MemberAccess, familyId: string, archived: boolean): Promise<FamilyDetailDto> {
  if (!(await setFamilyArchived(db, access.workspace.id, familyId, archived ? new Date() : null))) throw notFound(FAMILY_NOT_FOUND);
  return getFamilyDetail(db, access, familyId);
}
