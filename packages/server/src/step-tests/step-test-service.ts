import {
  identificationProvenance,
  type IdentifiedPlant,
  type PlantDetailDto,
  type StepModelKind,
  type StepTestDto,
  type StepTestFitReport,
  type StepTestSettings,
} from "@loopyard/core";
import type { z } from "zod";
import type { refitInputSchema, stepTestFitInputSchema, stepTestPlantInputSchema } from "@loopyard/core";
import { limitExceeded, type Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { badRequest, HttpError, notFound } from "../http/http-error.js";
import { PLANT_NOT_FOUND, createPlant, createRevision } from "../plants/plant-service.js";
import { findPlantWithRevisions } from "../plants/plant-repository.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findStepTest, findStepTestText, insertStepTest } from "./step-test-repository.js";
import type { ReceivedStepTest } from "./step-test-upload.js";

export const STEP_TEST_NOT_FOUND = "There is no such step test in this workspace; upload the file again.";

type FitInput = z.output<typeof stepTestFitInputSchema>;
type PlantInput = z.output<typeof stepTestPlantInputSchema>;
type RefitInput = z.output<typeof refitInputSchema>;

/** A compute failure of a step-test task as the API's 4xx: a file problem names the row and column (field "file" or the chosen column). */
function refusal(failure: { kind: string; reason: string; field?: string; row?: number; column?: number }): HttpError {
  const limited = limitExceeded(failure as Parameters<typeof limitExceeded>[0], "Fitting this step test", "trim it to the step or thin its rows, and fit again.");
  if (limited) return limited;
  return badRequest(failure.reason, failure.field === "file" ? "file" : "settings");
}

/** Stores an uploaded step test after checking it (stepTestOverview, on the compute pool); answers its columns and preview. */
export async function uploadStepTest(db: Database, compute: Compute, access: MemberAccess, file: ReceivedStepTest): Promise<StepTestDto> {
  const outcome = await compute.run("stepTestOverview", { text: file.text });
  if (!outcome.ok) throw refusal(outcome);
  const id = await insertStepTest(db, access.workspace.id, access.user.id, file, outcome.value);
  const stored = await findStepTest(db, access.workspace.id, id);
  if (!stored) throw new Error(`step test ${id} vanished after insert`);
  return stored;
}

export async function getStepTest(db: Database, access: MemberAccess, id: string): Promise<StepTestDto> {
  const found = await findStepTest(db, access.workspace.id, id);
  if (!found) throw notFound(STEP_TEST_NOT_FOUND);
  return found;
}

async function fitStored(db: Database, compute: Compute, access: MemberAccess, id: string, settings: StepTestSettings, models: StepModelKind[]): Promise<{ fileName: string; report: StepTestFitReport }> {
  const stored = await findStepTestText(db, access.workspace.id, id);
  if (!stored) throw notFound(STEP_TEST_NOT_FOUND);
  const outcome = await compute.run("stepTestFit", { text: stored.text, settings, models });
  if (!outcome.ok) throw refusal(outcome);
  return { fileName: stored.fileName, report: outcome.value };
}

/** Fits the requested models to a stored step test with the given settings, on the compute pool under its work budget. */
export async function fitStepTestModels(db: Database, compute: Compute, access: MemberAccess, id: string, input: FitInput): Promise<StepTestFitReport> {
  return (await fitStored(db, compute, access, id, input.settings, input.models)).report;
}

/** The identified plant model of one fit, or a 422 saying why that model could not be fitted. */
function identifiedModel(id: string, fileName: string, settings: StepTestSettings, report: StepTestFitReport, kind: StepModelKind, actuator: IdentifiedPlant["actuator"]): IdentifiedPlant {
  const fit = report.fits[kind];
  const provenance = identificationProvenance(id, fileName, settings, report, kind);
  if (!fit || !fit.ok || !provenance) {
    throw new HttpError(422, `The ${kind.toUpperCase()} model cannot be fitted to this step test (${fit && !fit.ok ? fit.reason : "no fit"}); choose another model or other columns.`, { field: "model" });
  }
  const model: IdentifiedPlant = { kind: "identified", num: fit.model.num, den: fit.model.den, delay: fit.model.delay, identification: provenance };
  if (actuator) model.actuator = actuator;
  return model;
}

/** Fits the chosen model again and saves it as revision 1 of a new plant of kind `identified`. */
export async function saveIdentifiedPlant(db: Database, compute: Compute, access: MemberAccess, id: string, input: PlantInput): Promise<PlantDetailDto> {
  const { fileName, report } = await fitStored(db, compute, access, id, input.settings, [input.model]);
  const model = identifiedModel(id, fileName, input.settings, report, input.model, input.actuator);
  return createPlant(db, compute, access, { name: input.name, unitsNote: input.unitsNote, model }, { identified: true });
}

/**
 * Fits an identified plant again from its stored step test with new settings or another model,
 * as a new revision (earlier revisions, and sweeps on them, stay as they were). Name, units note
 * and actuator limits carry over unless given.
 */
export async function refitPlant(db: Database, compute: Compute, access: MemberAccess, plantId: string, input: RefitInput): Promise<PlantDetailDto> {
  const found = await findPlantWithRevisions(db, access.workspace.id, plantId);
  if (!found) throw notFound(PLANT_NOT_FOUND);
  const latest = found.summary.latestRevision;
  if (latest.model.kind !== "identified") {
    throw badRequest(`${latest.name} was not identified from a step test (it is a ${latest.model.kind} plant), so it cannot be refitted; upload a step test to identify a plant.`, "plantId");
  }
  const stepTestId = latest.model.identification.stepTestId;
  const { fileName, report } = await fitStored(db, compute, access, stepTestId, input.settings, [input.model]);
  const model = identifiedModel(stepTestId, fileName, input.settings, report, input.model, input.actuator ?? latest.model.actuator);
  const trim = input.settings.trim;
  const window = `${trim?.from === undefined ? "the first row" : `${trim.from} s`} to ${trim?.to === undefined ? "the last row" : `${trim.to} s`}`;
  const note = input.note ?? `Refitted from ${fileName} as ${input.model.toUpperCase()} over ${window}.`;
  return createRevision(db, compute, access, plantId, { name: input.name ?? latest.name, unitsNote: input.unitsNote ?? latest.unitsNote, note, model }, { identified: true });
}
