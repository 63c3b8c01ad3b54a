import { z } from "zod";
import { MAX_STATE_FEEDBACK_GAINS } from "../limits.js";
import {
  CONTROLLER_PARAMETERS,
  REFERENCE_GAIN_PARAMETER,
  SAMPLE_TIME_PARAMETER,
  type ControllerParameter,
  type FixedParameterKind,
} from "./controller-parameters.js";
import type { PidController } from "./pid.js";

/** Anti-windup when the actuator saturates (only matters with actuator limits and integral action). */
export type AntiWindup = { kind: "none" } | { kind: "back-calculation"; tt?: number } | { kind: "conditional" };

/** Fields every controller kind may carry. */
export interface ControllerCommon {
  /** Sample time [s] of a sampled controller with zero-order hold; omitted: continuous. Must be ≥ dt. */
  sampleTime?: number;
  /** Default: back-calculation with tt = √(Ti·Td), or Ti when Td = 0 (see antiWindupTrackingTime). */
  antiWindup?: AntiWindup;
}

/** u = kp·e. */
export interface PController extends ControllerCommon {
  kind: "p";
  kp: number;
}

/** u = kp·e + ki·∫e dt. */
export interface PiController extends ControllerCommon {
  kind: "pi";
  kp: number;
  ki: number;
}

/** Parallel PID kp + ki/s + kd·s/(tf·s + 1) (PidController, plus the common fields). */
export type PidControllerSpec = PidController & ControllerCommon;

/**
 * Two-degree-of-freedom PID with setpoint weights b (on P) and c (on D):
 * u = kp(b·r − y) + ki∫(r − y)dt + kd·s/(tf·s + 1)·(c·r − y).
 */
export interface Pid2dofController extends ControllerCommon {
  kind: "pid2dof";
  kp: number;
  ki: number;
  kd: number;
  tf: number;
  b: number;
  c: number;
}

/** Lead–lag C(s) = k·(tLead·s + 1)/(tLag·s + 1); tLag > 0 unless tLead = 0. */
export interface LeadLagController extends ControllerCommon {
  kind: "lead-lag";
  k: number;
  tLead: number;
  tLag: number;
}

/**
 * State feedback u = −K x + N·r. x: the plant's states (state-space plants as given; transfer
 * functions in the controllable canonical realisation of transferFunctionToStateSpace; nonlinear
 * plants as deviations from `initial`, with r measured from y0).
 */
export interface StateFeedbackController extends ControllerCommon {
  kind: "state-feedback";
  k: number[];
  n: number;
}

/** Any controller structure, tagged on `kind`. */
export type Controller = PController | PiController | PidControllerSpec | Pid2dofController | LeadLagController | StateFeedbackController;

export type ControllerKind = Controller["kind"];

/** Controller kinds, in display order. */
export const CONTROLLER_KINDS = ["p", "pi", "pid", "pid2dof", "lead-lag", "state-feedback"] as const satisfies readonly ControllerKind[];

const gain = (name: string) => z.number({ error: `${name} must be a number` }).finite(`${name} must be finite`);

/** The zod check of one table parameter: finite, with its sign (CONTROLLER_PARAMETERS). */
function parameterNumber(p: ControllerParameter) {
  const unit = p.unit === "s" ? " s" : "";
  const base = gain(p.name);
  if (p.sign === "positive") return base.gt(0, `${p.name} must be > 0${unit}`);
  if (p.sign === "non-negative") return base.min(0, `${p.name} must be ≥ 0${unit}`);
  return base;
}

/** The fields of a kind's table as a zod shape. */
function tableShape<K extends FixedParameterKind>(kind: K) {
  return Object.fromEntries(CONTROLLER_PARAMETERS[kind].map((p) => [p.name, parameterNumber(p)])) as Record<string, z.ZodNumber>;
}

/** Anti-windup of any controller (see AntiWindup). */
export const antiWindupSchema = z
  .discriminatedUnion("kind", [
    z.object({ kind: z.literal("none") }),
    z.object({ kind: z.literal("back-calculation"), tt: gain("tt").gt(0, "tt must be > 0 s").optional() }),
    z.object({ kind: z.literal("conditional") }),
  ])
  .optional();

const common = {
  sampleTime: parameterNumber(SAMPLE_TIME_PARAMETER).optional(),
  antiWindup: antiWindupSchema,
};

/**
 * Cross-field rules of a controller, stated once: assertValidController and controllerSchema both
 * apply them. Each returns null when the controller obeys it, else the field and the sentence.
 */
export const CONTROLLER_RULES: readonly ((c: Record<string, unknown> & { kind: string }) => { field: string; message: string } | null)[] = [
  (c) =>
    (c.kind === "pid" || c.kind === "pid2dof") && c.kd !== 0 && !((c.tf as number) > 0)
      ? { field: "tf", message: "tf must be > 0 s when kd ≠ 0: the derivative needs its filter" }
      : null,
  (c) =>
    c.kind === "lead-lag" && (c.tLead as number) > 0 && !((c.tLag as number) > 0)
      ? { field: "tLag", message: "tLag must be > 0 s when tLead > 0 (a proper controller)" }
      : null,
];

function withRules<T extends z.ZodType>(schema: T) {
  return schema.superRefine((value, ctx) => {
    for (const rule of CONTROLLER_RULES) {
      const problem = rule(value as Record<string, unknown> & { kind: string });
      if (problem) ctx.addIssue({ code: "custom", path: [problem.field], message: problem.message });
    }
  });
}

/**
 * Runtime check of any controller, built from the parameter table (CONTROLLER_PARAMETERS) and the
 * cross-field rules (CONTROLLER_RULES).
 */
export const controllerSchema = z.discriminatedUnion("kind", [
  withRules(z.object({ kind: z.literal("p"), ...tableShape("p"), ...common })),
  withRules(z.object({ kind: z.literal("pi"), ...tableShape("pi"), ...common })),
  withRules(z.object({ kind: z.literal("pid"), ...tableShape("pid"), ...common })),
  withRules(z.object({ kind: z.literal("pid2dof"), ...tableShape("pid2dof"), ...common })),
  withRules(z.object({ kind: z.literal("lead-lag"), ...tableShape("lead-lag"), ...common })),
  withRules(
    z.object({
      kind: z.literal("state-feedback"),
      k: z
        .array(gain("k"))
        .min(1, "give one gain per plant state")
        .max(MAX_STATE_FEEDBACK_GAINS, `at most ${MAX_STATE_FEEDBACK_GAINS} gains`),
      n: parameterNumber(REFERENCE_GAIN_PARAMETER),
      ...common,
    }),
  ),
]);
