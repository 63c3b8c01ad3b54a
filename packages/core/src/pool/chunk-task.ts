import type { EvaluationOptions } from "../batch/evaluate-batch.js";
import type { Structure } from "../batch/structure.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";

/** What the pool sends a worker: the batch arguments with one slice of the candidates. */
export interface ChunkTask {
  family: readonly Plant[];
  structure: Structure;
  candidates: Float64Array;
  scenario: Scenario;
  criteria: readonly CriterionId[];
  evaluation?: EvaluationOptions;
}

/** The status and scores views of a chunk result buffer [scores f64 × rows·C][status u8 × rows]. */
export function chunkResultViews(bytes: Uint8Array, rows: number, criteria: number): { status: Uint8Array; scores: Float64Array } {
  const scoreBytes = rows * criteria * 8;
  if (bytes.byteLength !== scoreBytes + rows) throw new Error(`chunk result holds ${bytes.byteLength} bytes, expected ${scoreBytes + rows}`);
  return {
    scores: new Float64Array(bytes.buffer, bytes.byteOffset, rows * criteria),
    status: new Uint8Array(bytes.buffer, bytes.byteOffset + scoreBytes, rows),
  };
}

/** A worker's answer when some candidate was rejected: the result buffer and [row, sentence] pairs. */
export interface ChunkReply {
  bytes: Uint8Array;
  reasons: [number, string][];
}
