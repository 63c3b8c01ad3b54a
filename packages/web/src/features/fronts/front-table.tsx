import type { CandidateDto, CriterionId } from "@loopyard/core";
import { NumberCell } from "../../components/number-cell.js";
import { ScoreCell } from "../../components/score-cell.js";
import { criterionShortLabel } from "./criterion-label.js";

/** The front as a table: one row per non-dominated candidate (sorted by x), its parameters and every score. */
export function FrontTable({
  rows,
  parameters,
  criteria,
  x,
  y,
  selected,
  onSelect,
}: {
  rows: readonly CandidateDto[];
  parameters: readonly string[];
  criteria: readonly CriterionId[];
  x: CriterionId;
  y: CriterionId;
  selected: number | null;
  onSelect: (index: number) => void;
}) {
  const axisClass = (c: CriterionId) => (c === x || c === y ? "bg-moss-wash/60" : "");
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="front-table">
        <thead>
          <tr className="border-b border-line text-xs tracking-wide text-ink-soft">
            <th className="px-3 py-1.5 text-right font-medium">#</th>
            {parameters.map((p) => (
              <th key={p} className="px-3 py-1.5 text-right font-mono font-medium">
                {p}
              </th>
            ))}
            {criteria.map((c) => (
              <th key={c} className={`px-3 py-1.5 text-right font-medium ${axisClass(c)}`}>
                {criterionShortLabel(c)}
                {c === x ? " (x)" : c === y ? " (y)" : ""}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {rows.map((row) => {
            const isSelected = row.index === selected;
            return (
              <tr
                key={row.index}
                data-testid="front-row"
                data-index={row.index}
                aria-selected={isSelected}
                tabIndex={0}
                onClick={() => onSelect(row.index)}
                onKeyDown={(e) => {
                  if (e.key === "Enter" || e.key === " ") {
                    e.preventDefault();
                    onSelect(row.index);
                  }
                }}
                className={`cursor-pointer ${isSelected ? "bg-moss-wash" : "hover:bg-paper"}`}
              >
                <td className={`px-3 py-1.5 text-right font-mono text-[13px] tabular ${isSelected ? "text-moss" : "text-ink-soft"}`}>{row.index}</td>
                {row.params.map((v, i) => (
                  <NumberCell key={parameters[i] ?? i} value={v} />
                ))}
                {criteria.map((c, i) => (
                  <ScoreCell key={c} value={row.scores?.[i] ?? null} className={axisClass(c)} />
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
