import { useNavigate, useParams } from "react-router";
import { useCreateFamily, useFamily, useReviseFamily } from "../../api/use-families.js";
import { usePlants } from "../../api/use-plants.js";
import { ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { FamilyForm } from "./family-form.js";
import { blankEntry, familyFormFromRevision } from "./family-form-values.js";

/** /w/:slug/families/new and /w/:slug/families/:familyId/revise — save a new family, or its next revision with a change note. */
export function FamilyEditPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { familyId } = useParams();
  const plants = usePlants(slug);
  const family = useFamily(slug, familyId);
  const create = useCreateFamily(slug);
  const revise = useReviseFamily(slug, familyId ?? "");
  const navigate = useNavigate();
  const revising = familyId !== undefined;
  const refusal = workspace.data && !canEdit ? roleSentence(revising ? "Revising families" : "Saving families", "engineer", workspace.data.workspace.name, role) : null;
  const back = revising ? { to: `/w/${slug}/families/${familyId}`, label: family.data?.family.name ?? "Family" } : { to: `/w/${slug}/families`, label: "Families" };
  const title = revising ? `New revision of ${family.data?.family.name ?? "the family"}` : "New family";

  if (plants.isPending || (revising && family.isPending)) return <Loading label="Loading the library…" />;
  const failed = plants.isError ? plants.error : revising && family.isError ? family.error : null;
  if (failed)
    return (
      <>
        <PageHeader title={title} back={back} />
        <ErrorNote error={failed} title="Could not load the library" />
      </>
    );
  const offered = (plants.data ?? []).filter((p) => p.archivedAt === null);
  const first = offered[0];
  if (!first) {
    return (
      <>
        <PageHeader title={title} back={back} />
        <EmptyState title="No plant to build a family from" action={canEdit ? <ButtonLink to={`/w/${slug}/plants/new`} tone="primary">Add a plant</ButtonLink> : null}>
          A family's variants are plant revisions. Add a plant to the library first.
        </EmptyState>
      </>
    );
  }
  const latest = family.data?.family.latestRevision;
  const plantOf = (revisionId: string) => latest?.variants.find((v) => v.plantRevisionId === revisionId)?.plantId ?? first.id;
  const initial = latest ? familyFormFromRevision(latest, plantOf) : { name: "", description: "", note: "", entries: [blankEntry(first.id, first.latestRevision.id, first.name)] };
  return (
    <div data-testid="family-edit-page">
      <PageHeader
        title={title}
        back={back}
        subtitle={
          latest
            ? `Starts from revision ${latest.number}. Revision ${latest.number} stays as it is; sweeps and comparisons on it keep their results.`
            : "Name a product line and list its variants: plant revisions, fixed parameter values of nonlinear plants, or a manufacturing spread drawn from ranges."
        }
      />
      <FamilyForm
        slug={slug}
        plants={offered}
        initial={initial}
        submitLabel={latest ? `Save as revision ${latest.number + 1}` : "Save family"}
        noteRequired={revising}
        refusal={refusal}
        onSubmit={async (input) => {
          const saved = revising ? await revise.mutateAsync(input) : await create.mutateAsync(input);
          navigate(`/w/${slug}/families/${saved.family.id}?revision=${saved.revision.number}`);
        }}
      />
    </div>
  );
}
