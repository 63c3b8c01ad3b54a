import { diffPlantRevisions } from "@loopyard/core";
import type { PlantDetailDto, PlantInputParsed, PlantRevisionDto, PlantSummaryDto, RevisionDiffDto } from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { badRequest, notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { previewPlantModel, PREVIEW_VERSION, type StoredPreview } from "./plant-model-check.js";
import { assertChangeNote, diffNumbers, revisionRangeSentence } from "../revisions/revision-rules.js";
import {
  findPlantWithRevisions,
  findRevisionPreview,
  insertPlant,
  insertRevision,
  listPlantSummaries,
  setPlantArchived,
  storeRevisionPreview,
} from "./plant-repository.js";

/** What the poles of a nonlinear plant are. */
export const NONLINEAR_POLES_NOTE =
  "Poles of the linearisation at the operating point (the initial state with the operating input); the nonlinear plant may behave differently away from it.";

export const PLANT_NOT_FOUND = "There is no such plant in this workspace.";

export async function listPlants(db: Database, access: MemberAccess): Promise<PlantSummaryDto[]> {
  return listPlantSummaries(db, access.workspace.id);
}

/**
 * A plant with one revision (the latest unless `revisionNumber`), its poles and open-loop step,
 * read from the preview stored with the revision; a revision stored without one (before previews
 * were stored) gets it computed once on the compute pool and stored.
 */
export async function getPlantDetail(
  db: Database,
  compute: Compute,
  access: MemberAccess,
  plantId: string,
  revisionNumber?: number,
): Promise<PlantDetailDto> {
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  const revision =
    revisionNumber === undefined ? found.summary.latestRevision : found.revisions.find((r) => r.number === revisionNumber);
  if (!revision) {
    throw notFound(revisionRangeSentence(found.summary.name, revisionNumber ?? 0, found.revisions.length));
  }
  const preview = await previewOf(db, compute, revision);
  return {
    plant: found.summary,
    revision,
    revisions: found.revisions.map(({ id, number, note, createdAt, createdBy }) => ({ id, number, note, createdAt, createdBy })),
    poles: preview.poles,
    zeros: preview.zeros,
    polesNote: revision.model.kind === "nonlinear" ? NONLINEAR_POLES_NOTE : null,
    step: preview.step,
  };
}

async function previewOf(db: Database, compute: Compute, revision: PlantRevisionDto): Promise<StoredPreview> {
  const stored = (await findRevisionPreview(db, revision.id)) as StoredPreview | null;
  if (stored?.version === PREVIEW_VERSION) return stored;
  const preview = await previewPlantModel(compute, revision.model);
  await storeRevisionPreview(db, revision.id, preview, stored !== null);
  return preview;
}

/** Who may store a model of kind `identified`: only the step-test service, which fits it from a stored file. */
export interface PlantWriteOptions {
  identified?: boolean;
}

/** An identified plant typed by hand would claim a provenance it does not have: refused with a sentence. */
function assertNotHandIdentified(input: PlantInputParsed, options: PlantWriteOptions): void {
  if (input.model.kind === "identified" && !options.identified) {
    throw badRequest("model.kind: an identified plant is fitted from an uploaded step test; upload one from the library, or refit the plant from its page.", "model.kind");
  }
}

/** Adds a plant with its revision 1 (and its preview) to the library (engineer+ checked by the route). */
export async function createPlant(db: Database, compute: Compute, access: MemberAccess, input: PlantInputParsed, options: PlantWriteOptions = {}): Promise<PlantDetailDto> {
  assertNotHandIdentified(input, options);
  const preview = await previewPlantModel(compute, input.model);
  const plantId = await insertPlant(db, access.workspace.id, access.user.id, input, preview);
  return getPlantDetail(db, compute, access, plantId);
}

/** Adds a new immutable revision; earlier revisions (and sweeps on them) stay as they were. */
export async function createRevision(
  db: Database,
  compute: Compute,
  access: MemberAccess,
  plantId: string,
  input: PlantInputParsed,
  options: PlantWriteOptions = {},
): Promise<PlantDetailDto> {
  assertNotHandIdentified(input, options);
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  assertChangeNote(input.note);
  const preview = await previewPlantModel(compute, input.model);
  const number = await insertRevision(db, plantId, access.user.id, input, preview);
  return getPlantDetail(db, compute, access, plantId, number);
}

/** What changed from revision `from` to revision `to` of a plant (core diffPlantRevisions). */
export async function getPlantDiff(
  db: Database,
  access: MemberAccess,
  plantId: string,
  query: { from?: number | undefined; to?: number | undefined },
): Promise<RevisionDiffDto> {
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  const pick = (n: number) => {
    const revision = found.revisions.find((r) => r.number === n);
    if (!revision) throw notFound(revisionRangeSentence(found.summary.name, n, found.revisions.length));
    return revision;
  };
  const { from, to } = diffNumbers(query, found.revisions.length);
  return { from, to, changes: diffPlantRevisions(pick(from), pick(to)) };
}

/**
 * Archives a plant (archived true: hidden from the pickers, its revisions kept for the sweeps and
 * comparisons that use them) or restores it (engineer+ checked by the route). Idempotent.
 */
export async function setPlantArchive(db: Database, compute: Compute, access: MemberAccess, plantId: string, archived: boolean): Promise<PlantDetailDto> {
  if (!(await setPlantArchived(db, access.workspace.id, plantId, archived ? new Date() : null))) throw notFound(PLANT_NOT_FOUND);
  return getPlantDetail(db, compute, access, plantId);
}
