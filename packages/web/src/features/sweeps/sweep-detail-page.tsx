import { useEffect, type ReactNode } from "react";
import { Link, useParams } from "react-router";
import type { SweepDetailDto } from "@loopyard/core";
import { isSweepActive, useCancelSweep, useSweep } from "../../api/use-sweeps.js";
import { ButtonLink } from "../../components/button.js";
import { preloadPlot } from "../../components/charts/lazy-plot.js";
import { CautionNote } from "../../components/caution-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { formatNumber } from "../../components/format-number.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { FrontPanel } from "../fronts/front-panel.js";
import { criterionShortLabel } from "../fronts/criterion-label.js";
import { scenarioSummary } from "../fronts/front-panel.js";
import { plantKindShort } from "../plants/plant-kind.js";
import { STRUCTURES } from "./structure-choices.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { ChunkFailures, SweepProgressPanel } from "./sweep-progress-panel.js";
import { formatCount, sweepProgress } from "./sweep-progress.js";
import { SweepStatusBadge } from "./sweep-status.js";
import { designSummary } from "./sweep-design-values.js";
import { aggregateName } from "../fronts/variant-scores-table.js";

/** /w/:slug/sweeps/:sweepId — progress while the sweep runs; then the front. */
export function SweepDetailPage() {
  // The front chart needs the plotting bundle: fetch it alongside the sweep's data, not after.
  useEffect(() => void preloadPlot(), []);
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { sweepId = "" } = useParams();
  const sweep = useSweep(slug, sweepId);
  const cancel = useCancelSweep(slug, sweepId);
  const workspaceName = workspace.data?.workspace.name;
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
  const progress = sweepProgress(s);
  const status: string = s.status;
  const runAgain = (
    <ButtonLink
      to={`/w/${slug}/sweeps/new?from=${encodeURIComponent(s.id)}`}
      disabledReason={workspace.data && !canEdit ? roleSentence("Running sweeps", "engineer", workspaceName, role) : null}
      testId="run-again"
    >
      Run again with changes
    </ButtonLink>
  );
  return (
    <div data-testid="sweep-detail-page">
      <PageHeader
        title={
          <span className="flex items-center gap-3">
            {s.name} <SweepStatusBadge status={s.status} />
          </span>
        }
        back={back}
        actions={
          <>
            {/* Comparisons: the same family, structure and box with criteria pitted against each other. */}
            <ButtonLink
              to={`/w/${slug}/comparisons/new?sweep=${encodeURIComponent(s.id)}`}
              disabledReason={workspace.data && !canEdit ? roleSentence("Starting comparisons", "engineer", workspaceName, role) : null}
              testId="compare-criteria-from-sweep"
            >
              Compare criteria
            </ButtonLink>
            {runAgain}
          </>
        }
        subtitle={
          <>
            {s.definition.family?.source ? (
              <>
                <Link to={`/w/${slug}/families/${s.definition.family.source.familyId}?revision=${s.definition.family.source.number}`} className="text-ink hover:text-moss" data-testid="sweep-family-link">
                  {s.definition.family.name ?? "family"}
                </Link>{" "}
                <span className="font-mono text-xs">rev {s.definition.family.source.number}</span> ·{" "}
              </>
            ) : null}
            <Link to={`/w/${slug}/plants/${s.plant.id}?revision=${s.plant.revisionNumber}`} className="text-ink hover:text-moss">
              {s.plant.name}
            </Link>{" "}
            <span className="font-mono text-xs">rev {s.plant.revisionNumber}</span>
            {s.plant.kind ? <span className="text-xs"> ({plantKindShort(s.plant.kind)})</span> : null} · started {formatDateTime(s.createdAt)} by {s.createdBy.name}
            {s.finishedAt ? <> · finished {formatDateTime(s.finishedAt)}</> : null}
          </>
        }
      />
      <div className="space-y-6">
        <CautionNote />
        <Definition sweep={s} />
        {isSweepActive(s.status) ? (
          <SweepProgressPanel
            progress={progress}
            queued={s.status === "queued"}
            cancel={{
              run: () => cancel.mutate(),
              pending: cancel.isPending,
              error: cancel.error,
              refusal: workspace.data && !canEdit ? roleSentence("Cancelling a sweep", "engineer", workspaceName, role) : null,
            }}
          />
        ) : s.status === "failed" ? (
          <ErrorNote
            error={new Error(s.error ?? "The sweep stopped without a reason.")}
            title={`The sweep failed after ${s.done} of ${s.total} candidates`}
            testId="sweep-failed"
          />
        ) : (
          <>
            {status === "cancelled" ? (
              <p className="rounded-md border border-amber/40 bg-amber-wash px-4 py-2.5 text-sm" data-testid="sweep-cancelled">
                This sweep was cancelled after {formatCount(s.done)} of {formatCount(s.total)} candidates.
                {s.done > 0 ? " The front below covers the candidates scored before it stopped." : " No candidate was scored; run it again to get a front."}
              </p>
            ) : null}
            {progress.failures.length > 0 ? <ChunkFailures failures={progress.failures} /> : null}
            {status !== "cancelled" || s.done > 0 ? <FrontPanel slug={slug} sweep={s} /> : null}
          </>
        )}
      </div>
    </div>
  );
}

