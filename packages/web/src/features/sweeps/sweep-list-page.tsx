import { Link } from "react-router";
import { isSweepActive, useSweeps } from "../../api/use-sweeps.js";
import { ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListPage } from "../../components/list-page.js";
import { ListTable } from "../../components/list-table.js";
import { ProgressBar } from "../../components/progress-bar.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { formatEta, formatRate, sweepProgress } from "./sweep-progress.js";
import { SweepStatusBadge } from "./sweep-status.js";

const SWEEP_COLUMNS = [{ label: "Name" }, { label: "Plant" }, { label: "State" }, { label: "Progress", className: "w-80" }, { label: "Started" }] as const;

/** /w/:slug/sweeps — every sweep, newest first, with its state and progress. */
export function SweepListPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const sweeps = useSweeps(slug);
  const base = `/w/${slug}`;
  const refusal = workspace.data && !canEdit ? roleSentence("Running sweeps", "engineer", workspace.data.workspace.name, role) : null;
  const newButton = (
    <ButtonLink to={`${base}/sweeps/new`} tone="primary" disabledReason={refusal} testId="new-sweep">
      New sweep
    </ButtonLink>
  );

  return (
    <ListPage
      testId="sweep-list-page"
      title="Sweeps"
      subtitle="Controller candidates tried on one plant or a family of variants; every candidate scored on the chosen criteria, the front drawn from them."
      actions={newButton}
      refusal={refusal}
      query={sweeps}
      loadingLabel="Loading sweeps…"
      errorTitle="Could not load the sweeps"
      empty={
        <EmptyState
          title="No sweeps yet"
          action={
            canEdit ? (
              <ButtonLink to={`${base}/sweeps/new`} tone="primary" testId="new-sweep-empty">
                Start the first sweep
              </ButtonLink>
            ) : null
          }
          testId="sweeps-empty"
        >
          {canEdit
            ? "Start one: pick a plant revision, give ranges for kp, ki and kd, and Loopyard scores every candidate of the grid and draws the front."
            : "An engineer of this workspace can start a sweep; its front will show here."}
        </EmptyState>
      }
    >
      {(rows) => (
        <ListTable testId="sweep-table" columns={SWEEP_COLUMNS}>
          {rows.map((s) => (
            <tr key={s.id} className="hover:bg-paper">
              <td className="px-4 py-2.5">
                <Link to={`${base}/sweeps/${s.id}`} className="font-medium hover:text-moss" data-testid="sweep-link">
                  {s.name}
                </Link>
              </td>
              <td className="px-4 py-2.5">
                <Link to={`${base}/plants/${s.plant.id}?revision=${s.plant.revisionNumber}`} className="hover:text-moss">
                  {s.plant.name}
                </Link>{" "}
                <span className="font-mono text-xs text-ink-soft">rev {s.plant.revisionNumber}</span>
              </td>
              <td className="px-4 py-2.5">
                <SweepStatusBadge status={s.status} />
              </td>
              <td className="px-4 py-2.5">
                <SweepGlance sweep={s} />
              </td>
              <td className="px-4 py-2.5 text-xs text-ink-soft">
                {formatDateTime(s.createdAt)} · {s.createdBy.name}
              </td>
            </tr>
          ))}
        </ListTable>
      )}
    </ListPage>
  );
}

/** Progress of one sweep in a table row: the bar, and while it runs the rate and the time left; failed chunks when there are any. */
function SweepGlance({ sweep }: { sweep: Parameters<typeof sweepProgress>[0] & { status: string } }) {
  const p = sweepProgress(sweep);
  const active = isSweepActive(sweep.status as Parameters<typeof isSweepActive>[0]);
  return (
    <div data-testid="sweep-glance">
      <ProgressBar done={p.done} total={p.total} compact />
      {active && (p.ratePerSecond !== null || p.etaSeconds !== null) ? (
        <div className="mt-0.5 flex justify-between font-mono text-[11px] text-ink-soft">
          <span>{formatRate(p.ratePerSecond)}</span>
          <span>{p.etaSeconds !== null ? `${formatEta(p.etaSeconds)} left` : ""}</span>
        </div>
      ) : null}
      {p.chunksFailed > 0 ? <div className="mt-0.5 text-[11px] text-rust">{p.chunksFailed} chunk{p.chunksFailed === 1 ? "" : "s"} failed</div> : null}
    </div>
  );
}
