import { z } from "zod";
import { actuatorLimitsSchema, type ActuatorLimits } from "./actuator-limits.js";

/** Highest polynomial order a transfer-function plant may have (denominator degree). */
export const MAX_PLANT_ORDER = 10;

/**
 * A transfer-function plant `G(s) = num(s)/den(s) · e^(−θ s)`.
 *
 * Coefficients are in descending powers of s: `[1, 3, 2]` is `s² + 3s + 2`.
 * `delay` is the dead time θ in seconds (≥ 0).
 */
export interface TransferFunctionPlant {
  kind: "transfer-function";
  num: number[];
  den: number[];
  delay: number;
  /** Optional actuator saturation and rate limit. */
  actuator?: ActuatorLimits;
}

const coefficients = z
  .array(z.number({ error: "every coefficient must be a finite number" }).finite("every coefficient must be a finite number"))
  .min(1, "give at least one coefficient")
  .max(MAX_PLANT_ORDER + 1, `order is limited to ${MAX_PLANT_ORDER} (at most ${MAX_PLANT_ORDER + 1} coefficients)`);

/** Degree of a coefficient list once leading zeros are dropped (−1 for the zero polynomial). */
function degree(coeffs: readonly number[]): number {
  const first = coeffs.findIndex((c) => c !== 0);
  return first < 0 ? -1 : coeffs.length - 1 - first;
}

/** Runtime check and type of a transfer-function plant, shared by server and web. */
export const transferFunctionSchema = z
  .object({
    kind: z.literal("transfer-function"),
    num: coefficients,
    den: coefficients,
    delay: z
      .number({ error: "dead time must be a number of seconds" })
      .finite("dead time must be finite")
      .min(0, "dead time must be ≥ 0 s")
      .max(1e6, "dead time must be at most 1e6 s")
      .default(0),
    actuator: actuatorLimitsSchema.optional(),
  })
  .superRefine((tf, ctx) => {
    if (tf.den[0] === 0) {
      ctx.addIssue({ code: "custom", path: ["den"], message: "the leading denominator coefficient must be non-zero" });
      return;
    }
    if (degree(tf.num) < 0) {
      ctx.addIssue({ code: "custom", path: ["num"], message: "the numerator must not be all zeros" });
    }
    if (degree(tf.num) > degree(tf.den)) {
      ctx.addIssue({
        code: "custom",
        path: ["num"],
        message: `the plant must be proper: numerator degree ${degree(tf.num)} exceeds denominator degree ${degree(tf.den)}`,
      });
    }
  });
