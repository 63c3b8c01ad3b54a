import { useEffect } from "react";
import { useNavigate, useParams } from "react-router";
import { usePlant } from "../../api/use-plants.js";
import { useFitStepTest, useRefitPlant, useStepTest } from "../../api/use-step-tests.js";
import { preloadPlot } from "../../components/charts/lazy-plot.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { StepTestWorkbench } from "./step-test-workbench.js";

/** /w/:slug/plants/:plantId/refit — fit an identified plant again from its step test, as a new revision. */
export function PlantRefitPage() {
  useEffect(() => void preloadPlot(), []);
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { plantId = "" } = useParams();
  const plant = usePlant(slug, plantId);
  const model = plant.data?.revision.model;
  const provenance = model?.kind === "identified" ? model.identification : undefined;
  const stepTest = useStepTest(slug, provenance?.stepTestId);
  const fit = useFitStepTest(slug, provenance?.stepTestId ?? "");
  const refit = useRefitPlant(slug, plantId);
  const navigate = useNavigate();
  const back = { to: `/w/${slug}/plants/${plantId}`, label: "Plant" };
  const refusal = workspace.data && !canEdit ? roleSentence("Refitting plants", "engineer", workspace.data.workspace.name, role) : null;

  if (plant.isPending || (provenance && stepTest.isPending)) return <Loading label="Loading the plant and its step test…" />;
  const failed = plant.error ?? stepTest.error;
  if (failed) return (
    <>
      <PageHeader title="Refit" back={back} />
      <ErrorNote error={failed} title="Could not load the plant or its step test" />
    </>
  );
  if (!provenance || !stepTest.data) {
    return (
      <>
        <PageHeader title="Refit" back={back} />
        <p className="text-sm text-ink-soft">This plant was not identified from a step test, so there is nothing to refit. Open “New revision” to edit its model.</p>
      </>
    );
  }
  return (
    <div data-testid="plant-refit-page">
      <PageHeader title={`Refit ${plant.data!.revision.name}`} subtitle={`From ${provenance.fileName}; the new fit becomes a new revision, and earlier revisions stay as they are.`} back={back} />
      {refusal ? (
        <RoleNote sentence={refusal} />
      ) : (
        <StepTestWorkbench
          stepTest={stepTest.data}
          initial={provenance.settings}
          initialModel={provenance.fit.model}
          initialName={plant.data!.revision.name}
          saveLabel="Save as a new revision"
          onFit={(settings) => fit.mutateAsync({ settings })}
          fitPending={fit.isPending}
          savePending={refit.isPending}
          saveError={refit.error}
          onSave={async ({ settings, model: kind, name, unitsNote }) => {
            const saved = await refit.mutateAsync({ settings, model: kind, name, unitsNote }).catch(() => null);
            if (saved) navigate(`/w/${slug}/plants/${plantId}`);
          }}
        />
      )}
    </div>
  );
}
