import { z } from "zod";
import { MAX_SIMULATION_SAMPLES } from "../sweeps/sweep-input.js";

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);

/**
 * The scenario of a CLI spec (see Scenario): kind, horizon [s], dt [s], optional setpoint step
 * size, load step {size, time} and measurement noise {sd, seed}. At most MAX_SIMULATION_SAMPLES
 * time steps; dt at most a tenth of the horizon.
 */
export const scenarioSpecSchema = z
  .strictObject({
    kind: z.enum(["setpoint-step", "load-step", "combined"], { error: 'kind must be "setpoint-step", "load-step" or "combined"' }),
    horizon: finite("horizon").gt(0, "horizon must be > 0 s"),
    dt: finite("dt").gt(0, "dt must be > 0 s"),
    setpoint: finite("setpoint").optional(),
    load: z.strictObject({ size: finite("load size"), time: finite("load time").min(0, "load time must be ≥ 0 s") }).optional(),
    noise: z
      .strictObject({
        sd: finite("noise sd").min(0, "noise sd must be ≥ 0"),
        seed: z.number({ error: "noise seed must be a number" }).int("noise seed must be a whole number"),
      })
      .optional(),
  })
  .superRefine((s, ctx) => {
    if (s.dt > s.horizon / 10) ctx.addIssue({ code: "custom", path: ["dt"], message: "dt must be at most a tenth of the horizon" });
    const samples = s.horizon / s.dt;
    if (samples > MAX_SIMULATION_SAMPLES) {
      ctx.addIssue({
        code: "custom",
        path: ["dt"],
        message: `horizon/dt gives ${Math.ceil(samples)} steps, more than ${MAX_SIMULATION_SAMPLES}; raise dt or shorten the horizon`,
      });
    }
  });

export type ScenarioSpec = z.output<typeof scenarioSpecSchema>;
