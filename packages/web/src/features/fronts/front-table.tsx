import { useState } from "react";
import type { CandidateDto, CriterionId } from "@loopyard/core";
import { Button } from "../../components/button.js";
import { NumberCell } from "../../components/number-cell.js";
import { ScoreCell } from "../../components/score-cell.js";
import { distinguishingDigits } from "./column-digits.js";
import { criterionShortLabel } from "./criterion-label.js";

/** Rows shown at first on a long front; the rest behind "Show all". */
export const FRONT_ROWS_SHOWN = 60;

/**
 * At most `limit` rows spread evenly along the front (first and last kept), plus the selected one,
 * in front order; every row when the front is short.
 */
export function thinRows<T extends { index: number }>(rows: readonly T[], limit: number, selected: number | null): T[] {
  if (rows.length <= limit) return [...rows];
  const keep = new Set<number>();
  for (let k = 0; k < limit; k++) keep.add(Math.round((k * (rows.length - 1)) / (limit - 1)));
  return rows.filter((row, i) => keep.has(i) || row.index === selected);
}

/**
 * The front as a table: one row per non-dominated candidate (sorted by x), its parameters and every
 * score, each column with as many significant digits as it takes to tell neighbouring rows apart
 * (column-digits.ts; the full value on hover).
 */
export function FrontTable({
  rows,
  parameters,
  criteria,
  x,
  y,
  selected,
  onSelect,
  onPropose,
}: {
  rows: readonly CandidateDto[];
  parameters: readonly string[];
  criteria: readonly CriterionId[];
  x: CriterionId;
  y: CriterionId;
  selected: number | null;
  onSelect: (index: number) => void;
  /** Proposes the row's candidate as the family's decision; no column without it (a viewer). */
  onPropose?: (index: number) => void;
}) {
  const [showAll, setShowAll] = useState(false);
  const shown = showAll ? rows : thinRows(rows, FRONT_ROWS_SHOWN, selected);
  const axisClass = (c: CriterionId) => (c === x || c === y ? "bg-moss-wash/60" : "");
  const paramDigits = parameters.map((_, i) => distinguishingDigits(shown.map((row) => row.params[i])));
  const scoreDigits = criteria.map((_, i) => distinguishingDigits(shown.map((row) => row.scores?.[i])));
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
            {onPropose ? <th className="px-3 py-1.5" aria-label="Propose" /> : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {shown.map((row) => {
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
                  <NumberCell key={parameters[i] ?? i} value={v} digits={paramDigits[i]} />
                ))}
                {criteria.map((c, i) => (
                  <ScoreCell key={c} value={row.scores?.[i] ?? null} className={axisClass(c)} digits={scoreDigits[i]} />
                ))}
                {onPropose ? (
                  <td className="px-2 py-1 text-right">
                    <Button
                      className="px-2 py-0.5 text-xs"
                      onClick={(event) => {
                        event.stopPropagation();
                        onPropose(row.index);
                      }}
                      onKeyDown={(event) => event.stopPropagation()}
                      data-testid="propose-row"
                      aria-label={`Propose candidate #${row.index}`}
                    >
                      Propose
                    </Button>
                  </td>
                ) : null}
              </tr>
            );
          })}
        </tbody>
      </table>
      {shown.length < rows.length || showAll ? (
        <div className="mt-2 flex items-center gap-3 text-xs text-ink-soft" data-testid="front-rows-note">
          {showAll
            ? `All ${rows.length} candidates of the front.`
            : `${shown.length} of the ${rows.length} candidates of the front, spread evenly along it.`}
          {rows.length > FRONT_ROWS_SHOWN ? (
            <Button tone="plain" className="px-1 py-0 text-xs" onClick={() => setShowAll(!showAll)}>
              {showAll ? "Show fewer" : "Show all"}
            </Button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
