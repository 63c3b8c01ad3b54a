/** A quiet placeholder while data loads. */
export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" data-testid="loading" className="flex items-center gap-3 py-8 text-sm text-ink-soft">
      <span className="inline-block size-3 animate-pulse rounded-full bg-moss/60" aria-hidden />
      {label}
    </div>
  );
}
