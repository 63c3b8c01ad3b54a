import { useState } from "react";
import { Link } from "react-router";
import { ExportButton, libraryFileName } from "../library/export-button.js";
import { usePlants } from "../../api/use-plants.js";
import { ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListPage } from "../../components/list-page.js";
import { ListTable } from "../../components/list-table.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { formatCoefficient } from "./format-transfer-function.js";
import { plantKindShort } from "./plant-kind.js";
import { plantDelay, plantModelSummary } from "./plant-summary.js";

const PLANT_COLUMNS = [
  { label: "Name" },
  { label: "Kind" },
  { label: "Model" },
  { label: "Dead time [s]", align: "right" },
  { label: "Revision", align: "right" },
  { label: "Last change" },
] as const;

/** /w/:slug/plants — the library. */
export function PlantListPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const plants = usePlants(slug);
  const base = `/w/${slug}`;
  const refusal = workspace.data && !canEdit ? roleSentence("Creating plants", "engineer", workspace.data.workspace.name, role) : null;
  const [showArchived, setShowArchived] = useState(false);
  const archivedCount = plants.data?.filter((p) => p.archivedAt !== null).length ?? 0;
  const newButton = (
    <>
      <ExportButton slug={slug} fileName={libraryFileName(workspace.data?.workspace.name ?? slug)} label="Export library" />
      <ButtonLink to={`${base}/library/import`} tone="quiet" disabledReason={refusal ? roleSentence("Importing into the library", "engineer", workspace.data?.workspace.name, role) : null} testId="import-library">
        Import library
      </ButtonLink>
      <ButtonLink to={`${base}/plants/identify`} tone="quiet" disabledReason={refusal} testId="upload-step-test-link">
        Upload a step test
      </ButtonLink>
      <ButtonLink to={`${base}/plants/new`} tone="primary" disabledReason={refusal} testId="new-plant">
        New plant
      </ButtonLink>
    </>
  );

  return (
    <ListPage
      testId="plant-list-page"
      title="Library"
      subtitle="The workspace's plant models. Every edit makes a new revision; sweeps point at revisions."
      actions={newButton}
      refusal={refusal}
      query={plants}
      loadingLabel="Loading the library…"
      errorTitle="Could not load the library"
      empty={
        <EmptyState
          title="The library is empty"
          action={
            canEdit ? (
              <ButtonLink to={`${base}/plants/new`} tone="primary" testId="new-plant-empty">
                Add the first plant
              </ButtonLink>
            ) : null
          }
          testId="plants-empty"
        >
          {canEdit
            ? "Add a plant: a transfer function, a state-space model or nonlinear equations, or upload a step test and fit a model to it. Then sweep controller gains on it."
            : "An engineer of this workspace can add the first plant; you will see it here."}
        </EmptyState>
      }
    >
      {(rows) => (
        <>
        <ListTable testId="plant-table" columns={PLANT_COLUMNS}>
          {rows.filter((p) => showArchived || p.archivedAt === null).map((p) => (
            <tr key={p.id} className={`hover:bg-paper ${p.archivedAt ? "opacity-60" : ""}`}>
              <td className="px-4 py-2.5">
                <Link to={`${base}/plants/${p.id}`} className="font-medium hover:text-moss" data-testid="plant-link">
                  {p.name}
                </Link>
                {p.archivedAt ? <span className="ml-2 rounded bg-line px-1.5 py-0.5 text-[11px] text-ink-soft">archived</span> : null}
                {p.latestRevision.unitsNote ? <div className="max-w-xs truncate text-xs text-ink-soft">{p.latestRevision.unitsNote}</div> : null}
              </td>
              <td className="whitespace-nowrap px-4 py-2.5 text-xs text-ink-soft" data-testid="plant-kind-cell">
                {plantKindShort(p.latestRevision.model.kind)}
              </td>
              <td className="max-w-xs truncate px-4 py-2.5 font-mono text-[13px]" title={plantModelSummary(p.latestRevision.model)}>
                {plantModelSummary(p.latestRevision.model)}
              </td>
              <td className="px-4 py-2.5 text-right font-mono text-[13px] tabular">
                {plantDelay(p.latestRevision.model) === null ? <span className="text-ink-faint">—</span> : formatCoefficient(plantDelay(p.latestRevision.model) ?? 0)}
              </td>
              <td className="px-4 py-2.5 text-right font-mono text-[13px] tabular">
                {p.latestRevision.number}
                <span className="text-ink-faint"> / {p.revisionCount}</span>
              </td>
              <td className="min-w-40 px-4 py-2.5 text-xs text-ink-soft">
                {formatDateTime(p.latestRevision.createdAt)} · {p.latestRevision.createdBy.name}
              </td>
            </tr>
          ))}
        </ListTable>
        {archivedCount > 0 ? (
          <label className="mt-3 flex items-center gap-2 text-xs text-ink-soft">
            <input type="checkbox" className="accent-moss" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} data-testid="show-archived-plants" />
            Show {archivedCount} archived plant{archivedCount === 1 ? "" : "s"}
          </label>
        ) : null}
        </>
      )}
    </ListPage>
  );
}
