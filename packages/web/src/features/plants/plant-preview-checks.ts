import { stateSpaceSchema, transferFunctionSchema } from "@loopyard/core";

/**
 * What the live preview says about typed coefficients, from the same schema the server checks
 * (transferFunctionSchema): every problem, e.g. a zero leading denominator coefficient or an
 * all-zero denominator, so that the preview never draws 1/0 for a plant the form will refuse.
 */
export function transferFunctionProblems(num: readonly number[], den: readonly number[], delay: number): string[] {
  const parsed = transferFunctionSchema.safeParse({ kind: "transfer-function", num, den, delay });
  if (parsed.success) return [];
  return parsed.error.issues.map((issue) => `${issue.path.length > 0 ? `${issue.path[0] === "num" ? "numerator" : issue.path[0] === "den" ? "denominator" : String(issue.path[0])}: ` : ""}${issue.message}`);
}

/**
 * Every dimension problem of typed matrices at once (A square, B n×1, C 1×n, D 1×1), from the
 * schema the server checks (stateSpaceSchema), for the live preview.
 */
export function stateSpaceProblems(A: number[][], B: number[][], C: number[][], D: number[][]): string[] {
  const parsed = stateSpaceSchema.safeParse({ kind: "state-space", A, B, C, D });
  if (parsed.success) return [];
  const seen = new Set<string>();
  return parsed.error.issues.map((issue) => issue.message).filter((message) => (seen.has(message) ? false : (seen.add(message), true)));
}
