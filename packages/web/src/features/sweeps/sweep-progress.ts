import type { SweepProgressDto, SweepSummaryDto } from "@loopyard/core";

/**
 * Progress of a sweep as the page shows it: candidates done of total, the rate of the last
 * half-minute, the time left, the workers taking chunks and the chunks done or failed with their
 * errors. Sweeps stored before chunked jobs carry only done/total; the rest is then unknown (null).
 */
export interface SweepProgressView {
  done: number;
  total: number;
  fraction: number;
  ratePerSecond: number | null;
  etaSeconds: number | null;
  workersActive: number | null;
  chunksTotal: number | null;
  chunksDone: number | null;
  chunksFailed: number;
  failures: readonly { chunk: number; error: string }[];
}

/** The progress fields of a sweep summary as the server sends them (SweepSummaryDto.progress, optional for older servers). */
type ProgressSource = Pick<SweepSummaryDto, "done" | "total"> & { progress?: SweepProgressDto | null };

/** The progress of a sweep summary or detail, falling back to done/total when the server sends no progress block. */
export function sweepProgress(sweep: ProgressSource): SweepProgressView {
  const p = sweep.progress ?? null;
  const done = p?.done ?? sweep.done;
  const total = p?.total ?? sweep.total;
  const finite = (v: number | null | undefined) => (typeof v === "number" && Number.isFinite(v) ? v : null);
  return {
    done,
    total,
    fraction: total > 0 ? Math.min(1, Math.max(0, done / total)) : 0,
    ratePerSecond: finite(p?.ratePerSecond),
    etaSeconds: finite(p?.etaSeconds),
    workersActive: p ? p.workersActive : null,
    chunksTotal: p ? p.chunksTotal : null,
    chunksDone: p ? p.chunksDone : null,
    chunksFailed: p?.chunksFailed ?? 0,
    failures: p?.failures ?? [],
  };
}

const GROUPED = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });

/** A count with thin grouping, e.g. 100000 → "100,000". */
export function formatCount(value: number): string {
  return GROUPED.format(value);
}

/** A rate as "1,240 candidates/s" (3 significant digits below 100 per second); "—" when unknown. */
export function formatRate(ratePerSecond: number | null): string {
  if (ratePerSecond === null || !Number.isFinite(ratePerSecond) || ratePerSecond < 0) return "—";
  const value = ratePerSecond >= 100 ? GROUPED.format(Math.round(ratePerSecond)) : Number(ratePerSecond.toPrecision(3)).toString();
  return `${value} candidates/s`;
}

/**
 * Time left as words a reader takes in at a glance: "under 5 s", "40 s", "3 min 20 s", "2 h 05 min";
 * "—" when unknown (no rate yet).
 */
export function formatEta(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds) || seconds < 0) return "—";
  if (seconds < 5) return "under 5 s";
  const s = Math.round(seconds);
  if (s < 60) return `${s} s`;
  if (s < 3600) {
    const m = Math.floor(s / 60);
    const rest = s % 60;
    return m >= 10 || rest === 0 ? `${Math.round(s / 60)} min` : `${m} min ${rest} s`;
  }
  const h = Math.floor(s / 3600);
  const m = Math.round((s % 3600) / 60);
  return m === 60 ? `${h + 1} h 00 min` : `${h} h ${String(m).padStart(2, "0")} min`;
}
