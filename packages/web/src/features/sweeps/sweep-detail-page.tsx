import { Link, useParams } from "react-router";
import type { SweepDetailDto } from "@loopyard/core";
import { isSweepActive, useSweep } from "../../api/use-sweeps.js";
import { CautionNote } from "../../components/caution-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { formatNumber } from "../../components/format-number.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { ProgressBar } from "../../components/progress-bar.js";
import { FrontPanel } from "../fronts/front-panel.js";
import { criterionShortLabel } from "../fronts/criterion-label.js";
import { useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { SweepStatusBadge } from "./sweep-status.js";

/** /w/:slug/sweeps/:sweepId — progress while the sweep runs; then the front. */
export function SweepDetailPage() {
  const { slug } = useWorkspaceRole();
  const { sweepId = "" } = useParams();
  const sweep = useSweep(slug, sweepId);
  const back = { to: `/w/${slug}/sweeps`, label: "Sweeps" };

  if (sweep.isPending) return <Loading label="Loading the sweep…" />;
  if (sweep.isError)
    return (
      <>
        <PageHeader title="Sweep" back={back} />
        <ErrorNote error={sweep.error} title="Could not load the sweep" />
      </>
    );

  const s = sweep.data;
  return (
    <div data-testid="sweep-detail-page">
      <PageHeader
        title={
          <span className="flex items-center gap-3">
            {s.name} <SweepStatusBadge status={s.status} />
          </span>
        }
        back={back}
        subtitle={
          <>
            <Link to={`/w/${slug}/plants/${s.plant.id}?revision=${s.plant.revisionNumber}`} className="text-ink hover:text-moss">
              {s.plant.name}
            </Link>{" "}
            <span className="font-mono text-xs">rev {s.plant.revisionNumber}</span> · started {formatDateTime(s.createdAt)} by {s.createdBy.name}
            {s.finishedAt ? <> · finished {formatDateTime(s.finishedAt)}</> : null}
          </>
        }
      />
      <div className="space-y-6">
        <CautionNote />
        <Definition sweep={s} />
        {isSweepActive(s.status) ? (
          <div className="rounded-lg border border-line bg-sheet px-5 py-4">
            <div className="mb-2 flex items-baseline justify-between text-sm">
              <span className="font-medium">{s.status === "queued" ? "Waiting to start…" : "Scoring candidates…"}</span>
              <span className="text-xs text-ink-soft">This page follows the sweep every second.</span>
            </div>
            <ProgressBar done={s.done} total={s.total} testId="sweep-progress" />
          </div>
        ) : s.status === "failed" ? (
          <ErrorNote
            error={new Error(s.error ?? "The sweep stopped without a reason.")}
            title={`The sweep failed after ${s.done} of ${s.total} candidates`}
            testId="sweep-failed"
          />
        ) : (
          <FrontPanel slug={slug} sweep={s} />
        )}
      </div>
    </div>
  );
}

function Definition({ sweep }: { sweep: SweepDetailDto }) {
  const d = sweep.definition;
  const range = (name: "kp" | "ki" | "kd") => {
    const r = d.ranges[name];
    return r.count === 1 ? formatNumber(r.min) : `${formatNumber(r.min)} … ${formatNumber(r.max)} × ${r.count}`;
  };
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-2 rounded-lg border border-line bg-sheet px-5 py-3 text-sm sm:grid-cols-4 lg:grid-cols-7" data-testid="sweep-definition">
      {(["kp", "ki", "kd"] as const).map((p) => (
        <div key={p}>
          <dt className="font-mono text-xs text-ink-soft">{p}</dt>
          <dd className="font-mono text-[13px]">{range(p)}</dd>
        </div>
      ))}
      <div>
        <dt className="text-xs text-ink-soft">Derivative filter</dt>
        <dd className="font-mono text-[13px]">{d.filter.mode === "ratio" ? `tf = Td/${formatNumber(d.filter.n)}` : `tf = ${formatNumber(d.filter.tf)} s`}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Horizon · step</dt>
        <dd className="font-mono text-[13px]">
          {formatNumber(d.scenario.horizon)} s · {formatNumber(d.scenario.dt)} s
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Candidates</dt>
        <dd className="font-mono text-[13px]">{sweep.total}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Criteria</dt>
        <dd className="text-[13px]">{sweep.criteria.map(criterionShortLabel).join(", ")}</dd>
      </div>
    </dl>
  );
}