function Definition({ sweep }: { sweep: SweepDetailDto }) {
  const d = sweep.definition;
  const fixed: Record<string, number> = { ...(d.fixed ?? {}) };
  if (d.sampleTime !== undefined) fixed.sampleTime = d.sampleTime;
  // In the structure's order (SweepDetailDto.parameters); a tf derived from the filter is shown with the filter.
  const given = [...Object.keys(d.ranges), ...Object.keys(fixed).filter((n) => !(n in d.ranges))];
  const names = [...sweep.parameters.filter((n) => given.includes(n)), ...given.filter((n) => !sweep.parameters.includes(n))];
  const value = (name: string) => {
    const r = d.ranges[name];
    if (!r) return formatNumber(fixed[name]);
    const scale = r.scale === "log" ? " log" : "";
    if (d.design && d.design.kind !== "grid") return r.max === r.min ? formatNumber(r.min) : `${formatNumber(r.min)} … ${formatNumber(r.max)}${scale}`;
    return r.count === 1 ? formatNumber(r.min) : `${formatNumber(r.min)} … ${formatNumber(r.max)} × ${r.count}${scale}`;
  };
  const antiWindup = d.antiWindup
    ? d.antiWindup.kind === "back-calculation"
      ? `back-calculation${d.antiWindup.tt !== undefined ? `, tt = ${formatNumber(d.antiWindup.tt)} s` : ""}`
      : d.antiWindup.kind === "conditional"
        ? "conditional integration"
        : "none"
    : null;
  const options = d.criterionOptions;
  const optionText = [
    options?.q !== undefined ? `q = ${formatNumber(options.q)}` : null,
    options?.r !== undefined ? `r = ${formatNumber(options.r)}` : null,
    options?.settlingBand !== undefined ? `band ±${formatNumber(options.settlingBand * 100)} %` : null,
  ].filter((t) => t !== null);
  const item = (label: ReactNode, body: ReactNode, mono = true, key?: string, wide = false) => (
    <div key={key} className={wide ? "col-span-2" : ""}>
      <dt className={`text-xs text-ink-soft ${mono && typeof label === "string" && key ? "font-mono" : ""}`}>{label}</dt>
      <dd className={mono ? "font-mono text-[13px]" : "text-[13px]"}>{body}</dd>
    </div>
  );
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-2 rounded-lg border border-line bg-sheet px-5 py-3 text-sm sm:grid-cols-4 lg:grid-cols-6" data-testid="sweep-definition">
      {item("Structure", STRUCTURES[d.structure]?.label ?? d.structure, false)}
      {names.map((name) => item(name, value(name), true, name))}
      {d.filter ? item("Derivative filter", d.filter.mode === "ratio" ? `tf = Td/${formatNumber(d.filter.n)}` : `tf = ${formatNumber(d.filter.tf)} s`) : null}
      {antiWindup ? item("Anti-windup", antiWindup, false) : null}
      {item("Scenario", scenarioSummary(d.scenario), false, "scenario", true)}
      {item("Horizon · step", `${formatNumber(d.scenario.horizon)} s · ${formatNumber(d.scenario.dt)} s`)}
      {item("Design", designSummary(d.design), false, "design", true)}
      {item("Candidates", formatCount(sweep.total))}
      {(sweep.family?.length ?? 0) > 1
        ? item(
            `Family · ${aggregateName(d.aggregate)}`,
            sweep.family.map((v) => v.label).join(" · "),
            false,
            "family",
            true,
          )
        : null}
      {item(
        "Criteria",
        <>
          {sweep.criteria.map(criterionShortLabel).join(", ")}
          {optionText.length > 0 ? <span className="text-ink-soft"> ({optionText.join(", ")})</span> : null}
        </>,
        false,
        "criteria",
        true,
      )}
    </dl>
  );
}
