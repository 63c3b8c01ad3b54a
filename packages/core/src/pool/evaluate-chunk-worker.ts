// Worker side of the evaluation pool: evaluates one chunk of candidates with evaluateBatch and
// hands the result back in ONE transferred buffer (no copy on the way back).
import { setPriority } from "node:os";
import { Piscina } from "piscina";
import { evaluateBatch } from "../batch/evaluate-batch.js";
import type { ChunkReply, ChunkTask } from "./chunk-task.js";

// The pool's niceness (EvaluationPoolConfig.niceness), for this thread only: on Linux each thread
// has its own nice value, so the process's request thread keeps its priority.
const niceness = (Piscina.workerData as { niceness?: number } | undefined)?.niceness ?? 0;
if (niceness > 0) setPriority(niceness);

/**
 * Evaluates `task.candidates` (n × d) and returns a Uint8Array over one ArrayBuffer laid out as
 * [scores: Float64 × n·F·C][status: Uint8 × n·F] (see chunkResultViews), moved to the caller;
 * a ChunkReply with the rejection sentences instead when some candidate was rejected.
 */
export default function evaluateChunk(task: ChunkTask): unknown {
  const d = task.structure.tunable.length;
  const n = d === 0 ? 0 : task.candidates.length / d;
  const rows = n * task.family.length;
  const buffer = new ArrayBuffer(rows * task.criteria.length * 8 + rows);
  const scores = new Float64Array(buffer, 0, rows * task.criteria.length);
  const status = new Uint8Array(buffer, scores.byteLength, rows);
  const result = evaluateBatch(task.family, task.structure, task.candidates, task.scenario, task.criteria, {
    ...(task.evaluation === undefined ? {} : { evaluation: task.evaluation }),
    into: { status, scores },
  });
  // Rejection sentences are rare: the plain buffer moves alone; with reasons both are cloned.
  if (result.reasons === undefined) return Piscina.move(new Uint8Array(buffer));
  return { bytes: new Uint8Array(buffer), reasons: [...result.reasons] } satisfies ChunkReply;
}
