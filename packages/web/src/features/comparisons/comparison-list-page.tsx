import { Link } from "react-router";
import { isComparisonActive, useComparisons } from "../../api/use-comparisons.js";
import { ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListPage } from "../../components/list-page.js";
import { ListTable } from "../../components/list-table.js";
import { ProgressBar } from "../../components/progress-bar.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { ComparisonStatusBadge } from "./comparison-status.js";

const COLUMNS = [{ label: "Name" }, { label: "Contenders" }, { label: "Family" }, { label: "State" }, { label: "Progress", className: "w-64" }, { label: "Started" }] as const;

/** /w/:slug/comparisons — every comparison of criteria, newest first. */
export function ComparisonListPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const comparisons = useComparisons(slug);
  const base = `/w/${slug}`;
  const refusal = workspace.data && !canEdit ? roleSentence("Starting comparisons", "engineer", workspace.data.workspace.name, role) : null;
  const finished = comparisons.data?.filter((c) => c.status === "finished").length ?? 0;
  return (
    <ListPage
      testId="comparison-list-page"
      title="Compare criteria"
      subtitle="Which cost criterion should the team tune by? Each comparison lets criteria pick their best design on a family, then judges every pick on everything else you care about."
      actions={
        <>
          {finished >= 1 ? (
            <ButtonLink to={`${base}/comparisons/across`} testId="comparisons-across-link">
              Across families
            </ButtonLink>
          ) : null}
          <ButtonLink to={`${base}/comparisons/new`} tone="primary" disabledReason={refusal} testId="new-comparison">
            New comparison
          </ButtonLink>
        </>
      }
      refusal={refusal}
      query={comparisons}
      loadingLabel="Loading comparisons…"
      errorTitle="Could not load the comparisons"
      empty={
        <EmptyState
          title="No comparison yet"
          action={canEdit ? <ButtonLink to={`${base}/comparisons/new`} tone="primary" testId="new-comparison-empty">Start the first comparison</ButtonLink> : null}
          testId="comparisons-empty"
        >
          {canEdit
            ? "Pick a family of plants and a controller structure, then let IAE, ITAE, ISE and weighted quadratic costs each choose a design; Loopyard scores every choice on overshoot, actuator use, margins and more, on every variant."
            : "An engineer of this workspace can start a comparison; its answer will show here."}
        </EmptyState>
      }
    >
      {(rows) => (
        <ListTable testId="comparison-table" columns={COLUMNS}>
          {rows.map((c) => (
            <tr key={c.id} className="hover:bg-paper">
              <td className="px-4 py-2.5">
                <Link to={`${base}/comparisons/${c.id}`} className="font-medium hover:text-moss" data-testid="comparison-link">
                  {c.name}
                </Link>
              </td>
              <td className="px-4 py-2.5 font-mono text-xs">{c.contenders.join(", ")}</td>
              <td className="px-4 py-2.5 text-xs text-ink-soft">{c.family.map((v) => v.label).join(", ")}</td>
              <td className="px-4 py-2.5">
                <ComparisonStatusBadge status={c.status} />
              </td>
              <td className="px-4 py-2.5">
                {isComparisonActive(c.status) ? (
                  <ProgressBar done={c.progress.prescanDone + c.progress.picksDone} total={c.progress.prescanTotal + c.progress.picksTotal} compact />
                ) : c.status === "finished" ? (
                  <span className="text-xs text-ink-soft">{c.progress.picksTotal} picks</span>
                ) : (
                  <span className="text-xs text-ink-soft">{c.error ?? "—"}</span>
                )}
              </td>
              <td className="px-4 py-2.5 text-xs text-ink-soft">
                {formatDateTime(c.createdAt)} · {c.createdBy.name}
              </td>
            </tr>
          ))}
        </ListTable>
      )}
    </ListPage>
  );
}
