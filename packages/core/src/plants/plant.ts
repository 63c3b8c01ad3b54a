import { z } from "zod";
import { transferFunctionSchema, type TransferFunctionPlant } from "./transfer-function.js";

/**
 * A plant model: a tagged union on `kind`. Later kinds (state-space, nonlinear,
 * identified) are added here as new members, one file per kind.
 */
export type Plant = TransferFunctionPlant;

export type PlantKind = Plant["kind"];

/** Runtime check of any plant model. */
export const plantModelSchema = transferFunctionSchema;
