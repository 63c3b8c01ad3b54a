import { z } from "zod";

const finite = z.number({ error: "every entry must be a finite number" }).finite("every entry must be a finite number");
const matrix = z.array(z.array(finite).min(1, "every row needs at least one entry")).min(1, "give at least one row");

/**
 * The spec of `loopyard bound`: the LQR problem x' = Ax + Bu, J = ∫(xᵀQx + uᵀRu)dt from x(0) = x0.
 * Keys exactly: A (n×n), B (n×m), Q (n×n, symmetric ⪰ 0), R (m×m, symmetric ≻ 0), x0 (n entries).
 */
export const boundSpecSchema = z
  .strictObject({ A: matrix, B: matrix, Q: matrix, R: matrix, x0: z.array(finite).min(1, "give one entry per state") })
  .superRefine((s, ctx) => {
    const n = s.A.length;
    const rect = (m: number[][], key: string, rows: number, cols: number | undefined, what: string): boolean => {
      const width = cols ?? m[0].length;
      if (m.length !== rows || m.some((row) => row.length !== width)) {
        ctx.addIssue({ code: "custom", path: [key], message: `must be ${what}` });
        return false;
      }
      return true;
    };
    if (!rect(s.A, "A", n, n, `square (n×n, here ${n}×${n})`)) return;
    if (!rect(s.B, "B", n, undefined, `n×m with n = ${n} rows of equal length`)) return;
    const m = s.B[0].length;
    rect(s.Q, "Q", n, n, `${n}×${n} like A`);
    rect(s.R, "R", m, m, `${m}×${m} (m = ${m}, the number of columns of B)`);
    if (s.x0.length !== n) ctx.addIssue({ code: "custom", path: ["x0"], message: `must have ${n} entries, one per state` });
  });

export type BoundSpec = z.output<typeof boundSpecSchema>;
