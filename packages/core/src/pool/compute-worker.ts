// Worker side of the compute pool: one named task per message (see compute-tasks.ts).
import { runComputeTask, type ComputeRequest } from "./compute-tasks.js";

export default function compute(request: ComputeRequest): unknown {
  return runComputeTask(request);
}
