import type { BatchResult } from "../batch/evaluate-batch.js";
import { batchStatusName } from "../batch/batch-status.js";
import { controllerFromVector, type Structure } from "../batch/structure.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { cliNumber } from "./json-output.js";

/** Output formats of `loopyard sweep`. */
export const SWEEP_FORMATS = ["csv", "jsonl"] as const;
export type SweepFormat = (typeof SWEEP_FORMATS)[number];

/** Everything needed to write a sweep's rows. */
export interface SweepTable {
  structure: Structure;
  candidates: Float64Array;
  variants: readonly string[];
  criteria: readonly CriterionId[];
  result: BatchResult;
}

/**
 * The lines of a sweep's output, one per candidate and variant (long format), candidate-major:
 *
 * - csv: header `index,variant,<tunable…>[,tf],status,<criteria…>`, then one row each; numbers in
 *   shortest round-trip form, Infinity as `inf`, NaN (not scored, or not applicable) as `nan`;
 *   `tf` is listed when the structure derives it from a filter.
 * - jsonl: `{"index","variant","params":{…},"status","criteria":{…}|null}` per line, Infinity as
 *   "inf", NaN as null; criteria null when the candidate was not scored.
 *
 * Every line ends with "\n".
 */
export function* sweepLines(table: SweepTable, format: SweepFormat): Generator<string> {
  const { structure, candidates, variants, criteria, result } = table;
  const d = structure.tunable.length;
  const n = candidates.length / d;
  const nf = variants.length;
  const nc = criteria.length;
  const withTf = structure.filter !== undefined;
  const paramNames = [...structure.tunable, ...(withTf ? ["tf"] : [])];
  if (format === "csv") yield `${["index", "variant", ...paramNames, "status", ...criteria].map(csvField).join(",")}\n`;
  const params = new Array<number>(paramNames.length);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) params[j] = candidates[i * d + j];
    if (withTf) params[d] = (controllerFromVector(structure, candidates, i * d) as { tf: number }).tf;
    for (let f = 0; f < nf; f++) {
      const row = i * nf + f;
      const status = batchStatusName(result.status[row]);
      const scored = status === "stable";
      if (format === "csv") {
        const cells = [String(i), csvField(variants[f]), ...params.map(csvNumber), status];
        for (let c = 0; c < nc; c++) cells.push(csvNumber(result.scores[row * nc + c]));
        yield `${cells.join(",")}\n`;
      } else {
        const record = {
          index: i,
          variant: variants[f],
          params: Object.fromEntries(paramNames.map((name, j) => [name, cliNumber(params[j])])),
          status,
          criteria: scored ? Object.fromEntries(criteria.map((id, c) => [id, cliNumber(result.scores[row * nc + c])])) : null,
        };
        yield `${JSON.stringify(record)}\n`;
      }
    }
  }
}

function csvNumber(v: number): string {
  if (Number.isFinite(v)) return String(v);
  if (v === Infinity) return "inf";
  if (v === -Infinity) return "-inf";
  return "nan";
}

/** A CSV field, quoted (RFC 4180) when it holds a comma, quote or line break. */
function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
