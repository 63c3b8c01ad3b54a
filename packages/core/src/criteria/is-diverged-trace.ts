import type { LoopTrace } from "../simulation/loop-trace.js";

/**
 * True when the simulation diverged: its samples after the divergence are NaN, so every criterion
 * returns NaN for such a trace rather than a figure of its finite head that could rank as good.
 */
export function isDivergedTrace(trace: LoopTrace): boolean {
  return trace.status === "diverged";
}
