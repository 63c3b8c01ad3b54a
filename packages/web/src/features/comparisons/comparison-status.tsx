import type { ComparisonStatus } from "@loopyard/core";

const STYLE: Record<ComparisonStatus, string> = {
  queued: "border-line text-ink-soft",
  running: "border-moss/50 text-moss",
  finished: "border-line bg-moss-wash text-moss",
  failed: "border-rust/50 bg-rust-wash text-rust",
  cancelled: "border-amber/50 bg-amber-wash text-amber",
};

/** The state of a comparison as a small label. */
export function ComparisonStatusBadge({ status }: { status: ComparisonStatus }) {
  return (
    <span data-testid="comparison-status" data-status={status} className={`inline-flex items-center gap-1.5 rounded border px-1.5 py-px font-mono text-[11px] ${STYLE[status] ?? STYLE.queued}`}>
      {status === "running" ? <span className="size-1.5 animate-pulse rounded-full bg-moss" aria-hidden /> : null}
      {status}
    </span>
  );
}
