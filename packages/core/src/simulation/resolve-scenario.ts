import type { Scenario, ScenarioKind } from "./scenario.js";
import { timeGrid } from "./time-grid.js";

/** A scenario with its defaults filled in (see Scenario). */
export interface ResolvedScenario {
  kind: ScenarioKind;
  horizon: number;
  dt: number;
  /** Setpoint step size Δr [y]. */
  setpoint: number;
  /** Load step at the plant input, or null. */
  load: { size: number; time: number } | null;
  /** Measurement noise, or null (also when sd = 0). */
  noise: { sd: number; seed: number } | null;
  /** The grid t_k = k·dt. */
  t: Float64Array;
}

const KINDS: readonly ScenarioKind[] = ["setpoint-step", "load-step", "combined"];

/**
 * Checks a scenario and fills its defaults: setpoint 1 for "setpoint-step" and "combined", 0 for
 * "load-step"; load { size: 1, time: 0 } for "load-step" and "combined", none for "setpoint-step".
 * Throws a RangeError naming `scenario.<field>`.
 */
export function resolveScenario(scenario: Scenario): ResolvedScenario {
  if (scenario === null || typeof scenario !== "object") throw new TypeError("scenario must be an object");
  if (!KINDS.includes(scenario.kind)) throw new RangeError(`scenario.kind must be one of ${KINDS.join(", ")}, got ${String(scenario.kind)}`);
  let t: Float64Array;
  try {
    t = timeGrid(scenario.horizon, scenario.dt);
  } catch (error) {
    throw new RangeError(`scenario.${(error as Error).message}`);
  }
  const setpoint = scenario.setpoint ?? (scenario.kind === "load-step" ? 0 : 1);
  if (typeof setpoint !== "number" || !Number.isFinite(setpoint)) throw new RangeError(`scenario.setpoint must be a finite number, got ${String(setpoint)}`);
  let load: ResolvedScenario["load"] = null;
  const given = scenario.load ?? (scenario.kind === "setpoint-step" ? undefined : { size: 1, time: 0 });
  if (given !== undefined) {
    if (!Number.isFinite(given.size)) throw new RangeError(`scenario.load.size must be a finite number, got ${String(given.size)}`);
    const time = given.time ?? 0;
    if (!(time >= 0) || !Number.isFinite(time)) throw new RangeError(`scenario.load.time must be a finite time ≥ 0 s, got ${String(time)}`);
    if (given.size !== 0) load = { size: given.size, time };
  }
  let noise: ResolvedScenario["noise"] = null;
  if (scenario.noise !== undefined) {
    const { sd, seed } = scenario.noise;
    if (!(sd >= 0) || !Number.isFinite(sd)) throw new RangeError(`scenario.noise.sd must be a finite number ≥ 0, got ${String(sd)}`);
    if (!Number.isInteger(seed)) throw new RangeError(`scenario.noise.seed must be a whole number, got ${String(seed)}`);
    if (sd > 0) noise = { sd, seed };
  }
  return { kind: scenario.kind, horizon: scenario.horizon, dt: scenario.dt, setpoint, load, noise, t };
}
