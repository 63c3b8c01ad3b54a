/**
 * A simulated closed loop on the uniform grid t_k = k·dt, k = 0…N (N = round(horizon/dt)):
 * setpoint r, plant output y, controller output (plant input before any dead time) u, and
 * error e = r − y, each with N + 1 samples. At t = 0 every signal holds its right limit t → 0⁺
 * (the setpoint step has happened).
 */
export interface LoopTrace {
  t: Float64Array;
  r: Float64Array;
  y: Float64Array;
  u: Float64Array;
  e: Float64Array;
  /**
   * The exact steady-state input u∞ = lim_{t→∞} u(t) of the loop (see steadyStateInput);
   * NaN when the loop has no steady state (a closed-loop pole at s = 0).
   */
  uInfinity: number;
}

/** A unit setpoint step r(t) = 1 for t ≥ 0, simulated up to `horizon` [s] with step `dt` [s]. */
export interface SetpointStepScenario {
  kind: "setpoint-step";
  horizon: number;
  dt: number;
}
