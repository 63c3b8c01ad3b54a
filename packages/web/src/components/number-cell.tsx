import { formatNumber } from "./format-number.js";

/** A table cell holding a number: right-aligned, monospace, 4 significant digits; the full value on hover. */
export function NumberCell({ value, digits = 4, className = "" }: { value: number | null | undefined; digits?: number; className?: string }) {
  return (
    <td className={`px-3 py-1.5 text-right font-mono text-[13px] tabular ${className}`} title={value === null || value === undefined ? undefined : String(value)}>
      {formatNumber(value, digits)}
    </td>
  );
}
