import { z } from "zod";

/**
 * Limits of the actuator between controller and plant, on any plant kind:
 * `min`/`max` saturate the plant input u [u]; `rate` bounds |du/dt| [u/s]. Omitted: no limit.
 * The simulation applies saturation first, then the rate limit, at every controller update.
 */
export interface ActuatorLimits {
  min?: number;
  max?: number;
  rate?: number;
}

/** Runtime check of ActuatorLimits: finite numbers, min < max when both are given, rate > 0. */
export const actuatorLimitsSchema = z
  .object({
    min: z.number({ error: "min must be a number" }).finite("min must be finite").optional(),
    max: z.number({ error: "max must be a number" }).finite("max must be finite").optional(),
    rate: z.number({ error: "rate must be a number" }).finite("rate must be finite").gt(0, "rate must be > 0 (units per second)").optional(),
  })
  .refine((a) => a.min === undefined || a.max === undefined || a.min < a.max, {
    message: "max must exceed min",
    path: ["max"],
  });

/** True when the limits restrict anything. */
export function hasActuatorLimits(limits: ActuatorLimits | undefined): boolean {
  return limits !== undefined && (limits.min !== undefined || limits.max !== undefined || limits.rate !== undefined);
}
