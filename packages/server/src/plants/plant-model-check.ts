import { DeclaredNameError, ExpressionError, nonlinearPlantModel, openLoopStep, plantPoles, suggestHorizon } from "@loopyard/core";
import type { Plant } from "@loopyard/core";
import { badRequest, type HttpError } from "../http/http-error.js";

/** Samples of the open-loop step response over the suggested horizon. */
export const STEP_SAMPLES = 600;

/**
 * Checks that the library can work with a plant model before it is stored: a nonlinear plant's
 * expressions compile (core compileSystem's whitelist; nothing typed is run as JavaScript) and its
 * operating point is finite; every kind has poles and an open-loop step. Throws a 400 naming
 * `model.<field>` (e.g. model.derivatives.0 for the offending expression).
 */
export function assertUsablePlantModel(model: Plant): void {
  try {
    if (model.kind === "nonlinear") nonlinearPlantModel(model);
    const horizon = suggestHorizon(model);
    plantPoles(model);
    openLoopStep(model, horizon, horizon / STEP_SAMPLES);
  } catch (error) {
    const http = toBadRequest(error);
    if (http) throw http;
    throw error;
  }
}

/** The 400 for a refused model: the compiler's errors carry their field; core's RangeErrors name `plant.<field>`. */
function toBadRequest(error: unknown): HttpError | null {
  if (error instanceof ExpressionError || error instanceof DeclaredNameError) {
    const field = error.field ? `model.${error.field}` : "model";
    return badRequest(`${field}: ${error.message}`, field);
  }
  if (error instanceof RangeError || error instanceof TypeError) {
    const named = /^plant\.([\w.[\]]+)/.exec(error.message);
    const field = named ? `model.${named[1]}` : "model";
    const message = error.message.replace(/^plant\.([\w.[\]]+)/, field);
    return badRequest(message.startsWith(field) ? message : `${field}: ${message}`, field);
  }
  return null;
}
