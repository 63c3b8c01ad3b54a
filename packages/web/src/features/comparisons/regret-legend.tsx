import { formatRegret, REGRET_LEGEND_STEPS, regretColours } from "./regret-scale.js";

/** The regret scale's key: its steps as swatches with their numbers. */
export function RegretLegend() {
  return (
    <div className="flex flex-wrap items-center gap-1 text-[11px] text-ink-soft" data-testid="regret-legend">
      <span className="mr-1">regret against the column's best pick:</span>
      {REGRET_LEGEND_STEPS.map((r) => {
        const { background, text } = regretColours(r);
        return (
          <span key={r} className="rounded border border-line-soft px-1.5 py-px font-mono" style={{ background, color: text }}>
            {r === 0 ? "◎ best" : formatRegret(r)}
          </span>
        );
      })}
      <span className="ml-1">and beyond (darker is worse; the number is always printed)</span>
    </div>
  );
}
