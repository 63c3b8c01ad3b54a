import { z } from "zod";
import { performanceWeight } from "./performance-weight.js";
import { assertValidWeight, type SensitivityWeight } from "./sensitivity-weight.js";

/**
 * Most coefficients of a weight's numerator or denominator: order 10, as the plants (MAX_PLANT_ORDER).
 * Every candidate's ‖W·S‖∞ evaluates both polynomials at every frequency, so the order is a work
 * factor the user controls; it is checked before the coefficients are read.
 */
export const MAX_WEIGHT_COEFFICIENTS = 11;

const coefficients = (name: "num" | "den") =>
  z
    .array(finite(name))
    .min(1, "give at least one coefficient")
    .max(MAX_WEIGHT_COEFFICIENTS, `at most ${MAX_WEIGHT_COEFFICIENTS} coefficients (order ${MAX_WEIGHT_COEFFICIENTS - 1})`);

const finite = (name: string) => z.number({ error: `${name} must be a number` }).refine(Number.isFinite, `${name} must be finite`);

/**
 * A sensitivity weight as JSON: either the rational function itself,
 * `{ "num": [...], "den": [...] }` (descending powers of s, proper), or the first-order
 * performance preset `{ "preset": "performance", "M": 2, "omegaB": 1, "A": 1e-4 }`
 * (performanceWeight: W = (s/M + ωB)/(s + ωB·A)). Parses to a SensitivityWeight { num, den };
 * a bad weight gets one issue naming its field.
 */
export const sensitivityWeightSchema = z
  .union([
    z.strictObject({ num: coefficients("num"), den: coefficients("den") }),
    z.strictObject({
      preset: z.literal("performance", { error: 'preset must be "performance"' }),
      M: finite("M").gt(0, "M must be > 0"),
      omegaB: finite("omegaB").gt(0, "omegaB must be > 0 rad/s"),
      A: finite("A").min(0, "A must be ≥ 0"),
    }),
  ])
  .transform((w, ctx): SensitivityWeight => {
    const weight = "preset" in w ? performanceWeight(w) : { num: w.num, den: w.den };
    try {
      return assertValidWeight(weight);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      const field = /^weight\.(num|den)/.exec(error.message)?.[1];
      ctx.addIssue({ code: "custom", path: field ? [field] : [], message: error.message.replace(/^weight\.(num|den): /, "") });
      return z.NEVER;
    }
  });
