import { z } from "zod";
import { stepModelKindSchema, stepTestSettingsSchema, type StepTestSettings } from "../identification/step-test-settings.js";
import type { StepModelKind } from "../identification/step-model.js";
import { actuatorLimitsSchema, type ActuatorLimits } from "./actuator-limits.js";
import { transferFunctionSchema, type TransferFunctionPlant } from "./transfer-function.js";

/** Where an identified plant came from: the uploaded step test, how it was read and the fit. */
export interface IdentificationProvenance {
  /** The stored step test (its raw file stays in the database, so the plant can be refitted). */
  stepTestId: string;
  fileName: string;
  /** Columns, units, trim window and offset the fit used. */
  settings: StepTestSettings;
  /** The columns those choices resolved to (number from 1 and header name). */
  columns: { time: { index: number; name: string }; input: { index: number; name: string }; output: { index: number; name: string } };
  fit: {
    model: StepModelKind;
    /** Fitted parameters [s; y/u, or y/(u·s) for IPDT] with their 95 % intervals. */
    parameters: Record<string, number>;
    intervals: Record<string, [number, number]>;
    r2: number;
    sse: number;
    dof: number;
    /** Samples fitted, the step (time [s], size [u]) and the levels before it. */
    samples: number;
    stepTime: number;
    stepSize: number;
    u0: number;
    y0: number;
  };
}

/**
 * A plant identified from a step test: its dynamics are the fitted transfer function with dead
 * time, G(s) = num(s)/den(s)·e^(−delay·s) (FOPDT, SOPDT or IPDT), and the engine treats it exactly
 * as that transfer function; `identification` keeps the provenance so the plant can be refitted.
 */
export interface IdentifiedPlant {
  kind: "identified";
  num: number[];
  den: number[];
  delay: number;
  actuator?: ActuatorLimits;
  identification: IdentificationProvenance;
}

const finite = (what: string) => z.number({ error: `${what} must be a finite number` }).finite(`${what} must be a finite number`);
const column = z.object({ index: z.number().int().min(1), name: z.string().max(200) });

const provenanceSchema = z.object({
  stepTestId: z.uuid({ error: "stepTestId must name a stored step test" }),
  fileName: z.string().max(255),
  settings: stepTestSettingsSchema,
  columns: z.object({ time: column, input: column, output: column }),
  fit: z.object({
    model: stepModelKindSchema,
    parameters: z.record(z.string(), finite("every fitted parameter")),
    intervals: z.record(z.string(), z.tuple([z.number(), z.number()])),
    r2: z.number(),
    sse: z.number().min(0),
    dof: z.number().int().min(1),
    samples: z.number().int().min(1),
    stepTime: finite("stepTime"),
    stepSize: finite("stepSize"),
    u0: finite("u0"),
    y0: finite("y0"),
  }),
});

/** Runtime check of an identified plant: the transfer function's own checks plus the provenance's shape. */
export const identifiedSchema = z
  .object({
    kind: z.literal("identified"),
    num: z.array(z.number()),
    den: z.array(z.number()),
    delay: z.number(),
    actuator: actuatorLimitsSchema.optional(),
    identification: provenanceSchema,
  })
  .superRefine((p, ctx) => {
    const tf = transferFunctionSchema.safeParse({ kind: "transfer-function", num: p.num, den: p.den, delay: p.delay });
    if (!tf.success) for (const issue of tf.error.issues) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  });

/** The transfer function an identified plant stands for (its actuator limits kept). */
export function identifiedTransferFunction(plant: IdentifiedPlant): TransferFunctionPlant {
  const tf: TransferFunctionPlant = { kind: "transfer-function", num: plant.num, den: plant.den, delay: plant.delay };
  if (plant.actuator) tf.actuator = plant.actuator;
  return tf;
}
