import type { ReactNode } from "react";
import { Link, useParams } from "react-router";
import type { CriterionId, DecisionDetailDto } from "@loopyard/core";
import { useDecision } from "../../api/use-decisions.js";
import { CautionNote } from "../../components/caution-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { formatNumber } from "../../components/format-number.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { scenarioSummary } from "../fronts/front-panel.js";
import { criterionShortLabel } from "../fronts/criterion-label.js";
import { aggregateName } from "../fronts/variant-scores-table.js";
import { useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { DecisionActions } from "./decision-actions.js";
import { DecisionExports } from "./decision-exports.js";
import { DecisionScoresTable } from "./decision-scores-table.js";
import { DecisionStateBadge } from "./decision-state-badge.js";
import { DecisionThread } from "./decision-thread.js";
import { DecisionTrail } from "./decision-trail.js";
import { DECISION_STATE_MEANING, regretText, scoreText, sourcePath } from "./decision-text.js";

/**
 * /w/:slug/decisions/:decisionId — a proposal or decision as its record holds it: the family's revisions,
 * the controller and its parameters, the scenario, the scores per variant, the comparison behind it; the
 * actions the signed-in person may take, the comment thread, the audit trail and the exports.
 */
export function DecisionDetailPage() {
  const { decisionId = "" } = useParams();
  const { slug } = useWorkspaceRole();
  const decision = useDecision(slug, decisionId);
  const back = { to: `/w/${slug}/decisions`, label: "Decisions" };
  if (decision.isPending) return <Loading label="Loading the decision…" />;
  if (decision.isError)
    return (
      <div className="space-y-4">
        <PageHeader title="Decision" back={back} />
        <ErrorNote error={decision.error} title="Could not load the decision" />
      </div>
    );
  const d = decision.data;
  const base = `/w/${slug}`;
  return (
    <div className="space-y-6" data-testid="decision-page">
      <PageHeader
        back={back}
        title={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <span>{d.title}</span>
            <DecisionStateBadge state={d.state} />
          </span>
        }
        subtitle={
          <>
            Proposed by {d.proposedBy.name} on {formatDateTime(d.proposedAt)}
            {d.approvedBy && d.approvedAt ? ` · approved by ${d.approvedBy.name} on ${formatDateTime(d.approvedAt)}` : ""} ·{" "}
            <Link to={sourcePath(base, d.source)} className="text-moss hover:underline" data-testid="decision-source-link">
              {d.sourceLabel}
            </Link>
          </>
        }
      />
      <CautionNote testId="decision-caution">
        <strong className="font-semibold">Simulated designs never replace validation on the real machine.</strong> Validate this controller on the real system
        with its safety interlocks in place, and follow your organisation's safety practice and local codes — approved or not.
      </CautionNote>
      <p className="text-sm text-ink-soft" data-testid="decision-state-meaning">
        {DECISION_STATE_MEANING[d.state]}
        {d.supersededBy ? (
          <>
            {" "}
            <Link to={`${base}/decisions/${d.supersededBy}`} className="text-moss hover:underline">
              Open the decision that replaced it
            </Link>
            .
          </>
        ) : null}
        {d.supersedes ? (
          <>
            {" "}
            It replaced{" "}
            <Link to={`${base}/decisions/${d.supersedes}`} className="text-moss hover:underline">
              the family's earlier decision
            </Link>
            .
          </>
        ) : null}
      </p>
      <DecisionActions key={`${d.id}-${d.state}`} slug={slug} decision={d} />

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-5">
        <div className="min-w-0 space-y-6 lg:col-span-3">
          <Section title="Rationale" testId="decision-rationale">
            <p className="whitespace-pre-wrap break-words text-sm">{d.rationale}</p>
          </Section>
          <Section title="Controller" aside={d.record.structure.kind} testId="decision-controller">
            <ParameterList decision={d} />
            <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
              <Term label="Scenario">{scenarioSummary(d.record.scenario)}</Term>
              <Term label="Horizon · step">
                <span className="font-mono">
                  {formatNumber(d.record.scenario.horizon)} s · {formatNumber(d.record.scenario.dt)} s
                </span>
              </Term>
              <Term label="Over the family">{aggregateName(d.record.evaluation.aggregate)}</Term>
            </dl>
          </Section>
          <Section title="Scores on every variant" aside={`${d.record.scores.variants.length} variant${d.record.scores.variants.length === 1 ? "" : "s"}`}>
            <DecisionScoresTable record={d.record} />
          </Section>
          {d.record.comparison ? <ComparisonBehind decision={d} base={base} /> : null}
          <Section title="Family" aside={d.family.name} testId="decision-family">
            <div className="overflow-x-auto">
              <table className="w-full text-sm">
                <thead>
                  <tr className="border-b border-line text-left text-xs text-ink-soft">
                    <th className="px-3 py-1.5 font-medium">Variant</th>
                    <th className="px-3 py-1.5 font-medium">Plant</th>
                    <th className="px-3 py-1.5 font-medium">Revision</th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-line-soft">
                  {d.record.family.variants.map((v) => (
                    <tr key={`${v.label}-${v.revisionId}`}>
                      <td className="whitespace-nowrap px-3 py-1.5">{v.label}</td>
                      <td className="px-3 py-1.5">
                        <Link to={`${base}/plants/${v.plantId}`} className="hover:text-moss">
                          {v.plantName}
                        </Link>
                      </td>
                      <td className="px-3 py-1.5 font-mono text-xs">rev {v.revisionNumber}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </Section>
        </div>
        <div className="min-w-0 space-y-6 lg:col-span-2">
          <Section title="Comments" aside={`${d.comments.length}`}>
            <DecisionThread slug={slug} decision={d} />
          </Section>
          <Section title="Audit trail" aside="every change, who and when">
            <DecisionTrail decision={d} />
          </Section>
          <Section title="Record and deployment sheet">
            <DecisionExports slug={slug} id={d.id} />
          </Section>
        </div>
      </div>
    </div>
  );
}

function Term({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-soft">{label}</dt>
      <dd className="min-w-0">{children}</dd>
    </>
  );
}

/** The controller's parameters by name; tuned ones (the study searched them) marked. */
function ParameterList({ decision }: { decision: DecisionDetailDto }) {
  const { parameters, tuned } = decision.record.structure;
  return (
    <div className="overflow-x-auto">
      <table className="text-sm" data-testid="decision-parameters">
        <tbody>
          {Object.entries(parameters).map(([name, value]) => (
            <tr key={name}>
              <td className="py-0.5 pr-6 font-mono">{name}</td>
              <td className="py-0.5 pr-4 text-right font-mono tabular" data-testid={`decision-parameter-${name}`}>
                {formatNumber(value, 6)}
              </td>
              <td className="py-0.5 text-xs text-ink-faint">{tuned.includes(name) ? "tuned" : "fixed"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The comparison a pick came from: its contender, and the pick's value and regret on every column. */
function ComparisonBehind({ decision, base }: { decision: DecisionDetailDto; base: string }) {
  const c = decision.record.comparison!;
  return (
    <Section title="The comparison behind it" testId="decision-comparison">
      <p className="mb-3 text-sm">
        The pick of <span className="font-medium">{c.contender}</span> in{" "}
        <Link to={`${base}/comparisons/${c.id}`} className="text-moss hover:underline" data-testid="decision-comparison-link">
          {c.name}
        </Link>
        , judged on every column (value, and regret against the column's best pick).
      </p>
      <div className="overflow-x-auto">
        <table className="text-sm">
          <thead>
            <tr className="border-b border-line text-xs text-ink-soft">
              {c.columns.map((col) => (
                <th key={col} className="whitespace-nowrap px-3 py-1.5 text-right font-medium">
                  {criterionShortLabel(col as CriterionId)}
                  {col === c.contender ? " (own)" : ""}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr>
              {c.values.map((v, k) => (
                <td key={k} className="whitespace-nowrap px-3 py-1.5 text-right font-mono text-[13px] tabular">
                  {scoreText(v, formatNumber)}
                  <div className="text-[11px] text-ink-soft">{regretText(c.regrets[k] ?? null)}</div>
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
    </Section>
  );
}
