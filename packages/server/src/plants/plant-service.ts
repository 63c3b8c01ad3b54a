import { openLoopStep, plantPoles, suggestHorizon, downsampleIndices, pick } from "@loopyard/core";
import type { PlantDetailDto, PlantInputParsed, PlantRevisionDto, PlantSummaryDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { assertUsablePlantModel, STEP_SAMPLES } from "./plant-model-check.js";
import { findPlantWithRevisions, insertPlant, insertRevision, listPlantSummaries } from "./plant-repository.js";

/** What the poles of a nonlinear plant are. */
export const NONLINEAR_POLES_NOTE =
  "Poles of the linearisation at the operating point (the initial state with the operating input); the nonlinear plant may behave differently away from it.";

export const PLANT_NOT_FOUND = "There is no such plant in this workspace.";

export async function listPlants(db: Database, access: MemberAccess): Promise<PlantSummaryDto[]> {
  return listPlantSummaries(db, access.workspace.id);
}

/** A plant with one revision (the latest unless `revisionNumber`), its poles and open-loop step. */
export async function getPlantDetail(
  db: Database,
  access: MemberAccess,
  plantId: string,
  revisionNumber?: number,
): Promise<PlantDetailDto> {
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  const revision =
    revisionNumber === undefined ? found.summary.latestRevision : found.revisions.find((r) => r.number === revisionNumber);
  if (!revision) {
    throw notFound(`${found.summary.name} has no revision ${revisionNumber}; it has revisions 1 to ${found.revisions.length}.`);
  }
  return {
    plant: found.summary,
    revision,
    revisions: found.revisions.map(({ id, number, createdAt, createdBy }) => ({ id, number, createdAt, createdBy })),
    poles: plantPoles(revision.model),
    polesNote: revision.model.kind === "nonlinear" ? NONLINEAR_POLES_NOTE : null,
    step: stepOf(revision),
  };
}

function stepOf(revision: PlantRevisionDto): { t: number[]; y: number[] } {
  const horizon = suggestHorizon(revision.model);
  const { t, y } = openLoopStep(revision.model, horizon, horizon / STEP_SAMPLES);
  const indices = downsampleIndices(t.length);
  return { t: pick(t, indices), y: pick(y, indices) };
}

/** Adds a plant with its revision 1 to the library (engineer+ checked by the route). */
export async function createPlant(db: Database, access: MemberAccess, input: PlantInputParsed): Promise<PlantDetailDto> {
  assertUsablePlantModel(input.model);
  const plantId = await insertPlant(db, access.workspace.id, access.user.id, input);
  return getPlantDetail(db, access, plantId);
}

/** Adds a new immutable revision; earlier revisions (and sweeps on them) stay as they were. */
export async function createRevision(
  db: Database,
  access: MemberAccess,
  plantId: string,
  input: PlantInputParsed,
): Promise<PlantDetailDto> {
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  assertUsablePlantModel(input.model);
  const number = await insertRevision(db, plantId, access.user.id, input);
  return getPlantDetail(db, access, plantId, number);
}
