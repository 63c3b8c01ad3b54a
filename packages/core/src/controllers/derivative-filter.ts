import { z } from "zod";

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);

/**
 * Derivative filter of a swept pid or pid2dof: either a fixed time constant `tf` [s],
 * or `tf = kd / (n · kp)` (the filter is n times faster than the derivative time Td = kd/kp).
 */
export const derivativeFilterSchema = z.discriminatedUnion("mode", [
  z.object({ mode: z.literal("fixed"), tf: finite("tf").min(0, "tf must be ≥ 0 s") }),
  z.object({ mode: z.literal("ratio"), n: finite("n").gt(0, "n must be > 0") }),
]);

export type DerivativeFilter = z.infer<typeof derivativeFilterSchema>;

/** Derivative filter of pid and pid2dof sweeps that give neither a filter nor tf: tf = kd/(10·kp). */
export const DEFAULT_DERIVATIVE_FILTER = { mode: "ratio", n: 10 } as const;
