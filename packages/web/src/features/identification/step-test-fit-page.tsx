import { useEffect } from "react";
import { useNavigate, useParams } from "react-router";
import { useFitStepTest, useSaveIdentifiedPlant, useStepTest } from "../../api/use-step-tests.js";
import { preloadPlot } from "../../components/charts/lazy-plot.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { StepTestWorkbench } from "./step-test-workbench.js";

/** /w/:slug/plants/identify/:stepTestId — choose columns, fit, compare and save an uploaded step test. */
export function StepTestFitPage() {
  useEffect(() => void preloadPlot(), []);
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { stepTestId = "" } = useParams();
  const stepTest = useStepTest(slug, stepTestId);
  const fit = useFitStepTest(slug, stepTestId);
  const save = useSaveIdentifiedPlant(slug, stepTestId);
  const navigate = useNavigate();
  const back = { to: `/w/${slug}/plants/identify`, label: "Upload another file" };
  const refusal = workspace.data && !canEdit ? roleSentence("Fitting step tests", "engineer", workspace.data.workspace.name, role) : null;

  if (stepTest.isPending) return <Loading label="Loading the step test…" />;
  if (stepTest.isError)
    return (
      <>
        <PageHeader title="Step test" back={back} />
        <ErrorNote error={stepTest.error} title="Could not load the step test" />
      </>
    );
  const baseName = stepTest.data.fileName.replace(/\.(csv|tsv|txt)$/i, "");
  return (
    <div data-testid="step-test-fit-page">
      <PageHeader title="Fit a model to the step test" subtitle={`${stepTest.data.fileName}, uploaded by ${stepTest.data.createdBy.name}`} back={back} />
      {refusal ? (
        <RoleNote sentence={refusal} />
      ) : (
        <StepTestWorkbench
          stepTest={stepTest.data}
          initialName={`${baseName} (identified)`}
          saveLabel="Save as a plant"
          onFit={(settings) => fit.mutateAsync({ settings })}
          fitPending={fit.isPending}
          savePending={save.isPending}
          saveError={save.error}
          onSave={async ({ settings, model, name, unitsNote }) => {
            const created = await save.mutateAsync({ settings, model, name, unitsNote }).catch(() => null);
            if (created) navigate(`/w/${slug}/plants/${created.plant.id}`);
          }}
        />
      )}
    </div>
  );
}
