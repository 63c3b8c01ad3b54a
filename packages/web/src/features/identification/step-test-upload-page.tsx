import { useEffect, useState } from "react";
import { useNavigate } from "react-router";
import { MAX_STEP_TEST_BYTES } from "@loopyard/core";
import { useUploadStepTest } from "../../api/use-step-tests.js";
import { Button } from "../../components/button.js";
import { preloadPlot } from "../../components/charts/lazy-plot.js";
import { ErrorNote } from "../../components/error-note.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";

/** /w/:slug/plants/identify — upload a step test (CSV or TSV) to identify a plant from it. */
export function StepTestUploadPage() {
  useEffect(() => void preloadPlot(), []);
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const upload = useUploadStepTest(slug);
  const navigate = useNavigate();
  const [file, setFile] = useState<File | null>(null);
  const tooBig = file !== null && file.size > MAX_STEP_TEST_BYTES;
  const refusal = workspace.data && !canEdit ? roleSentence("Uploading step tests", "engineer", workspace.data.workspace.name, role) : null;

  return (
    <div data-testid="step-test-upload-page">
      <PageHeader
        title="Identify a plant from a step test"
        subtitle="Upload the measured input and output around one step of the input; Loopyard fits first-order, second-order and integrating models with dead time to it."
        back={{ to: `/w/${slug}/plants`, label: "Library" }}
      />
      {refusal ? (
        <RoleNote sentence={refusal} />
      ) : (
        <Section title="Step-test file">
          <form
            className="space-y-4"
            onSubmit={(event) => {
              event.preventDefault();
              if (!file || tooBig) return;
              upload.mutate(file, { onSuccess: (stored) => navigate(`/w/${slug}/plants/identify/${stored.id}`) });
            }}
          >
            <div>
              <label htmlFor="step-test-file" className="mb-1 block text-xs font-medium text-ink-soft">
                CSV or TSV, at most 10 MB
              </label>
              <input
                id="step-test-file"
                type="file"
                accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values"
                data-testid="step-test-file"
                className="block text-sm"
                onChange={(event) => {
                  upload.reset();
                  setFile(event.target.files?.[0] ?? null);
                }}
              />
              {tooBig ? (
                <p role="alert" className="mt-1 text-xs text-rust">
                  {file?.name} is {(file!.size / 1024 / 1024).toFixed(1)} MB; cut it to the step or thin its rows to stay under 10 MB.
                </p>
              ) : (
                <p className="mt-1 text-xs text-ink-faint">
                  One row per sample: a time column, the input (e.g. heater power) and the output (e.g. plate temperature); a header line is optional. Comma, tab or
                  semicolon separated; decimal commas are read in tab- and semicolon-separated files.
                </p>
              )}
            </div>
            {upload.isError ? <ErrorNote error={upload.error} title="The file was not accepted" testId="upload-error" hint="Correct the row and column named above and upload the file again." /> : null}
            <Button type="submit" tone="primary" disabled={!file || tooBig || upload.isPending} data-testid="upload-step-test">
              {upload.isPending ? "Uploading…" : "Upload and choose columns"}
            </Button>
          </form>
        </Section>
      )}
    </div>
  );
}
