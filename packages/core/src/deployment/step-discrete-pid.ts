import type { DiscretePid } from "./discrete-pid.js";

/** The memory of a discrete PID between samples. */
export interface DiscretePidState {
  /** Ī: the integral before this sample's error is added [u]. */
  integral: number;
  /** D[k−1]: the filtered derivative term [u]. */
  derivative: number;
  /** r[k−1], y[k−1], e[k−1] = r[k−1] − y[k−1] and u[k−1] (for the rate limit). */
  r: number;
  y: number;
  e: number;
  u: number;
}

/** One sample of a discrete PID: the output u, the unlimited output v, and the next state. */
export interface DiscretePidStep {
  u: number;
  v: number;
  state: DiscretePidState;
}

/** Slots of the packed memory used by advanceDiscretePid. */
const INTEGRAL = 0;
const DERIVATIVE = 1;
const R = 2;
const Y = 3;
const E = 4;
const U = 5;
/** Length of the packed memory (the sixth slot holds v after a step). */
export const DISCRETE_PID_MEMORY = 7;
const V = 6;

/**
 * The state of a PID at rest with set point r, measurement y and output u: bumpless, the integral
 * set so that the next sample with the same r and y starts from u (Ī = u − (pr·r − py·y)), the
 * derivative at rest.
 */
export function initialDiscretePidState(pid: DiscretePid, r: number, y: number, u: number): DiscretePidState {
  const { pr, py } = pid.coefficients;
  return { integral: u - (pr * r - py * y), derivative: 0, r, y, e: r - y, u };
}

/**
 * One sample of the discrete PID with back-calculation anti-windup, output limits and rate limit
 * (the difference equations of DiscretePidCoefficients; the order of operations is the one
 * firmware should follow):
 *
 *   e = r − y
 *   P = pr·r − py·y
 *   I = Ī + bi1·e + bi0·e[k−1]
 *   D = ad·D[k−1] + dr·(r − r[k−1]) − dy·(y − y[k−1])
 *   v = P + I + D
 *   u = min(max(v, umin), umax),  then  u = min(max(u, u[k−1] − du_max), u[k−1] + du_max)
 *   Ī ← I + at·(u − v)
 *
 * Pure: returns the output and the next state, the given state unchanged.
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §3.6.
 */
export function stepDiscretePid(pid: DiscretePid, state: DiscretePidState, r: number, y: number): DiscretePidStep {
  const memory = new Float64Array(DISCRETE_PID_MEMORY);
  memory[INTEGRAL] = state.integral;
  memory[DERIVATIVE] = state.derivative;
  memory[R] = state.r;
  memory[Y] = state.y;
  memory[E] = state.e;
  memory[U] = state.u;
  const u = advanceDiscretePid(pid, memory, r, y);
  return {
    u,
    v: memory[V],
    state: { integral: memory[INTEGRAL], derivative: memory[DERIVATIVE], r: memory[R], y: memory[Y], e: memory[E], u: memory[U] },
  };
}

/** The memory of initialDiscretePidState packed for advanceDiscretePid. */
export function packDiscretePidState(state: DiscretePidState): Float64Array {
  return Float64Array.from([state.integral, state.derivative, state.r, state.y, state.e, state.u, NaN]);
}

/**
 * stepDiscretePid on packed memory [Ī, D, r, y, e, u, v], updated in place (no allocation, for
 * simulation loops); returns u. The one implementation of the algorithm.
 */
export function advanceDiscretePid(pid: DiscretePid, memory: Float64Array, r: number, y: number): number {
  const { pr, py, bi1, bi0, ad, dr, dy, at } = pid.coefficients;
  const { min, max, step } = pid.limits;
  const e = r - y;
  const p = pr * r - py * y;
  const i = memory[INTEGRAL] + bi1 * e + bi0 * memory[E];
  const d = ad * memory[DERIVATIVE] + dr * (r - memory[R]) - dy * (y - memory[Y]);
  const v = p + i + d;
  let u = v < min ? min : v > max ? max : v;
  const previous = memory[U];
  if (u > previous + step) u = previous + step;
  else if (u < previous - step) u = previous - step;
  memory[INTEGRAL] = i + at * (u - v);
  memory[DERIVATIVE] = d;
  memory[R] = r;
  memory[Y] = y;
  memory[E] = e;
  memory[U] = u;
  memory[V] = v;
  return u;
}
