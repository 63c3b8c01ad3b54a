import type { Plant } from "@loopyard/core";
import type { ComputeFailure, PlantPreview } from "@loopyard/core/pool";
import { limitExceeded, type Compute } from "../compute/compute.js";
import { badRequest, type HttpError } from "../http/http-error.js";

/** Samples of the open-loop step response over the suggested horizon. */
export const STEP_SAMPLES = 600;

/**
 * Version of a stored preview: raise it when what the plantPreview task returns changes, so that
 * previews stored by an earlier version are computed again on their next view.
 */
export const PREVIEW_VERSION = 2;

/** A preview as stored with its revision. */
export interface StoredPreview extends PlantPreview {
  version: number;
}

/**
 * Checks that the library can work with a plant model and computes what its page shows, on the
 * server's compute pool (core's plantPreview task: a nonlinear plant's expressions compile — core
 * compileSystem's whitelist; nothing typed is run as JavaScript —, its poles, its open-loop step over
 * the suggested horizon), under a work budget and a time limit. Throws a 400 naming `model.<field>`
 * for a refused model (e.g. model.derivatives.0 for the offending expression) and a 422 when the
 * step needs more work than a request may do (a very stiff model).
 */
export async function previewPlantModel(compute: Compute, model: Plant): Promise<StoredPreview> {
  const outcome = await compute.run("plantPreview", { model, samples: STEP_SAMPLES });
  if (outcome.ok) return { version: PREVIEW_VERSION, ...outcome.value };
  throw (
    limitExceeded(
      outcome,
      "The open-loop step of this plant",
      "the model is probably very stiff (time constants far apart); rescale its gains or time constants and try again.",
    ) ?? toBadRequest(outcome)
  );
}

/** The 400 for a refused model: the compiler's errors carry their field; core's RangeErrors name `plant.<field>`. */
function toBadRequest(failure: ComputeFailure): HttpError {
  if (failure.error === "ExpressionError" || failure.error === "DeclaredNameError") {
    const field = failure.field ? `model.${failure.field}` : "model";
    return badRequest(`${field}: ${failure.reason}`, field);
  }
  const named = /^plant\.([\w.[\]]+)/.exec(failure.reason);
  const field = named ? `model.${named[1]}` : "model";
  const message = failure.reason.replace(/^plant\.([\w.[\]]+)/, field);
  return badRequest(message.startsWith(field) ? message : `${field}: ${message}`, field);
}
