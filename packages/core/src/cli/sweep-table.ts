import type { CriterionId } from "../criteria/criterion-id.js";
import type { SweepRow } from "../sweeps/evaluate-sweep-chunk.js";
import { cliNumber } from "./json-output.js";

/** Output formats of `loopyard sweep`. */
export const SWEEP_FORMATS = ["csv", "jsonl"] as const;
export type SweepFormat = (typeof SWEEP_FORMATS)[number];

/** Everything needed to write a sweep's rows: the plan's names and evaluateSweepChunk's rows. */
export interface SweepTable {
  /** plan.parameters: every controller parameter, tf included when a filter derives it. */
  parameters: readonly string[];
  variants: readonly string[];
  criteria: readonly CriterionId[];
  rows: readonly SweepRow[];
}

/**
 * The lines of a sweep's output, one per candidate and variant (long format), candidate-major:
 *
 * - csv: header `index,variant,<parameters…>,status,<criteria…>`, then one row each; numbers in
 *   shortest round-trip form, Infinity as `inf`, NaN (not scored, or not applicable) as `nan`.
 * - jsonl: `{"index","variant","params":{…},"status","criteria":{…}|null}` per line (plus
 *   "reason" for a rejected controller), Infinity as "inf", NaN as null; criteria null when the
 *   candidate was not scored on that variant.
 *
 * The status and scores are the variant's own (not the family's aggregate). Every line ends with "\n".
 */
export function* sweepLines(table: SweepTable, format: SweepFormat): Generator<string> {
  const { parameters, variants, criteria, rows } = table;
  const nf = variants.length;
  const nc = criteria.length;
  if (format === "csv") yield `${["index", "variant", ...parameters, "status", ...criteria].map(csvField).join(",")}\n`;
  for (const row of rows) {
    for (let f = 0; f < nf; f++) {
      const status = row.variantStatus[f] as string;
      const scored = status === "stable";
      const score = (c: number): number =>
        !scored ? Number.NaN : nf > 1 ? (row.variantScores?.[f * nc + c] ?? Number.NaN) : (row.scores?.[c] ?? Number.NaN);
      if (format === "csv") {
        const cells = [String(row.index), csvField(variants[f] as string), ...row.params.map(csvNumber), status];
        for (let c = 0; c < nc; c++) cells.push(csvNumber(score(c)));
        yield `${cells.join(",")}\n`;
      } else {
        const record: Record<string, unknown> = {
          index: row.index,
          variant: variants[f],
          params: Object.fromEntries(parameters.map((name, j) => [name, cliNumber(row.params[j] as number)])),
          status,
          criteria: scored ? Object.fromEntries(criteria.map((id, c) => [id, cliNumber(score(c))])) : null,
        };
        const reason = row.variantReasons?.[f];
        if (reason) record.reason = reason;
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
