import type { CriterionDefinition } from "./criterion-definition.js";
import { assertSameLength } from "./assert-same-length.js";
import { isDivergedTrace } from "./is-diverged-trace.js";

/**
 * Steady-state error: how far the output ends from the final setpoint,
 *
 *   e_ss = |r(T) − y∞|  when the exact steady-state output y∞ is known (finite),
 *   e_ss = |r(T) − y(T)| otherwise (the error left at the end of the horizon T).
 *
 * With y∞ from the final-value theorem (linear loops) the figure does not depend on the horizon:
 * a loop without integral action on a type-0 plant has e_ss = |Δr|/(1 + kp·G(0)) even if it is
 * still moving at T. For nonlinear loops y∞ is the final sample, so both forms agree. Unlike the
 * step-response figures it applies to a load step too (it is then the offset the load leaves).
 * The value at t = 0⁺ does not enter.
 *
 * r, y: setpoint and output samples [y]; yInfinity: exact steady-state output [y] or NaN.
 * Result [y].
 *
 * Reference: G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, 4th ed., Prentice Hall, 2002, §4.2 (steady-state error by the final-value theorem).
 */
export function steadyStateError(r: ArrayLike<number>, y: ArrayLike<number>, yInfinity: number): number {
  assertSameLength(r, { y });
  const last = r.length - 1;
  return Math.abs(r[last] - (Number.isFinite(yInfinity) ? yInfinity : y[last]));
}

export const steadyStateErrorCriterion: CriterionDefinition = {
  id: "steadyStateError",
  kind: "time",
  label: "Steady-state error",
  unit: "y",
  description: "|r − y∞| with the exact steady-state output y∞, or |r − y| at the end of the horizon when y∞ is unknown.",
  compute: (trace) => (isDivergedTrace(trace) ? NaN : steadyStateError(trace.r, trace.y, trace.yInfinity)),
};
