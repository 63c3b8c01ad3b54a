import { z } from "zod";
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
const time = (name: string) => gain(name).min(0, `${name} must be ≥ 0 s`);

const common = {
  sampleTime: gain("sampleTime").gt(0, "sampleTime must be > 0 s").optional(),
  antiWindup: z
    .discriminatedUnion("kind", [
      z.object({ kind: z.literal("none") }),
      z.object({ kind: z.literal("back-calculation"), tt: gain("tt").gt(0, "tt must be > 0 s").optional() }),
      z.object({ kind: z.literal("conditional") }),
    ])
    .optional(),
};

const derivativeNeedsFilter = (c: { kd: number; tf: number }) => c.kd === 0 || c.tf > 0;
const filterIssue = { message: "tf must be > 0 s when kd ≠ 0: the derivative needs its filter", path: ["tf"] };

/** Runtime check of any controller. */
export const controllerSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("p"), kp: gain("kp"), ...common }),
  z.object({ kind: z.literal("pi"), kp: gain("kp"), ki: gain("ki"), ...common }),
  z.object({ kind: z.literal("pid"), kp: gain("kp"), ki: gain("ki"), kd: gain("kd"), tf: time("tf"), ...common }).refine(derivativeNeedsFilter, filterIssue),
  z
    .object({ kind: z.literal("pid2dof"), kp: gain("kp"), ki: gain("ki"), kd: gain("kd"), tf: time("tf"), b: gain("b"), c: gain("c"), ...common })
    .refine(derivativeNeedsFilter, filterIssue),
  z
    .object({ kind: z.literal("lead-lag"), k: gain("k"), tLead: time("tLead"), tLag: time("tLag"), ...common })
    .refine((c) => c.tLead === 0 || c.tLag > 0, { message: "tLag must be > 0 s when tLead > 0 (a proper controller)", path: ["tLag"] }),
  z.object({ kind: z.literal("state-feedback"), k: z.array(gain("k")).min(1, "give one gain per plant state").max(10, "at most 10 gains"), n: gain("n"), ...common }),
]);
