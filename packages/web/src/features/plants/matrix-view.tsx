import { formatCoefficient } from "./format-transfer-function.js";

/** A signed coefficient with the typographic minus. */
export function formatEntry(value: number): string {
  return formatCoefficient(value);
}

/** A matrix drawn in monospace between brackets, entries right-aligned; its name to the left. */
export function MatrixView({ name, rows, testId }: { name: string; rows: readonly (readonly number[])[]; testId?: string }) {
  return (
    <div className="inline-flex items-center gap-2 font-mono text-[13px]" data-testid={testId}>
      <span className="text-ink-soft">{name} =</span>
      <span className="relative inline-block px-2">
        <span aria-hidden className="absolute inset-y-0 left-0 w-1.5 rounded-l-sm border-y border-l border-ink/60" />
        <span aria-hidden className="absolute inset-y-0 right-0 w-1.5 rounded-r-sm border-y border-r border-ink/60" />
        <table className="border-separate border-spacing-x-2 border-spacing-y-0.5">
          <tbody>
            {rows.map((row, i) => (
              <tr key={i}>
                {row.map((v, j) => (
                  <td key={j} className="text-right tabular">
                    {formatEntry(v)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </span>
    </div>
  );
}
