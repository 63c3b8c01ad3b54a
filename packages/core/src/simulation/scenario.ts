/** What the loop must do: the scenario kinds. */
export type ScenarioKind = "setpoint-step" | "load-step" | "combined";

/** A step of size `size` added at the plant input at time `time` [s] (a load disturbance). */
export interface LoadStep {
  size: number;
  time: number;
}

/** White Gaussian measurement noise of standard deviation `sd` [y], reproducible from `seed`. */
export interface MeasurementNoise {
  sd: number;
  seed: number;
}

/**
 * A scenario: simulated from t = 0 to `horizon` [s] on the grid t_k = k·dt.
 *
 * - `setpoint`: the setpoint step size [y] at t = 0 from the operating point (r = y0 + setpoint);
 *   default 1 for "setpoint-step" and "combined", 0 for "load-step".
 * - `load`: a step added to the plant input; default { size: 1, time: 0 } for "load-step" and
 *   "combined", none for "setpoint-step".
 * - `noise`: measurement noise added to the y fed back to the controller (not to the recorded y).
 */
export interface Scenario {
  kind: ScenarioKind;
  horizon: number;
  dt: number;
  setpoint?: number;
  load?: LoadStep;
  noise?: MeasurementNoise;
}

/** A unit setpoint step r(t) = 1 for t ≥ 0, simulated up to `horizon` [s] with step `dt` [s]. */
export interface SetpointStepScenario extends Scenario {
  kind: "setpoint-step";
}
