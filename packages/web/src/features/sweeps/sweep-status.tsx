import type { SweepStatus } from "@loopyard/core";

const STYLE: Record<SweepStatus | "cancelled", { label: string; className: string }> = {
  queued: { label: "queued", className: "border-line text-ink-soft" },
  running: { label: "running", className: "border-moss/50 text-moss" },
  finished: { label: "finished", className: "border-line bg-moss-wash text-moss" },
  failed: { label: "failed", className: "border-rust/50 bg-rust-wash text-rust" },
  cancelled: { label: "cancelled", className: "border-amber/50 bg-amber-wash text-amber" },
};

/** The state of a sweep as a small label. */
export function SweepStatusBadge({ status }: { status: SweepStatus }) {
  const style = STYLE[status] ?? STYLE.queued;
  return (
    <span data-testid="sweep-status" data-status={status} className={`inline-flex items-center gap-1.5 rounded border px-1.5 py-px font-mono text-[11px] ${style.className}`}>
      {status === "running" ? <span className="size-1.5 animate-pulse rounded-full bg-moss" aria-hidden /> : null}
      {style.label}
    </span>
  );
}
