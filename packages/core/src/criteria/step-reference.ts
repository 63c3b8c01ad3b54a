import type { LoopTrace } from "../simulation/loop-trace.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * The levels a step-response figure (overshoot, undershoot, rise and settling time) is measured
 * against: the output before the step `y0` and the final value `target` it moves to.
 *
 * target = y∞ (trace.yInfinity) when that is finite: the loop's own steady-state output, so a loop
 * without integral action that settles short of the setpoint is judged on how it reaches where it
 * settles (the textbook definition, relative to c(∞), Ogata 2010 §5-3). When y∞ is NaN (no exact
 * steady state known) target = y0 + stepSize, the setpoint after the step.
 *
 * Returns null — the caller then reports NaN — when the scenario has no setpoint change
 * (stepSize = 0 or not finite), when the trace diverged, or when the output change target − y0
 * is zero or not finite (e.g. a plant with zero gain at s = 0).
 */
export function stepReference(trace: LoopTrace): { y0: number; target: number } | null {
  const { y0, stepSize, yInfinity } = trace;
  if (isDivergedTrace(trace) || !Number.isFinite(stepSize) || stepSize === 0 || !Number.isFinite(y0)) return null;
  const target = Number.isFinite(yInfinity) ? yInfinity : y0 + stepSize;
  if (target === y0) return null;
  return { y0, target };
}

/** Throws a RangeError unless y0 and target are finite and different (the change is not zero). */
export function assertStepLevels(y0: number, target: number): void {
  if (!Number.isFinite(y0)) throw new RangeError(`y0 must be finite, got ${y0}`);
  if (!Number.isFinite(target)) throw new RangeError(`target must be finite, got ${target}`);
  if (target === y0) throw new RangeError("target must differ from y0: the step changes the output by zero");
}
