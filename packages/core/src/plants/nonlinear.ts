import { z } from "zod";
import { actuatorLimitsSchema, type ActuatorLimits } from "./actuator-limits.js";

/** Most states a nonlinear plant may declare. */
export const MAX_NONLINEAR_STATES = 10;
/** Most named parameters of a nonlinear plant (each is a name the expressions may use). */
export const MAX_NONLINEAR_PARAMETERS = 64;

/**
 * A nonlinear plant typed as expressions (compiled by compileSystem, never evaluated as JavaScript):
 *
 *   dx_i/dt = derivatives[i](x, parameters, u),   y = output(x, parameters, u).
 *
 * `initial` is the state at t = 0 and `operatingInput` (default 0) the plant input held before
 * t = 0: together the operating point. The output there, y0 = output(initial, u_op), is where a
 * setpoint step starts from. If `initial` is not an equilibrium at `operatingInput`, the loop
 * simply starts from it (allowed; the response then includes that drift).
 */
export interface NonlinearPlant {
  kind: "nonlinear";
  states: string[];
  parameters: Record<string, number>;
  derivatives: string[];
  output: string;
  initial: number[];
  operatingInput?: number;
  actuator?: ActuatorLimits;
}

/** Runtime check of a NonlinearPlant's shape; the expressions themselves are checked by compileSystem. */
export const nonlinearSchema = z
  .object({
    kind: z.literal("nonlinear"),
    states: z.array(z.string().min(1, "a state needs a name")).min(1, "declare at least one state").max(MAX_NONLINEAR_STATES, `at most ${MAX_NONLINEAR_STATES} states`),
    parameters: z
      .record(z.string(), z.number({ error: "every parameter must be a finite number" }).finite("every parameter must be a finite number"))
      .refine((named) => Object.keys(named).length <= MAX_NONLINEAR_PARAMETERS, `at most ${MAX_NONLINEAR_PARAMETERS} parameters`)
      .default({}),
    derivatives: z.array(z.string().min(1, "write an expression")).max(MAX_NONLINEAR_STATES, `at most ${MAX_NONLINEAR_STATES} derivatives, one per state`),
    output: z.string().min(1, "write the output expression"),
    initial: z
      .array(z.number({ error: "every initial value must be a finite number" }).finite("every initial value must be a finite number"))
      .max(MAX_NONLINEAR_STATES, `at most ${MAX_NONLINEAR_STATES} initial values, one per state`),
    operatingInput: z.number().finite("operatingInput must be finite").optional(),
    actuator: actuatorLimitsSchema.optional(),
  })
  .superRefine((p, ctx) => {
    if (p.derivatives.length !== p.states.length) {
      ctx.addIssue({ code: "custom", path: ["derivatives"], message: `give one derivative per state (${p.states.length}), got ${p.derivatives.length}` });
    }
    if (p.initial.length !== p.states.length) {
      ctx.addIssue({ code: "custom", path: ["initial"], message: `give one initial value per state (${p.states.length}), got ${p.initial.length}` });
    }
  });
