import { z } from "zod";
import { actuatorLimitsSchema, type ActuatorLimits } from "./actuator-limits.js";
import { MAX_PLANT_ORDER } from "./transfer-function.js";

/**
 * A linear state-space plant, single input single output:
 *
 *   x' = A x + B u,   y = C x + D u,
 *
 * A: n×n, B: n×1, C: 1×n, D: 1×1 (rows of numbers), 1 ≤ n ≤ MAX_PLANT_ORDER. The state x starts at 0.
 */
export interface StateSpacePlant {
  kind: "state-space";
  A: number[][];
  B: number[][];
  C: number[][];
  D: number[][];
  actuator?: ActuatorLimits;
}

/** A matrix row: at most MAX_PLANT_ORDER entries, so that no dimension a user writes exceeds the order limit. */
const row = z
  .array(z.number({ error: "every entry must be a finite number" }).finite("every entry must be a finite number"))
  .max(MAX_PLANT_ORDER, `a row has at most ${MAX_PLANT_ORDER} entries (order is limited to ${MAX_PLANT_ORDER})`);

/** Runtime check of a StateSpacePlant with dimension messages naming the matrix. */
export const stateSpaceSchema = z
  .object({
    kind: z.literal("state-space"),
    A: z.array(row).min(1, "A must have at least one row").max(MAX_PLANT_ORDER, `order is limited to ${MAX_PLANT_ORDER}`),
    B: z.array(row).max(MAX_PLANT_ORDER, `B has at most ${MAX_PLANT_ORDER} rows`),
    C: z.array(row).max(MAX_PLANT_ORDER, `C has at most ${MAX_PLANT_ORDER} rows`),
    D: z.array(row).max(MAX_PLANT_ORDER, `D has at most ${MAX_PLANT_ORDER} rows`).default([[0]]),
    actuator: actuatorLimitsSchema.optional(),
  })
  .superRefine((p, ctx) => {
    const n = p.A.length;
    p.A.forEach((r, i) => {
      if (r.length !== n) ctx.addIssue({ code: "custom", path: ["A", i], message: `A must be square: row ${i} has ${r.length} entries, expected ${n}` });
    });
    if (p.B.length !== n || p.B.some((r) => r.length !== 1)) {
      ctx.addIssue({ code: "custom", path: ["B"], message: `B must be ${n}×1 (one input)` });
    }
    if (p.C.length !== 1 || p.C[0].length !== n) ctx.addIssue({ code: "custom", path: ["C"], message: `C must be 1×${n} (one output)` });
    if (p.D.length !== 1 || p.D[0].length !== 1) ctx.addIssue({ code: "custom", path: ["D"], message: "D must be 1×1" });
  });
