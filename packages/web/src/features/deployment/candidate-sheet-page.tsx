import { useParams, useSearchParams } from "react-router";
import { useCandidateSheet } from "../../api/use-deployment-sheet.js";
import { useSweep } from "../../api/use-sweeps.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatNumber } from "../../components/format-number.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { DeploymentSheetView } from "./deployment-sheet-view.js";
import { SheetControls } from "./sheet-controls.js";
import { sheetQuery, sheetSettingsFrom } from "./sheet-settings.js";

/** /w/:slug/sweeps/:sweepId/candidates/:index/sheet — a candidate's controller in the forms firmware needs. */
export function CandidateSheetPage() {
  const { slug = "", sweepId = "", index = "" } = useParams();
  const [params, setParams] = useSearchParams();
  const settings = sheetSettingsFrom(params);
  const candidate = Number(index);
  const sweep = useSweep(slug, sweepId);
  const sheet = useCandidateSheet(slug, sweepId, candidate, settings);
  const back = { to: `/w/${slug}/sweeps/${sweepId}`, label: sweep.data ? sweep.data.name : "Sweep" };
  const params_ = sheet.data ? Object.entries(sheet.data.controller.parameters) : [];
  return (
    <>
      <PageHeader
        back={back}
        title={`Deployment sheet of candidate #${index}`}
        subtitle={
          sheet.data ? (
            <span className="font-mono text-xs">
              {sheet.data.controller.kind} · {params_.map(([name, value]) => `${name} = ${formatNumber(value)}`).join(" · ")}
            </span>
          ) : (
            "The controller in parallel, ideal and series form, its difference equations and what sampling and rounding change."
          )
        }
      />
      <div className="space-y-6">
        <SheetControls
          key={sheetQuery(settings)}
          settings={settings}
          busy={sheet.isFetching}
          onChange={(next) => setParams(new URLSearchParams(sheetQuery(next)), { replace: true })}
        />
        {sheet.isPending ? (
          <Loading label="Discretising the controller and re-simulating every variant…" />
        ) : sheet.isError ? (
          <ErrorNote error={sheet.error} title="No sheet at these settings" hint="Change the sample time, method or format above and show the sheet again." />
        ) : (
          <DeploymentSheetView sheet={sheet.data} />
        )}
      </div>
    </>
  );
}
