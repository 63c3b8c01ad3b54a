import { useState } from "react";
import { useParams } from "react-router";
import { isComparisonActive, useCancelComparison, useComparison, useComparisonResult } from "../../api/use-comparisons.js";
import { Button, ButtonLink } from "../../components/button.js";
import { CautionNote } from "../../components/caution-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { AgreementMatrix } from "./agreement-matrix.js";
import { ComparisonProgress } from "./comparison-progress.js";
import { ComparisonStatusBadge } from "./comparison-status.js";
import { CrossScoreTable } from "./cross-score-table.js";
import { ProposeDialog, type ProposeTarget } from "../decisions/propose-dialog.js";
import { pickTarget } from "../decisions/propose-targets.js";
import { PerVariantTable } from "./per-variant-table.js";
import { PickOverlays } from "./pick-overlays.js";
import { RegretLegend } from "./regret-legend.js";
import { StabilityTable } from "./stability-table.js";

/** /w/:slug/comparisons/:comparisonId — a comparison's progress, then its answer: summary, cross-score, responses, per variant, agreement, stability. */
export function ComparisonDetailPage() {
  const { comparisonId = "" } = useParams();
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const comparison = useComparison(slug, comparisonId);
  const finished = comparison.data?.status === "finished";
  const result = useComparisonResult(slug, comparisonId, finished);
  const cancel = useCancelComparison(slug, comparisonId);
  const back = { to: `/w/${slug}/comparisons`, label: "Compare criteria" };
  const [proposing, setProposing] = useState<ProposeTarget | null>(null);

  if (comparison.isPending) return <Loading label="Loading the comparison…" />;
  if (comparison.isError)
    return (
      <>
        <PageHeader title="Comparison" back={back} />
        <ErrorNote error={comparison.error} title="Could not load the comparison" />
      </>
    );
  const c = comparison.data;
  const input = c.definition;
  const aggregate = input.aggregate.kind === "percentile" ? `${input.aggregate.p}th percentile` : input.aggregate.kind === "mean" ? "mean" : "worst case";
  const constraints = Object.entries(input.constraints ?? {}).map(([id, limit]) => ("max" in limit ? `${id} ≤ ${limit.max}` : `${id} ≥ ${limit.min}`));
  const active = isComparisonActive(c.status);
  const refusal = workspace.data && !canEdit ? roleSentence("Cancelling comparisons", "engineer", workspace.data.workspace.name, role) : null;

  return (
    <div data-testid="comparison-detail-page" className="space-y-5">
      <PageHeader
        title={
          <span className="flex items-center gap-3">
            {c.name} <ComparisonStatusBadge status={c.status} />
          </span>
        }
        subtitle={
          <span data-testid="comparison-setup">
            {c.structure.toUpperCase()} on {c.family.length} variant{c.family.length === 1 ? "" : "s"} ({c.family.map((v) => v.label).join(", ")}), {aggregate} over the family
            {constraints.length > 0 ? `, subject to ${constraints.join(", ")} on every variant` : ""}. Started {formatDateTime(c.createdAt)} by {c.createdBy.name}.
          </span>
        }
        back={back}
        actions={
          <>
            {active ? (
              <Button tone="danger" disabled={Boolean(refusal) || cancel.isPending} title={refusal ?? undefined} onClick={() => cancel.mutate()} data-testid="cancel-comparison">
                {cancel.isPending ? "Cancelling…" : "Cancel"}
              </Button>
            ) : null}
            <ButtonLink to={`/w/${slug}/comparisons/new?from=${c.id}`} tone="quiet" disabledReason={canEdit ? null : roleSentence("Starting comparisons", "engineer", workspace.data?.workspace.name, role)}>
              Run again with changes
            </ButtonLink>
          </>
        }
      />
      {cancel.isError ? <ErrorNote error={cancel.error} title="The comparison was not cancelled" /> : null}
      {c.status === "failed" ? <ErrorNote error={new Error(c.error ?? "The comparison failed.")} title="The comparison failed" /> : null}
      {active || c.status === "failed" || c.status === "cancelled" ? (
        <Section title={active ? "Working on it" : "Where it stopped"}>
          <ComparisonProgress comparison={c} />
        </Section>
      ) : null}
      {finished ? (
        result.isPending ? (
          <Loading label="Loading the result…" />
        ) : result.isError ? (
          <ErrorNote error={result.error} title="Could not load the result" />
        ) : (
          <>
            <Section title="In short" testId="comparison-summary">
              <ul className="list-disc gap-x-8 space-y-1 pl-5 text-sm leading-snug text-ink xl:columns-2">
                {result.data.summary.map((line) => (
                  <li key={line}>{line}</li>
                ))}
              </ul>
            </Section>
            <Section title="Cross-score: each contender's pick judged on every criterion" aside={`${aggregate} over ${c.family.length} variant${c.family.length === 1 ? "" : "s"}`}>
              <p className="mb-3 text-sm text-ink-soft">
                Read a row as one candidate design — the best one its criterion finds in the box — and each column as a criterion the team cares about. A contender's own column is outlined; its regret there is 0 by construction. Click a column to sort the picks by it.
              </p>
              <CrossScoreTable result={result.data} onPropose={canEdit ? (contender, label) => setProposing(pickTarget(c, contender, label)) : undefined} />
              <div className="mt-3">
                <RegretLegend />
              </div>
            </Section>
            <Section title="Side by side: the picks' responses">
              <PickOverlays
                slug={slug}
                comparisonId={c.id}
                variants={result.data.variants}
                labels={result.data.picks.map((p) => p.contender)}
                names={result.data.picks.map((p, k) => result.data.columns[k]?.label ?? p.contender)}
              />
            </Section>
            <Section title="On every variant" aside="▲ the variant that sets the pick's worst value of the column">
              <PerVariantTable result={result.data} />
            </Section>
            <Section title="Stability of the answer" aside="◆ a pick that moves more than 10 %: a knife-edge answer">
              <StabilityTable result={result.data} />
            </Section>
            <Section title="Agreement of the criteria" aside="Kendall's τ over the pre-scan">
              <AgreementMatrix result={result.data} />
            </Section>
            <CautionNote />
            <ProposeDialog slug={slug} target={proposing} onClose={() => setProposing(null)} />
          </>
        )
      ) : null}
    </div>
  );
}
