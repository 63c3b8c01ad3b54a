import type { DecisionRecord } from "@loopyard/core";
import { formatNumber } from "../../components/format-number.js";
import { criterionShortLabel } from "../fronts/criterion-label.js";
import { aggregateName } from "../fronts/variant-scores-table.js";
import { scoreText } from "./decision-text.js";

/** The design's score on every criterion (columns) on every variant (rows), then the family's aggregate. */
export function DecisionScoresTable({ record }: { record: DecisionRecord }) {
  return (
    <div className="overflow-x-auto" data-testid="decision-scores">
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th className="px-3 py-1.5 text-left font-medium">Variant</th>
            {record.criteria.map((c) => (
              <th key={c} className="whitespace-nowrap px-3 py-1.5 text-right font-medium">
                {criterionShortLabel(c)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {record.scores.variants.map((v) => (
            <tr key={v.label} data-testid="decision-score-row">
              <td className="whitespace-nowrap px-3 py-1.5">
                {v.label}
                {v.status !== "stable" ? <span className="ml-2 text-xs text-rust">{v.status}</span> : null}
              </td>
              {record.criteria.map((c, k) => (
                <td key={c} className="px-3 py-1.5 text-right font-mono text-[13px] tabular">
                  {scoreText(v.scores?.[k] ?? null, formatNumber)}
                </td>
              ))}
            </tr>
          ))}
          {record.scores.aggregate && record.scores.variants.length > 1 ? (
            <tr className="bg-paper/70" data-testid="decision-aggregate-row">
              <td className="whitespace-nowrap px-3 py-1.5 text-xs font-medium text-ink-soft">{aggregateName(record.evaluation.aggregate)}</td>
              {record.criteria.map((c, k) => (
                <td key={c} className="px-3 py-1.5 text-right font-mono text-[13px] font-medium tabular">
                  {scoreText(record.scores.aggregate?.[k] ?? null, formatNumber)}
                </td>
              ))}
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
