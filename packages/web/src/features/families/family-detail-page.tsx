import { useState } from "react";
import { Link, useParams, useSearchParams } from "react-router";
import { useArchiveFamily, useFamily, useFamilyDiff } from "../../api/use-families.js";
import { ButtonLink } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { ArchiveControl } from "../revisions/archive-control.js";
import { ExportButton, libraryFileName } from "../library/export-button.js";
import { RevisionDiffView } from "../revisions/revision-diff-view.js";
import { RevisionList } from "../revisions/revision-list.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { FamilyVariantsTable } from "./family-variants-table.js";
import { spreadSummary } from "./spread-summary.js";

/** /w/:slug/families/:familyId[?revision=N] — one revision of a family: its variants, entries, revisions, what changed and who uses it. */
export function FamilyDetailPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const { familyId = "" } = useParams();
  const [params] = useSearchParams();
  const revisionParam = params.get("revision");
  const revision = revisionParam !== null && /^\d+$/.test(revisionParam) ? Number(revisionParam) : undefined;
  const family = useFamily(slug, familyId, revision);
  const archive = useArchiveFamily(slug, familyId);
  const shownNumber = family.data?.revision.number ?? 1;
  const [pair, setPair] = useState<{ from: number; to: number } | null>(null);
  const diffFrom = pair?.from ?? Math.max(1, shownNumber - 1);
  const diffTo = pair?.to ?? shownNumber;
  const diff = useFamilyDiff(slug, familyId, diffFrom, diffTo);
  const base = `/w/${slug}`;
  const back = { to: `${base}/families`, label: "Families" };

  if (family.isPending) return <Loading label="Loading the family…" />;
  if (family.isError)
    return (
      <>
        <PageHeader title="Family" back={back} />
        <ErrorNote error={family.error} title={revision === undefined ? "Could not load the family" : `Could not load revision ${revision}`} />
      </>
    );

  const { family: summary, revision: shown, revisions, usedBy } = family.data;
  const isLatest = shown.number === summary.latestRevision.number;
  const refusal = workspace.data && !canEdit ? roleSentence("Revising families", "engineer", workspace.data.workspace.name, role) : null;
  const runRefusal = workspace.data && !canEdit ? roleSentence("Running sweeps", "engineer", workspace.data.workspace.name, role) : null;

  return (
    <div data-testid="family-detail-page">
      <PageHeader
        title={shown.name}
        back={back}
        subtitle={
          <>
            Revision <span className="font-mono">{shown.number}</span> of <span className="font-mono">{summary.revisionCount}</span> · {shown.variants.length} variants · saved{" "}
            {formatDateTime(shown.createdAt)} by {shown.createdBy.name}
            {isLatest ? null : (
              <>
                {" "}
                ·{" "}
                <Link to={`${base}/families/${summary.id}`} className="text-moss hover:underline">
                  show the latest
                </Link>
              </>
            )}
          </>
        }
        actions={
          <>
            <ButtonLink to={`${base}/sweeps/new?family=${shown.id}`} tone="quiet" testId="sweep-this-family" disabledReason={runRefusal}>
              Sweep this family
            </ButtonLink>
            <ExportButton slug={slug} family={summary.id} fileName={libraryFileName(summary.name)} />
            <ArchiveControl archivedAt={summary.archivedAt} what="family" refusal={refusal ? roleSentence("Archiving families", "engineer", workspace.data?.workspace.name, role) : null} mutation={archive} />
            <ButtonLink to={`${base}/families/${summary.id}/revise`} tone="primary" disabledReason={refusal} testId="revise-family">
              New revision
            </ButtonLink>
          </>
        }
      />
      {summary.archivedAt ? (
        <p role="note" className="mb-4 rounded-md border border-line bg-sheet px-4 py-2 text-sm text-ink-soft" data-testid="archived-note">
          Archived {formatDateTime(summary.archivedAt)}: new sweeps and comparisons do not offer it; the studies below keep the revision they used. Restore it to offer it again.
        </p>
      ) : null}
      {isLatest ? null : (
        <p role="note" className="mb-4 rounded-md border border-line bg-sheet px-4 py-2 text-sm text-ink-soft">
          You are looking at an earlier revision. It stays unchanged; sweeps and comparisons that used it keep their results.
        </p>
      )}
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-5">
        <div className="space-y-6 lg:col-span-3">
          <Section title="Variants" aside={`${shown.variants.length} — what a sweep on this revision simulates, in this order`} testId="family-variants">
            {shown.description ? <p className="mb-3 text-sm text-ink-soft">{shown.description}</p> : null}
            <FamilyVariantsTable slug={slug} variants={shown.variants} />
          </Section>
          <Section title="How the variants are made" aside="entries of this revision" testId="family-entries">
            <ol className="space-y-1.5 text-sm">
              {shown.definition.entries.map((entry, i) => {
                const plant = shown.variants.find((v) => v.plantRevisionId === entry.plantRevisionId);
                return (
                  <li key={i} className="flex flex-wrap gap-x-2">
                    <span className="font-mono text-xs text-ink-faint">{i + 1}.</span>
                    <span className="font-medium">{entry.label ?? plant?.plantName}</span>
                    <span className="text-xs text-ink-soft">
                      {plant?.plantName} rev {plant?.revisionNumber}
                      {entry.parameters ? ` · fixed ${Object.entries(entry.parameters).map(([k, v]) => `${k} = ${v}`).join(", ")}` : ""}
                    </span>
                    {entry.spread ? <span className="w-full pl-5 font-mono text-xs text-moss">{spreadSummary(entry.spread)}</span> : null}
                  </li>
                );
              })}
            </ol>
          </Section>
          <Section title="Sweeps and comparisons on this family" testId="family-used-by">
            {usedBy.length === 0 ? (
              <p className="text-sm text-ink-soft">None yet. Choose this family on a new sweep or comparison; it keeps the revision it used.</p>
            ) : (
              <ul className="space-y-1 text-sm">
                {usedBy.map((u) => (
                  <li key={u.id} className="flex justify-between gap-3">
                    <Link to={`${base}/${u.kind === "sweep" ? "sweeps" : "comparisons"}/${u.id}`} className="hover:text-moss">
                      {u.name}
                    </Link>
                    <span className="text-xs text-ink-soft">
                      {u.kind} · rev {u.revisionNumber}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </Section>
        </div>
        <div className="space-y-6 lg:col-span-2">
          <Section title="Revisions" testId="revision-list">
            <RevisionList revisions={revisions} shown={shown.number} linkTo={(n) => `${base}/families/${summary.id}?revision=${n}`} />
          </Section>
          <Section title="What changed" aside="between two revisions" testId="family-diff">
            {revisions.length < 2 ? (
              <p className="text-sm text-ink-soft">One revision so far. Each new revision says what changed, and shows it here variant by variant.</p>
            ) : (
              <RevisionDiffView numbers={revisions.map((r) => r.number)} from={diffFrom} to={diffTo} onChange={(from, to) => setPair({ from, to })} query={diff} />
            )}
          </Section>
        </div>
      </div>
    </div>
  );
}
