import { z } from "zod";
import { nonlinearSchema, type NonlinearPlant } from "./nonlinear.js";
import { stateSpaceSchema, type StateSpacePlant } from "./state-space.js";
import { transferFunctionSchema, type TransferFunctionPlant } from "./transfer-function.js";

/** A plant model: a tagged union on `kind`, one file per kind. */
export type Plant = TransferFunctionPlant | StateSpacePlant | NonlinearPlant;

export type PlantKind = Plant["kind"];

/** The plant kinds with a rational transfer function. */
export type LinearPlant = TransferFunctionPlant | StateSpacePlant;

/** Runtime check of any plant model. */
export const plantModelSchema = z.discriminatedUnion("kind", [transferFunctionSchema, stateSpaceSchema, nonlinearSchema]);
