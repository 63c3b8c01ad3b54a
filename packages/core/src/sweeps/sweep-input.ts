import { z } from "zod";
import { CRITERION_IDS, type CriterionId } from "../criteria/criterion-id.js";

/** Largest number of candidates one sweep may hold in this version (grid product). */
export const MAX_SWEEP_CANDIDATES = 5000;
/**
 * Criteria a sweep scores when none are chosen: the four of the first version, so sweeps stored
 * without a criteria list keep their meaning as CRITERION_IDS grows.
 */
export const DEFAULT_SWEEP_CRITERIA: readonly CriterionId[] = ["iae", "ise", "itae", "effort"];
/** Largest number of time samples one simulation may take (horizon / dt). */
export const MAX_SIMULATION_SAMPLES = 200_000;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);

/** One swept parameter: `count` values spaced evenly from `min` to `max` (inclusive). */
export const parameterRangeSchema = z
  .object({
    min: finite("min").min(0, "gains must be ≥ 0"),
    max: finite("max").min(0, "gains must be ≥ 0"),
    count: z.number().int("count must be a whole number").min(1, "count must be at least 1").max(1000, "count must be at most 1000"),
  })
  .refine((r) => r.max >= r.min, { message: "max must be ≥ min", path: ["max"] })
  .refine((r) => r.count === 1 || r.max > r.min, { message: "with more than one value, max must exceed min", path: ["max"] });

export type ParameterRange = z.infer<typeof parameterRangeSchema>;

/**
 * Derivative filter of the swept PID: either a fixed time constant `tf` [s],
 * or `tf = kd / (n · kp)` (the filter is n times faster than the derivative time Td = kd/kp).
 */
export const derivativeFilterSchema = z.discriminatedUnion("mode", [
  z.object({ mode: z.literal("fixed"), tf: finite("tf").min(0, "tf must be ≥ 0 s") }),
  z.object({ mode: z.literal("ratio"), n: finite("n").gt(0, "n must be > 0") }),
]);

export type DerivativeFilter = z.infer<typeof derivativeFilterSchema>;

/** What a user submits to start a PID grid sweep on one plant revision. */
export const sweepInputSchema = z
  .object({
    name: z.string().trim().min(1, "give the sweep a name").max(120, "keep the name under 120 characters"),
    plantRevisionId: z.string().uuid("choose a plant revision"),
    structure: z.literal("pid").default("pid"),
    ranges: z.object({
      kp: parameterRangeSchema,
      ki: parameterRangeSchema,
      kd: parameterRangeSchema,
    }),
    filter: derivativeFilterSchema.default({ mode: "ratio", n: 10 }),
    scenario: z.object({
      kind: z.literal("setpoint-step").default("setpoint-step"),
      horizon: finite("horizon").gt(0, "horizon must be > 0 s").max(1e5, "horizon must be at most 1e5 s"),
      dt: finite("time step").gt(0, "time step must be > 0 s"),
    }),
    criteria: z.array(z.enum(CRITERION_IDS)).min(1, "choose at least one criterion").default(() => [...DEFAULT_SWEEP_CRITERIA]),
  })
  .superRefine((s, ctx) => {
    const { kp, ki, kd } = s.ranges;
    const total = kp.count * ki.count * kd.count;
    if (total > MAX_SWEEP_CANDIDATES) {
      ctx.addIssue({
        code: "custom",
        path: ["ranges"],
        message: `${total} candidates is more than the ${MAX_SWEEP_CANDIDATES} allowed per sweep; lower the counts`,
      });
    }
    const samples = s.scenario.horizon / s.scenario.dt;
    if (samples > MAX_SIMULATION_SAMPLES) {
      ctx.addIssue({
        code: "custom",
        path: ["scenario", "dt"],
        message: `horizon/dt gives ${Math.ceil(samples)} samples, more than ${MAX_SIMULATION_SAMPLES}; raise the time step or shorten the horizon`,
      });
    }
    if (s.filter.mode === "fixed" && s.filter.tf === 0 && kd.max > 0) {
      ctx.addIssue({
        code: "custom",
        path: ["filter", "tf"],
        message: "tf must be > 0 s when kd can be non-zero: the derivative needs its filter",
      });
    }
    if (s.filter.mode === "ratio" && kp.min === 0 && kd.max > 0) {
      ctx.addIssue({
        code: "custom",
        path: ["ranges", "kp", "min"],
        message: "with the ratio filter tf = kd/(n·kp), kp must be > 0 wherever kd is non-zero; raise kp min or use a fixed tf",
      });
    }
    if (s.scenario.dt > s.scenario.horizon / 10) {
      ctx.addIssue({ code: "custom", path: ["scenario", "dt"], message: "the time step must be at most a tenth of the horizon" });
    }
  });

export type SweepInput = z.input<typeof sweepInputSchema>;
export type SweepInputParsed = z.output<typeof sweepInputSchema>;
