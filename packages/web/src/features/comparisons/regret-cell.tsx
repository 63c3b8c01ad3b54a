import { formatRegret, regretColours, regretPosition } from "./regret-scale.js";
import { formatFigure } from "./format-value.js";

/**
 * One cell of the cross-score: the value, its regret on the regret scale (background lightness),
 * a bar of the same length scale, and the best-of-column mark (a ring). `own`: the pick's own
 * contender column (outlined).
 */
export function RegretCell({ value, regret, best, own }: { value: number; regret: number; best: boolean; own: boolean }) {
  const { background, text } = regretColours(regret);
  const t = regretPosition(regret);
  return (
    <div
      className={`relative min-w-[4.2rem] rounded px-1.5 py-1 font-mono text-xs leading-tight tabular ${own ? "outline outline-2 -outline-offset-2 outline-ink" : ""}`}
      style={{ background, color: text }}
      data-testid="regret-cell"
      data-regret={Number.isFinite(regret) ? regret : String(regret)}
      title={own ? "its own criterion: the column this pick was tuned for" : undefined}
    >
      <div className="whitespace-nowrap text-[13px]">{formatFigure(value)}</div>
      <div className={`whitespace-nowrap text-[11px] ${best ? "font-semibold" : ""}`}>
        {best ? <span aria-label="best of this column">◎ </span> : null}
        {formatRegret(regret)}
      </div>
      {Number.isNaN(t) ? null : (
        <div aria-hidden className="mt-0.5 h-1 rounded-full" style={{ width: `${Math.max(4, t * 100)}%`, background: "currentColor", opacity: 0.55 }} />
      )}
    </div>
  );
}
