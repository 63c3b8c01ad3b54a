import { useMemo, useState } from "react";
import { Link, useSearchParams } from "react-router";
import { createColumnHelper, createSortedRowModel, rowSortingFeature, tableFeatures, useTable, type ColumnDef } from "@tanstack/react-table";
import { DECISION_STATES, type DecisionListItemDto, type DecisionState } from "@loopyard/core";
import { useDecisions } from "../../api/use-decisions.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { inputClass } from "../../components/field.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { DecisionStateBadge } from "./decision-state-badge.js";
import { familyOptions, formatParameters } from "./decision-text.js";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel() });
const helper = createColumnHelper<typeof features, DecisionListItemDto>();

/** /w/:slug/decisions — every proposal and decision of the workspace, filtered by state and family (kept in the address). */
export function DecisionListPage() {
  const { slug } = useWorkspaceRole();
  const [params, setParams] = useSearchParams();
  const stateParam = params.get("state") ?? "";
  const state: DecisionState | "" = (DECISION_STATES as readonly string[]).includes(stateParam) ? (stateParam as DecisionState) : "";
  const family = params.get("family") ?? "";
  const decisions = useDecisions(slug, state, family);
  // Every family that has a decision, for the filter (the unfiltered list, cached apart).
  const all = useDecisions(slug, "", "");
  const families = useMemo(() => familyOptions(all.data ?? []), [all.data]);
  const setFilter = (key: "state" | "family", value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  return (
    <div data-testid="decision-list-page">
      <PageHeader
        title="Decisions"
        subtitle="Designs proposed for a family, and the ones a lead approved. Propose one from a sweep's front, a clicked candidate, a baseline or a comparison's pick."
      />
      <div className="mb-4 flex flex-wrap items-end gap-3" data-testid="decision-filters">
        <label className="text-xs text-ink-soft">
          <span className="mb-1 block font-medium">State</span>
          <select className={`${inputClass} w-auto`} value={state} onChange={(e) => setFilter("state", e.target.value)} data-testid="filter-state">
            <option value="">any state</option>
            {DECISION_STATES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
        <label className="min-w-0 max-w-full text-xs text-ink-soft">
          <span className="mb-1 block font-medium">Family</span>
          <select className={`${inputClass} w-auto max-w-full`} value={family} onChange={(e) => setFilter("family", e.target.value)} data-testid="filter-family">
            <option value="">every family</option>
            {families.map((f) => (
              <option key={f.key} value={f.key}>
                {f.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      {decisions.isPending ? (
        <Loading label="Loading decisions…" />
      ) : decisions.isError ? (
        <ErrorNote error={decisions.error} title="Could not load the decisions" />
      ) : decisions.data.length === 0 ? (
        <EmptyState title={state || family ? "No decision matches these filters" : "No proposal yet"} testId="decisions-empty">
          {state || family
            ? "Choose another state or family above, or clear the filters."
            : "Open a finished sweep and use Propose on a row of its front, on a clicked candidate or on a baseline — or Propose this pick in a comparison's cross-score. A lead then approves it or returns it with a comment."}
        </EmptyState>
      ) : (
        <DecisionTable slug={slug} rows={decisions.data} />
      )}
    </div>
  );
}

function DecisionTable({ slug, rows }: { slug: string; rows: DecisionListItemDto[] }) {
  const [sorting, setSorting] = useState<{ id: string; desc: boolean }[]>([]);
  const columns = useMemo<ColumnDef<typeof features, DecisionListItemDto, any>[]>(
    () => [
      helper.accessor((row) => row.title, {
        id: "title",
        header: () => "Title",
        cell: (info) => (
          <div className="min-w-56">
            <Link to={`/w/${slug}/decisions/${info.row.original.id}`} className="font-medium hover:text-moss" data-testid="decision-link">
              {info.row.original.title}
            </Link>
            <div className="text-xs text-ink-soft">{info.row.original.sourceLabel}</div>
          </div>
        ),
      }),
      helper.accessor((row) => row.state, { id: "state", header: () => "State", cell: (info) => <DecisionStateBadge state={info.row.original.state} /> }),
      helper.accessor((row) => row.family.name, { id: "family", header: () => "Family", cell: (info) => <span className="whitespace-nowrap text-xs">{info.row.original.family.name}</span> }),
      helper.accessor((row) => row.structure, {
        id: "controller",
        header: () => "Controller",
        enableSorting: false,
        cell: (info) => (
          <div className="font-mono text-xs">
            <div>{info.row.original.structure}</div>
            <div className="text-ink-soft">{formatParameters(info.row.original.parameters)}</div>
          </div>
        ),
      }),
      helper.accessor((row) => row.proposedAt, {
        id: "proposed",
        header: () => "Proposed",
        cell: (info) => (
          <span className="whitespace-nowrap text-xs text-ink-soft">
            {formatDateTime(info.row.original.proposedAt)} · {info.row.original.proposedBy.name}
          </span>
        ),
      }),
      helper.accessor((row) => row.commentCount, { id: "comments", header: () => "Comments", cell: (info) => <span className="font-mono text-xs tabular">{info.row.original.commentCount}</span> }),
    ],
    [slug],
  );
  const table = useTable({ features, columns, data: rows, state: { sorting }, onSortingChange: setSorting });
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-sheet" data-testid="table-frame">
      <table className="w-full min-w-[48rem] text-sm" data-testid="decision-table">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-soft">
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const sortable = header.column.getCanSort();
                return (
                  <th key={header.id} className="px-4 py-2 font-medium" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                    {sortable ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="flex items-center gap-1 uppercase hover:text-ink" data-testid={`sort-${header.id}`}>
                        <table.FlexRender header={header} />
                        <span aria-hidden className="font-mono text-[11px]">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-line-soft">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="align-top hover:bg-paper" data-testid="decision-row" data-state={row.original.state}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2.5">
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
