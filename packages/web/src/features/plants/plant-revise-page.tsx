import { useNavigate, useParams } from "react-router";
import { useCreateRevision, usePlant } from "../../api/use-plants.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { PlantForm } from "./plant-form.js";
import { plantFormFromRevision } from "./plant-form-values.js";

/** /w/:slug/plants/:plantId/revise — the latest revision prefilled; saving makes a new immutable revision. */
export function PlantRevisePage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { plantId = "" } = useParams();
  const plant = usePlant(slug, plantId);
  const revise = useCreateRevision(slug, plantId);
  const navigate = useNavigate();
  const refusal = workspace.data && !canEdit ? roleSentence("Revising plants", "engineer", workspace.data.workspace.name, role) : null;
  const back = { to: `/w/${slug}/plants/${plantId}`, label: plant.data?.plant.name ?? "Plant" };

  if (plant.isPending) return <Loading label="Loading the plant…" />;
  if (plant.isError)
    return (
      <>
        <PageHeader title="New revision" back={back} />
        <ErrorNote error={plant.error} title="Could not load the plant" />
      </>
    );

  const latest = plant.data.plant.latestRevision;
  return (
    <div data-testid="plant-revise-page">
      <PageHeader
        title={`New revision of ${plant.data.plant.name}`}
        subtitle={`Starts from revision ${latest.number}. Revision ${latest.number} stays as it is; sweeps that use it keep their results.`}
        back={back}
      />
      <PlantForm
        initial={plantFormFromRevision(latest)}
        submitLabel={`Save as revision ${latest.number + 1}`}
        pendingLabel="Saving…"
        refusal={refusal}
        noteRequired
        onSubmit={async (input) => {
          const created = await revise.mutateAsync(input);
          navigate(`/w/${slug}/plants/${plantId}?revision=${created.revision.number}`);
        }}
      />
    </div>
  );
}
