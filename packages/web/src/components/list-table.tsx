import type { ReactNode } from "react";

export interface ListTableColumn {
  label: string;
  /** Numbers are right-aligned. */
  align?: "left" | "right";
  /** Extra classes of the header cell, e.g. a width. */
  className?: string;
}

/**
 * The framed table of a list page: a header row of column labels over the given body rows. The table keeps
 * at least 40 rem (640 px) so that names and plants read on a line or two; on a narrower screen it scrolls
 * sideways inside its frame, never the page.
 */
export function ListTable({ testId, columns, children }: { testId: string; columns: readonly ListTableColumn[]; children: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-sheet" data-testid="table-frame">
      <table className="w-full min-w-[40rem] text-sm" data-testid={testId}>
        <thead>
          <tr className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-soft">
            {columns.map((column) => (
              <th
                key={column.label}
                className={[column.className, "px-4 py-2", column.align === "right" ? "text-right" : null, "font-medium"].filter(Boolean).join(" ")}
              >
                {column.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">{children}</tbody>
      </table>
    </div>
  );
}
