import { useMemo, useState } from "react";
import { createColumnHelper, createSortedRowModel, rowSortingFeature, tableFeatures, useTable, type ColumnDef } from "@tanstack/react-table";
import type { ComparisonResultJson } from "./comparison-result-types.js";
import { numberOf } from "./comparison-result-types.js";
import { RegretCell } from "./regret-cell.js";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel() });

/** One row of the cross-score: a contender's pick. */
interface PickRow {
  index: number;
  contender: string;
  label: string;
  found: boolean;
  reason: string | null;
  atBound: string[];
  adoptedFrom: string | null;
  values: number[];
  regrets: number[];
}

const helper = createColumnHelper<typeof features, PickRow>();

/**
 * The cross-score: one row per pick, one column per contender and judge, each cell the pick's
 * aggregate over the family and its regret against the column's best pick (on the regret scale of
 * regret-scale.ts, the number always printed). Sortable by any column (by regret: the column's best
 * first); the best of each column carries the "best" mark; a contender's own column is outlined.
 */
export function CrossScoreTable({
  result,
  onPropose,
}: {
  result: ComparisonResultJson;
  /** Proposes a found pick (its contender key and label) as the family's decision; no button without it (a viewer). */
  onPropose?: (contender: string, label: string) => void;
}) {
  const [sorting, setSorting] = useState<{ id: string; desc: boolean }[]>([]);
  const columns = result.columns;
  const rows = useMemo<PickRow[]>(
    () =>
      result.picks.map((pick, p) => ({
        index: p,
        contender: pick.contender,
        label: columns[p]?.label ?? pick.contender,
        found: pick.found,
        reason: pick.reason ?? null,
        atBound: pick.atBound.map((b) => `${b.parameter} at its ${b.bound}`),
        adoptedFrom: pick.adoptedFrom ?? null,
        values: (result.crossScore.values[p] ?? []).map(numberOf),
        regrets: (result.crossScore.regrets[p] ?? []).map(numberOf),
      })),
    [result, columns],
  );
  const tableColumns = useMemo<ColumnDef<typeof features, PickRow, any>[]>(
    () => [
      helper.accessor((row) => row.label, {
        id: "pick",
        header: () => "Pick of",
        cell: (info) => <PickName row={info.row.original} onPropose={onPropose} />,
      }),
      ...columns.map((column, k) =>
        helper.accessor((row) => (Number.isNaN(row.regrets[k] as number) ? undefined : (row.regrets[k] as number)), {
          id: `c${k}`,
          header: () => (
            <span
              title={`${column.role === "contender" ? "contender: optimised by its own pick" : "judge: scored, never optimised"}; ${column.better} is better${column.unit ? `; unit ${column.unit}` : ""}`}
            >
              <span className="block normal-case">{column.label}</span>
              <span className="block whitespace-nowrap font-mono text-[10px] normal-case text-ink-faint">
                {column.role === "contender" ? "contender" : "judge"} {column.better === "larger" ? "↑" : "↓"}
              </span>
            </span>
          ),
          sortUndefined: "last",
          sortDescFirst: false,
          cell: (info) => {
            const row = info.row.original;
            return <RegretCell value={row.values[k] as number} regret={row.regrets[k] as number} own={row.index === k} best={result.crossScore.best[k] === row.index} />;
          },
        }),
      ),
    ],
    [columns, result, onPropose],
  );
  const table = useTable({ features, columns: tableColumns, data: rows, state: { sorting }, onSortingChange: setSorting });

  return (
    <div className="overflow-x-auto" data-testid="cross-score">
      <table className="w-full border-separate border-spacing-0 text-sm">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th key={header.id} className="border-b border-line px-1 py-1.5 text-left align-bottom text-xs font-medium text-ink-soft" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                    <button type="button" onClick={header.column.getToggleSortingHandler()} className="flex items-end gap-1 text-left hover:text-ink" data-testid={`sort-${header.id}`}>
                      <table.FlexRender header={header} />
                      <span aria-hidden className="font-mono text-[11px]">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-testid="cross-score-row">
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="border-b border-line-soft p-0.5 align-middle">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function PickName({ row, onPropose }: { row: PickRow; onPropose: ((contender: string, label: string) => void) | undefined }) {
  return (
    <div className="w-32 px-1 py-1">
      <div className="font-medium">{row.label}</div>
      {!row.found ? <div className="text-[11px] text-rust">no pick: {row.reason}</div> : null}
      {row.atBound.length > 0 ? (
        <div className="text-[11px] text-amber" title="The box, not the criterion, chose this parameter: widen the box to see where the criterion would go.">
          on a bound: {row.atBound.join(", ")}
        </div>
      ) : null}
      {row.adoptedFrom ? <div className="text-[11px] text-ink-soft">same design as {row.adoptedFrom}'s pick (better on its own column)</div> : null}
      {onPropose && row.found ? (
        <button
          type="button"
          onClick={() => onPropose(row.contender, row.label)}
          className="mt-1 rounded border border-line bg-sheet px-1.5 py-px text-[11px] text-ink-soft hover:border-ink-faint hover:text-ink"
          data-testid="propose-pick"
        >
          Propose this pick
        </button>
      ) : null}
    </div>
  );
}

