/**
 * A simulated closed loop on the uniform grid t_k = k·dt, k = 0…N (N = round(horizon/dt)):
 * setpoint r, measured plant output y (noise-free), controller output u (the plant input before
 * any dead time, after actuator limits), and error e = r − y, each with N + 1 samples. At t = 0
 * every signal holds its right limit t → 0⁺ (a setpoint step at t = 0 has happened).
 *
 * Signals are absolute values, not deviations: a loop around an operating point starts at
 * y[0] = y0, r = y0 + stepSize. Criteria that need deviations subtract y0 or u∞ themselves.
 */
export interface LoopTrace {
  t: Float64Array;
  r: Float64Array;
  y: Float64Array;
  u: Float64Array;
  e: Float64Array;
  /**
   * The steady-state input u∞ = lim_{t→∞} u(t) of the loop. Linear loops: exact, from the
   * final-value theorem on the scenario's inputs (see steadyStateInput); NaN when the loop has no
   * steady state (a closed-loop pole at s = 0). Nonlinear loops: the final sample u[N].
   */
  uInfinity: number;
  /** Output at the operating point before any step [y]: 0 for linear plants from rest; the output at `initial` for nonlinear plants. */
  y0: number;
  /** Setpoint change of the scenario [y] (r = y0 + stepSize for t ≥ 0); 0 when the scenario has no setpoint step. */
  stepSize: number;
  /**
   * The steady-state output y∞ = lim_{t→∞} y(t) the loop tends to [y]. Linear loops: exact, from
   * the final-value theorem; NaN when there is no steady state. Nonlinear loops: the final sample y[N].
   */
  yInfinity: number;
  /**
   * The scenario's load step at the plant input (size [u], time [s], before the dead time), when it
   * has one of non-zero size; criteria of the load response (loadRecoveryTime) read it.
   */
  load?: { size: number; time: number };
  /**
   * "ok", or "diverged" when the simulation left the divergence bound or became non-finite; the
   * samples after that point are NaN and criteria on such a trace are meaningless.
   */
  status: "ok" | "diverged";
}

export type { SetpointStepScenario } from "./scenario.js";
