import type { Complex } from "../linear-algebra/complex.js";
import { solveCare } from "../optimal/solve-care.js";
import { boundSpecSchema } from "./bound-spec.js";
import { CliInputError } from "./cli-error.js";
import { toCliJson } from "./json-output.js";
import { readSpec } from "./read-spec.js";
import { asInputError, validateSpec } from "./validate-spec.js";

/** What `loopyard bound` prints: the LQR gain, the CARE solution, the closed-loop poles and x0ᵀPx0. */
export interface BoundOutput {
  K: number[][];
  P: number[][];
  poles: Complex[];
  cost: number;
}

/**
 * `loopyard bound FILE|-`: reads `{ A, B, Q, R, x0 }`, solves the continuous algebraic Riccati
 * equation (solveCare) and returns the JSON text `{ K, P, poles, cost }` with cost = x0ᵀ P x0, the
 * least ∫(xᵀQx + uᵀRu)dt from x0. Throws a CliInputError (exit 2, one sentence naming the field)
 * for a bad file, bad JSON, a bad spec, or a problem without a stabilising solution.
 */
export async function boundCommand(source: string): Promise<string> {
  const spec = validateSpec(boundSpecSchema, await readSpec(source), "bound spec");
  let result: ReturnType<typeof solveCare>;
  try {
    result = solveCare(spec.A, spec.B, spec.Q, spec.R);
  } catch (error) {
    asInputError(error);
  }
  if (!result.ok) throw new CliInputError(`A, B, Q: ${result.reason}.`, "A");
  let cost = 0;
  const n = spec.x0.length;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) cost += spec.x0[i] * result.P[i][j] * spec.x0[j];
  const output: BoundOutput = { K: result.K, P: result.P, poles: result.poles.map((p) => ({ re: p.re, im: p.im })), cost };
  return toCliJson(output);
}
