import type { CandidateDto, CriterionId, SweepAggregate, SweepVariantDto } from "@loopyard/core";
import { ScoreCell } from "../../components/score-cell.js";
import { formatNumber } from "../../components/format-number.js";
import { criterionShortLabel } from "./criterion-label.js";

/** The aggregate's name in a table row, e.g. "worst variant" or "90th percentile". */
export function aggregateName(aggregate: SweepAggregate | undefined): string {
  if (!aggregate || aggregate.kind === "worst") return "worst variant";
  if (aggregate.kind === "mean") return "mean over variants";
  return `${formatNumber(aggregate.p)}th percentile`;
}

/**
 * One candidate's scores on every variant of the family (rows: variant labels; columns: criteria),
 * and under them the aggregate the front is drawn from. A variant where the candidate is not stable
 * shows "not stable" across its row. With `onShow`, clicking a variant's row draws the response on
 * it; the row of the variant `shown` is marked.
 */
export function VariantScoresTable({
  candidate,
  family,
  criteria,
  aggregate,
  shown,
  onShow,
}: {
  candidate: CandidateDto;
  family: readonly SweepVariantDto[];
  criteria: readonly CriterionId[];
  aggregate: SweepAggregate | undefined;
  /** The variant whose response is drawn. */
  shown?: number;
  onShow?: (variant: number) => void;
}) {
  const perVariant = candidate.variantScores ?? [];
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="variant-scores">
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th className="px-3 py-1.5 text-left font-medium">variant</th>
            {criteria.map((c) => (
              <th key={c} className="px-3 py-1.5 text-right font-medium">
                {criterionShortLabel(c)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {family.map((variant, v) => {
            const scores = perVariant[v];
            const isShown = v === shown;
            return (
              <tr
                key={`${variant.revisionId}-${v}`}
                data-testid="variant-row"
                aria-selected={isShown}
                tabIndex={onShow ? 0 : undefined}
                onClick={onShow ? () => onShow(v) : undefined}
                onKeyDown={
                  onShow
                    ? (e) => {
                        if (e.key === "Enter" || e.key === " ") {
                          e.preventDefault();
                          onShow(v);
                        }
                      }
                    : undefined
                }
                className={onShow ? `cursor-pointer ${isShown ? "bg-moss-wash/60" : "hover:bg-paper"}` : ""}
              >
                <td
                  // "drawn" as generated content, so that the cell's text stays the variant's label.
                  className={`px-3 py-1.5 ${isShown ? "after:ml-1 after:text-xs after:text-moss after:content-['(drawn)']" : ""}`}
                  title={`${variant.plantName} rev ${variant.revisionNumber}${onShow ? " — click to draw the response on this variant" : ""}`}
                >
                  {variant.label}
                </td>
                {scores
                  ? criteria.map((c, i) => <ScoreCell key={c} value={scores[i] ?? null} />)
                  : (
                    <td colSpan={criteria.length} className="px-3 py-1.5 text-right text-xs text-rust">
                      {perVariant.length === 0 ? "not stored" : "not stable on this variant"}
                    </td>
                  )}
              </tr>
            );
          })}
          <tr className="border-t-2 border-line bg-moss-wash/50 font-medium" data-testid="aggregate-row">
            <td className="px-3 py-1.5">{aggregateName(aggregate)}</td>
            {criteria.map((c, i) => (
              <ScoreCell key={c} value={candidate.scores?.[i] ?? null} />
            ))}
          </tr>
        </tbody>
      </table>
    </div>
  );
}
