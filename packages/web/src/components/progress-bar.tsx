const GROUPED = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });

/** Progress of a long job as a bar and "done/total" (grouped digits: 45,000/100,000). */
export function ProgressBar({ done, total, testId, compact = false }: { done: number; total: number; testId?: string; compact?: boolean }) {
  const fraction = total > 0 ? Math.min(1, done / total) : 0;
  const percent = Math.round(fraction * 100);
  return (
    <div data-testid={testId} className="flex items-center gap-3">
      <div
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        className={`relative w-full overflow-hidden rounded-full bg-line-soft ${compact ? "h-1.5" : "h-2.5"}`}
      >
        <div className="absolute inset-y-0 left-0 rounded-full bg-moss transition-[width] duration-500" style={{ width: `${percent}%` }} />
      </div>
      <span className={`shrink-0 font-mono text-xs tabular text-ink-soft ${compact ? "w-28 text-right" : ""}`}>
        {GROUPED.format(done)}/{GROUPED.format(total)}
      </span>
    </div>
  );
}
