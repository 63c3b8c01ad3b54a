import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import { frequencyResponse, type FrequencyResponse } from "./frequency-response.js";

const cache = new WeakMap<LoopTransferFunction, FrequencyResponse>();

/**
 * frequencyResponse(loop) without a weight, computed once per loop object and reused (loops are
 * treated as immutable), so that several frequency criteria of one candidate share one grid.
 * The frequency criteria (ms, mt, gainMargin, …) read their figures from here.
 */
export function loopFrequencyResponse(loop: LoopTransferFunction): FrequencyResponse {
  let response = cache.get(loop);
  if (response === undefined) {
    response = frequencyResponse(loop);
    cache.set(loop, response);
  }
  return response;
}
