import { useNavigate } from "react-router";
import { useCreatePlant } from "../../api/use-plants.js";
import { PageHeader } from "../../components/page-header.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { PlantForm } from "./plant-form.js";
import { EMPTY_PLANT_FORM } from "./plant-form-values.js";

/** /w/:slug/plants/new */
export function PlantNewPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const create = useCreatePlant(slug);
  const navigate = useNavigate();
  const refusal = workspace.data && !canEdit ? roleSentence("Creating plants", "engineer", workspace.data.workspace.name, role) : null;

  return (
    <div data-testid="plant-new-page">
      <PageHeader
        title="New plant"
        subtitle="A model from the actuator input u to the measured output y: a transfer function, a state-space model or nonlinear equations."
        back={{ to: `/w/${slug}/plants`, label: "Library" }}
      />
      <PlantForm
        initial={EMPTY_PLANT_FORM}
        submitLabel="Create plant"
        pendingLabel="Creating…"
        refusal={refusal}
        onSubmit={async (input) => {
          const created = await create.mutateAsync(input);
          navigate(`/w/${slug}/plants/${created.plant.id}`);
        }}
      />
    </div>
  );
}
