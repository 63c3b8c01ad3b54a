import { useEffect, useState } from "react";
import { Link, useParams, useSearchParams } from "react-router";
import { useArchivePlant, usePlant, usePlantDiff } from "../../api/use-plants.js";
import { ButtonLink } from "../../components/button.js";
import { preloadPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS } from "../../components/charts/chart-theme.js";
import { TimeChart } from "../../components/charts/time-chart.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { ActuatorLimitsList } from "./actuator-limits-view.js";
import { PlantModelView } from "./plant-model-view.js";
import { plantKindShort } from "./plant-kind.js";
import { PolesTable, ZerosTable } from "./poles-table.js";
import { inputUnitOf } from "./plant-units.js";
import { RevisionDiffView } from "../revisions/revision-diff-view.js";
import { RevisionList } from "../revisions/revision-list.js";
import { ArchiveControl } from "../revisions/archive-control.js";
import { ExportButton, libraryFileName } from "../library/export-button.js";

/** /w/:slug/plants/:plantId[?revision=N] — one revision of a plant: model, poles, open-loop step, revisions. */
export function PlantDetailPage() {
  // The step-response chart needs the plotting bundle: fetch it alongside the plant's data.
  useEffect(() => void preloadPlot(), []);
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { plantId = "" } = useParams();
  const [params] = useSearchParams();
  const revisionParam = params.get("revision");
  const revision = revisionParam !== null && /^\d+$/.test(revisionParam) ? Number(revisionParam) : undefined;
  const plant = usePlant(slug, plantId, revision);
  const archive = useArchivePlant(slug, plantId);
  const shownNumber = plant.data?.revision.number ?? 1;
  const [pair, setPair] = useState<{ from: number; to: number } | null>(null);
  const diffFrom = pair?.from ?? Math.max(1, shownNumber - 1);
  const diffTo = pair?.to ?? shownNumber;
  const diff = usePlantDiff(slug, plantId, diffFrom, diffTo);
  const base = `/w/${slug}`;
  const back = { to: `${base}/plants`, label: "Library" };

  if (plant.isPending) return <Loading label="Loading the plant…" />;
  if (plant.isError)
    return (
      <>
        <PageHeader title="Plant" back={back} />
        <ErrorNote error={plant.error} title={revision === undefined ? "Could not load the plant" : `Could not load revision ${revision}`} />
      </>
    );

  const { plant: summary, revision: shown, revisions, poles, zeros = [], step, polesNote } = plant.data;
  const isLatest = shown.number === summary.latestRevision.number;
  const refusal = workspace.data && !canEdit ? roleSentence("Revising plants and running sweeps", "engineer", workspace.data.workspace.name, role) : null;
  const model = shown.model;
  const nonlinear = model.kind === "nonlinear";
  const stepNote =
    model.kind === "nonlinear"
      ? `u steps from u₀ = ${model.operatingInput ?? 0} to u₀ + 1 at t = 0; shown as y − y₀`
      : model.kind === "state-space"
        ? "unit step on u at t = 0 from x = 0"
        : "unit step on u at t = 0";

  return (
    <div data-testid="plant-detail-page">
      <PageHeader
        title={shown.name}
        back={back}
        subtitle={
          <>
            Revision <span className="font-mono">{shown.number}</span> of <span className="font-mono">{summary.revisionCount}</span> · saved{" "}
            {formatDateTime(shown.createdAt)} by {shown.createdBy.name}
            {isLatest ? null : (
              <>
                {" "}
                ·{" "}
                <Link to={`${base}/plants/${summary.id}`} className="text-moss hover:underline">
                  show the latest
                </Link>
              </>
            )}
          </>
        }
        actions={
          // A viewer is not offered buttons that lead to forms they cannot submit: the note below says why.
          <>
            {canEdit ? (
              <ButtonLink to={`${base}/sweeps/new?plant=${summary.id}&revision=${shown.id}`} tone="quiet" testId="sweep-this-revision">
                Sweep this revision
              </ButtonLink>
            ) : null}
            {canEdit && model.kind === "identified" ? (
              <ButtonLink to={`${base}/plants/${summary.id}/refit`} tone="quiet" testId="refit-plant">
                Refit from the step test
              </ButtonLink>
            ) : null}
            <ExportButton slug={slug} plant={summary.id} fileName={libraryFileName(summary.name)} />
            {canEdit ? <ArchiveControl archivedAt={summary.archivedAt} what="plant" refusal={null} mutation={archive} /> : null}
            {canEdit ? (
              <ButtonLink to={`${base}/plants/${summary.id}/revise`} tone="primary" testId="new-revision">
                New revision
              </ButtonLink>
            ) : null}
          </>
        }
      />
      {refusal ? <RoleNote sentence={refusal} /> : null}
      {summary.archivedAt ? (
        <p role="note" className="mb-4 rounded-md border border-line bg-sheet px-4 py-2 text-sm text-ink-soft" data-testid="archived-note">
          Archived {formatDateTime(summary.archivedAt)}: new sweeps and families do not offer it; sweeps, comparisons and families that use its revisions keep them. Restore it to offer it again.
        </p>
      ) : null}
      {isLatest ? null : (
        <p role="note" className="mb-4 rounded-md border border-line bg-sheet px-4 py-2 text-sm text-ink-soft">
          You are looking at an earlier revision. It stays unchanged; sweeps that used it keep their results.
        </p>
      )}
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-5">
        <div className="space-y-6 lg:col-span-3">
          <Section title="Model" aside={<span className="font-mono" data-testid="plant-kind-label">{plantKindShort(model.kind)}</span>}>
            <PlantModelView model={model} />
            <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
              <dt className="text-ink-soft">Units</dt>
              <dd>{shown.unitsNote || <span className="text-ink-faint">No units note. Add one in a new revision so that others read the scores right.</span>}</dd>
            </dl>
          </Section>
          <Section title="Open-loop step response" aside={stepNote}>
            {step.t.length > 0 ? (
              <TimeChart testId="plant-step-chart" height={300} yTitle={nonlinear ? "y − y₀" : "y"} series={[{ name: nonlinear ? "y(t) − y₀" : "y(t)", t: step.t, values: step.y, color: CHART_COLORS.moss }]} />
            ) : (
              <p className="text-sm text-ink-soft">No step response for this plant.</p>
            )}
          </Section>
        </div>
        <div className="space-y-6 lg:col-span-2">
          <Section
            title={nonlinear ? "Poles of the linearisation" : "Poles"}
            aside={`${poles.length} pole${poles.length === 1 ? "" : "s"}`}
            testId="poles-section"
          >
            {nonlinear || polesNote ? (
              <p className="mb-2 text-xs text-ink-soft" data-testid="linearisation-note">
                {polesNote ?? "The nonlinear plant linearised at its operating point (initial state, u₀). They describe small changes around that point only."}
              </p>
            ) : null}
            <PolesTable poles={poles} />
          </Section>
          <Section title="Zeros" aside={`${zeros.length} zero${zeros.length === 1 ? "" : "s"}`} testId="zeros-section">
            <ZerosTable zeros={zeros} />
          </Section>
          <Section title="Actuator limits">
            <ActuatorLimitsList limits={model.actuator} inputUnit={inputUnitOf(model, shown.unitsNote)} />
          </Section>
          <Section title="Revisions" testId="revision-list">
            <RevisionList revisions={revisions} shown={shown.number} linkTo={(n) => `${base}/plants/${summary.id}?revision=${n}`} />
          </Section>
          <Section title="What changed" aside="between two revisions" testId="plant-diff">
            {revisions.length < 2 ? (
              <p className="text-sm text-ink-soft">One revision so far. Each new revision says what changed, and shows it here field by field.</p>
            ) : (
              <RevisionDiffView numbers={revisions.map((r) => r.number)} from={diffFrom} to={diffTo} onChange={(from, to) => setPair({ from, to })} query={diff} />
            )}
          </Section>
        </div>
      </div>
    </div>
  );
}
