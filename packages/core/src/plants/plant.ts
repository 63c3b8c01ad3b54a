import { z } from "zod";
import { identifiedSchema, type IdentifiedPlant } from "./identified.js";
import { nonlinearSchema, type NonlinearPlant } from "./nonlinear.js";
import { stateSpaceSchema, type StateSpacePlant } from "./state-space.js";
import { transferFunctionSchema, type TransferFunctionPlant } from "./transfer-function.js";

/** A plant model: a tagged union on `kind`, one file per kind. */
export type Plant = TransferFunctionPlant | StateSpacePlant | NonlinearPlant | IdentifiedPlant;

export type PlantKind = Plant["kind"];

/** The plant kinds with a rational transfer function (an identified plant is its fitted transfer function with dead time). */
export type LinearPlant = TransferFunctionPlant | StateSpacePlant | IdentifiedPlant;

/** Runtime check of any plant model. */
export const plantModelSchema = z.discriminatedUnion("kind", [transferFunctionSchema, stateSpaceSchema, nonlinearSchema, identifiedSchema]);
