import type { ScoreValue } from "@loopyard/core";
import { formatScore, scoreTitle } from "./format-score.js";

/** A table cell holding a score: right-aligned monospace, `digits` significant digits (4); ∞ and — explained on hover. */
export function ScoreCell({ value, className = "", digits }: { value: ScoreValue | undefined; className?: string; digits?: number }) {
  const missing = value === null || value === undefined;
  return (
    <td
      className={`px-3 py-1.5 text-right font-mono text-[13px] tabular ${missing ? "cursor-help text-ink-faint" : ""} ${className}`}
      title={scoreTitle(value)}
      data-score={missing ? "n/a" : String(value)}
    >
      {formatScore(value, digits)}
    </td>
  );
}
