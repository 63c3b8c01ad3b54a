import { MAX_SIMULATION_SAMPLES } from "../limits.js";

/**
 * The uniform time grid t_k = k·dt, k = 0…N, N = round(horizon/dt), shared by every simulation.
 *
 * horizon: final time [s], finite, > 0; dt: step [s], finite, > 0 and ≤ horizon.
 * N + 1 must not exceed MAX_SIMULATION_SAMPLES + 1. Throws a RangeError naming `horizon` or `dt`.
 */
export function timeGrid(horizon: number, dt: number): Float64Array {
  if (typeof horizon !== "number" || !Number.isFinite(horizon) || horizon <= 0) {
    throw new RangeError(`horizon must be a finite number of seconds > 0, got ${String(horizon)}`);
  }
  if (typeof dt !== "number" || !Number.isFinite(dt) || dt <= 0) {
    throw new RangeError(`dt must be a finite time step > 0 s, got ${String(dt)}`);
  }
  const steps = Math.round(horizon / dt);
  if (dt > horizon) throw new RangeError(`dt (${dt} s) must not exceed the horizon (${horizon} s)`);
  if (steps > MAX_SIMULATION_SAMPLES) {
    throw new RangeError(`dt: horizon/dt gives ${steps} steps, more than ${MAX_SIMULATION_SAMPLES}; raise the time step`);
  }
  const t = new Float64Array(steps + 1);
  for (let k = 0; k <= steps; k++) t[k] = k * dt;
  return t;
}
