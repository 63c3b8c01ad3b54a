import { useState } from "react";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { ProgressBar } from "../../components/progress-bar.js";
import { formatCount, formatEta, formatRate, type SweepProgressView } from "./sweep-progress.js";

/**
 * The live state of a running sweep: a bar of candidates done, the rate of the last half-minute,
 * the time left, the workers taking chunks, chunks done and failed (each failure with its error),
 * and — for engineers and above — a Cancel button that asks once more before it stops the sweep.
 */
export function SweepProgressPanel({
  progress,
  queued,
  cancel,
}: {
  progress: SweepProgressView;
  queued: boolean;
  /** Cancel action; null when the user's role may not cancel (the reason is then shown instead). */
  cancel: { run: () => void; pending: boolean; error: unknown; refusal: string | null } | null;
}) {
  const [confirming, setConfirming] = useState(false);
  const figure = (label: string, value: string, testId: string) => (
    <div>
      <dt className="text-xs text-ink-soft">{label}</dt>
      <dd className="font-mono text-[15px] tabular" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
  const chunks =
    progress.chunksTotal === null
      ? "—"
      : `${formatCount(progress.chunksDone ?? 0)} / ${formatCount(progress.chunksTotal)}${progress.chunksFailed > 0 ? ` · ${progress.chunksFailed} failed` : ""}`;
  return (
    <section className="rounded-lg border border-line bg-sheet px-5 py-4" data-testid="progress-panel">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-3 text-sm">
        <span className="font-medium">{queued ? "Waiting for a worker…" : "Scoring candidates…"}</span>
        <span className="text-xs text-ink-soft">This page follows the sweep every second; you may leave it, the sweep runs on.</span>
      </div>
      <ProgressBar done={progress.done} total={progress.total} testId="sweep-progress" />
      <dl className="mt-4 grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-5">
        {figure("Candidates", `${formatCount(progress.done)} of ${formatCount(progress.total)}`, "progress-done")}
        {figure("Rate", formatRate(progress.ratePerSecond), "progress-rate")}
        {figure("Time left", formatEta(progress.etaSeconds), "progress-eta")}
        {figure("Workers", progress.workersActive === null ? "—" : String(progress.workersActive), "progress-workers")}
        {figure("Chunks done", chunks, "progress-chunks")}
      </dl>
      {progress.workersActive === 0 && !queued ? (
        <p className="mt-3 rounded-md border border-amber/40 bg-amber-wash px-3 py-2 text-xs" data-testid="progress-no-workers">
          No worker has reported in the last 15 s. The sweep waits until one starts: run <span className="font-mono">npm run worker</span>, or
          start the server with its built-in worker.
        </p>
      ) : null}
      {progress.failures.length > 0 ? <ChunkFailures failures={progress.failures} className="mt-3" /> : null}
      {cancel ? (
        <div className="mt-4 flex flex-wrap items-center gap-3 border-t border-line-soft pt-3">
          {cancel.refusal ? (
            <span className="text-xs text-ink-soft">{cancel.refusal}</span>
          ) : confirming ? (
            <>
              <span className="text-sm">Stop this sweep? Chunks already running finish and their results are kept; no more are handed out.</span>
              <Button tone="danger" onClick={() => cancel.run()} disabled={cancel.pending} data-testid="cancel-confirm">
                {cancel.pending ? "Stopping…" : "Yes, stop it"}
              </Button>
              <Button onClick={() => setConfirming(false)} disabled={cancel.pending}>
                Keep running
              </Button>
            </>
          ) : (
            <Button onClick={() => setConfirming(true)} data-testid="cancel-sweep">
              Cancel sweep
            </Button>
          )}
          {cancel.error ? <div className="w-full"><ErrorNote error={cancel.error} title="The sweep was not cancelled" /></div> : null}
        </div>
      ) : null}
    </section>
  );
}

/** Chunks that failed after their retries, each with its error: their candidates are missing from the results. */
export function ChunkFailures({ failures, className = "" }: { failures: SweepProgressView["failures"]; className?: string }) {
  return (
    <div className={`rounded-md border border-rust/40 bg-rust-wash px-3 py-2 text-xs ${className}`} data-testid="progress-failures">
      <p className="font-medium text-rust">
        {failures.length === 1 ? "One chunk failed" : `${failures.length} chunks failed`} after retries; the candidates of a failed chunk are missing from the
        results.
      </p>
      <ul className="mt-1 space-y-0.5">
        {failures.map((f) => (
          <li key={f.chunk} className="font-mono">
            chunk {f.chunk}: {f.error}
          </li>
        ))}
      </ul>
    </div>
  );
}
