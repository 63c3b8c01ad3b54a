import { useState } from "react";
import { Link } from "react-router";
import { useFamilies } from "../../api/use-families.js";
import { ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListPage } from "../../components/list-page.js";
import { ListTable } from "../../components/list-table.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";

const FAMILY_COLUMNS = [
  { label: "Name" },
  { label: "Variants", align: "right" },
  { label: "Plants" },
  { label: "Revision", align: "right" },
  { label: "Last change" },
] as const;

/** /w/:slug/families — the saved families of the library. */
export function FamilyListPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const families = useFamilies(slug);
  const [showArchived, setShowArchived] = useState(false);
  const base = `/w/${slug}`;
  const refusal = workspace.data && !canEdit ? roleSentence("Saving families", "engineer", workspace.data.workspace.name, role) : null;
  const archivedCount = families.data?.filter((f) => f.archivedAt !== null).length ?? 0;
  return (
    <ListPage
      testId="family-list-page"
      title="Families"
      subtitle="Product lines saved once: each variant a plant revision with its parameter values. Sweeps and comparisons pick a family revision."
      actions={
        <ButtonLink to={`${base}/families/new`} tone="primary" disabledReason={refusal} testId="new-family">
          New family
        </ButtonLink>
      }
      refusal={refusal}
      query={families}
      loadingLabel="Loading the families…"
      errorTitle="Could not load the families"
      empty={
        <EmptyState
          title="No family saved yet"
          action={canEdit ? <ButtonLink to={`${base}/families/new`} tone="primary">Save the first family</ButtonLink> : null}
          testId="families-empty"
        >
          {canEdit
            ? "Save your product line's variants once — plant revisions, nonlinear parameter values or a manufacturing spread — and pick them in every sweep and comparison."
            : "An engineer of this workspace can save the first family; you will see it here."}
        </EmptyState>
      }
    >
      {(rows) => (
        <>
          <ListTable testId="family-table" columns={FAMILY_COLUMNS}>
            {rows
              .filter((f) => showArchived || f.archivedAt === null)
              .map((f) => {
                const plants = [...new Set(f.latestRevision.variants.map((v) => v.plantName))];
                return (
                  <tr key={f.id} className={`hover:bg-paper ${f.archivedAt ? "opacity-60" : ""}`} data-testid="family-row">
                    <td className="px-4 py-2.5">
                      <Link to={`${base}/families/${f.id}`} className="font-medium hover:text-moss" data-testid="family-link">
                        {f.name}
                      </Link>
                      {f.archivedAt ? <span className="ml-2 rounded bg-line px-1.5 py-0.5 text-[11px] text-ink-soft">archived</span> : null}
                      {f.latestRevision.description ? <div className="max-w-sm truncate text-xs text-ink-soft">{f.latestRevision.description}</div> : null}
                    </td>
                    <td className="px-4 py-2.5 text-right font-mono text-[13px] tabular">{f.latestRevision.variants.length}</td>
                    <td className="max-w-xs truncate px-4 py-2.5 text-xs" title={plants.join(", ")}>
                      {plants.join(", ")}
                    </td>
                    <td className="px-4 py-2.5 text-right font-mono text-[13px] tabular">
                      {f.latestRevision.number}
                      <span className="text-ink-faint"> / {f.revisionCount}</span>
                    </td>
                    <td className="min-w-40 px-4 py-2.5 text-xs text-ink-soft">
                      {formatDateTime(f.latestRevision.createdAt)} · {f.latestRevision.createdBy.name}
                      <div className={f.latestRevision.note ? "text-ink" : "italic text-ink-faint"}>{f.latestRevision.note ?? "no note"}</div>
                    </td>
                  </tr>
                );
              })}
          </ListTable>
          {archivedCount > 0 ? (
            <label className="mt-3 flex items-center gap-2 text-xs text-ink-soft">
              <input type="checkbox" className="accent-moss" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} data-testid="show-archived-families" />
              Show {archivedCount} archived famil{archivedCount === 1 ? "y" : "ies"}
            </label>
          ) : null}
        </>
      )}
    </ListPage>
  );
}
