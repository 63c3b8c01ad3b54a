import type { ReactNode } from "react";
import { Link } from "react-router";
import type { WorkspaceHomeDto } from "@loopyard/core";
import { ButtonLink } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { ProgressBar } from "../../components/progress-bar.js";
import { Section } from "../../components/section.js";
import { WaitingCard } from "../decisions/waiting-card.js";
import { SweepStatusBadge } from "../sweeps/sweep-status.js";
import { roleSentence, useWorkspaceRole } from "./use-workspace-role.js";

/** /w/:slug — counts, what to do next, recent sweeps and members. */
export function WorkspaceHomePage() {
  const { slug, workspace, canEdit } = useWorkspaceRole();
  if (workspace.isPending) return <Loading />;
  if (workspace.isError) return <ErrorNote error={workspace.error} title="Could not load the workspace" />;
  const home = workspace.data;
  const base = `/w/${slug}`;

  return (
    <div data-testid="workspace-home">
      <PageHeader title={home.workspace.name} subtitle={<>You are {article(home.role)} <strong className="font-medium text-ink">{home.role}</strong> here.</>} />

      <div className="mb-6 grid grid-cols-3 gap-2 sm:gap-4">
        <Count label="Plants in the library" value={home.counts.plants} to={`${base}/plants`} testId="count-plants" />
        <Count label="Sweeps" value={home.counts.sweeps} to={`${base}/sweeps`} testId="count-sweeps" />
        <Count label="Members" value={home.counts.members} to={`${base}/members`} testId="count-members" />
      </div>

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-2">
          <WaitingCard slug={slug} />
          <Section title="What to do next" testId="next-steps">
            <NextSteps home={home} base={base} canEdit={canEdit} />
          </Section>
          <Section title="Recent sweeps" aside={<Link to={`${base}/sweeps`} className="hover:text-moss">All sweeps →</Link>} testId="recent-sweeps">
            {home.recentSweeps.length === 0 ? (
              <p className="text-sm text-ink-soft">No sweeps yet. A sweep runs a grid of PID gains on one plant revision and scores every candidate.</p>
            ) : (
              <ul className="divide-y divide-line-soft">
                {home.recentSweeps.map((s) => (
                  <li key={s.id} className="flex flex-wrap items-center gap-x-4 gap-y-1.5 py-2.5">
                    <div className="min-w-0 basis-full sm:basis-auto sm:flex-1">
                      <Link to={`${base}/sweeps/${s.id}`} className="font-medium hover:text-moss">
                        {s.name}
                      </Link>
                      <div className="text-xs text-ink-soft">
                        {s.plant.name} · rev {s.plant.revisionNumber} · {formatDateTime(s.createdAt)} · {s.createdBy.name}
                      </div>
                    </div>
                    <div className="w-40 max-w-[60%]">
                      <ProgressBar done={s.done} total={s.total} compact />
                    </div>
                    <SweepStatusBadge status={s.status} />
                  </li>
                ))}
              </ul>
            )}
          </Section>
        </div>
        <div className="self-start">
        <Section title="Members" aside={<Link to={`${base}/members`} className="hover:text-moss">{home.role === "admin" ? "Invite and manage →" : "All members →"}</Link>} testId="members">
          <ul className="space-y-2">
            {home.members.map((m) => (
              <li key={m.user.id} className="flex items-center justify-between gap-3 text-sm">
                <div className="min-w-0">
                  <div className="truncate font-medium">{m.user.name}</div>
                  <div className="truncate text-xs text-ink-soft">{m.user.email}</div>
                </div>
                <span className="shrink-0 rounded border border-line px-1.5 py-px font-mono text-[11px] text-ink-soft">{m.role}</span>
              </li>
            ))}
          </ul>
        </Section>
        </div>
      </div>
    </div>
  );
}

function article(word: string): string {
  return /^[aeiou]/i.test(word) ? "an" : "a";
}

function Count({ label, value, to, testId }: { label: string; value: number; to?: string; testId: string }) {
  const body = (
    <>
      <div className="font-mono text-2xl tabular text-ink">{value}</div>
      <div className="mt-0.5 text-xs text-ink-soft">{label}</div>
    </>
  );
  const className = "block min-w-0 rounded-lg border border-line bg-sheet px-3 py-3 sm:px-4";
  return to ? (
    <Link to={to} className={`${className} hover:border-moss/60`} data-testid={testId}>
      {body}
    </Link>
  ) : (
    <div className={className} data-testid={testId}>
      {body}
    </div>
  );
}

function NextSteps({ home, base, canEdit }: { home: WorkspaceHomeDto; base: string; canEdit: boolean }) {
  const latest = home.recentSweeps.find((s) => s.status === "finished");
  if (!canEdit) {
    return (
      <div className="space-y-3 text-sm">
        <p className="text-ink-soft">
          {roleSentence("Adding plants and running sweeps", "engineer", home.workspace.name, home.role)} You can read the whole library and every sweep;
          ask an admin of this workspace for the engineer role to contribute.
        </p>
        {latest ? (
          <ButtonLink to={`${base}/sweeps/${latest.id}`} tone="quiet">
            Open the front of “{latest.name}”
          </ButtonLink>
        ) : (
          <ButtonLink to={`${base}/plants`} tone="quiet">
            Browse the library
          </ButtonLink>
        )}
      </div>
    );
  }
  if (home.counts.plants === 0) {
    return (
      <div className="space-y-4">
        <Step text="Start the library: type a plant as a transfer function with dead time, a state-space model or nonlinear equations.">
          <ButtonLink to={`${base}/plants/new`} tone="primary">
            Add the first plant
          </ButtonLink>
        </Step>
        <Step text="Or upload a step test (CSV or TSV) and fit a first-order, second-order or integrating model with dead time to it.">
          <ButtonLink to={`${base}/plants/identify`} tone="quiet">
            Upload a step test
          </ButtonLink>
        </Step>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <Step text="Sweep a controller's parameters (P, PI, PID, two-degree-of-freedom PID, lead–lag or state feedback) on a plant or a family of variants, under setpoint and load steps, scored on the criteria you pick, with the LQR bound and published tuning rules beside the front.">
        <ButtonLink to={`${base}/sweeps/new`} tone="primary">
          New sweep
        </ButtonLink>
      </Step>
      {latest ? (
        <Step text={`See which candidates of “${latest.name}” trade performance against effort best.`}>
          <ButtonLink to={`${base}/sweeps/${latest.id}`} tone="quiet">
            Open its front
          </ButtonLink>
        </Step>
      ) : null}
      <Step text="Pit criteria against each other on a family: each contender's best design, judged on every criterion and every variant.">
        <ButtonLink to={`${base}/comparisons/new`} tone="quiet">
          Compare criteria
        </ButtonLink>
      </Step>
      <Step text="Add a plant to the library by typing it or by fitting a model to a step test, or revise an existing one.">
        <span className="flex gap-2">
          <ButtonLink to={`${base}/plants/identify`} tone="quiet">
            Upload a step test
          </ButtonLink>
          <ButtonLink to={`${base}/plants/new`} tone="quiet">
            New plant
          </ButtonLink>
        </span>
      </Step>
    </div>
  );
}

function Step({ text, children }: { text: string; children: ReactNode }) {
  return (
    <div className="flex flex-col items-start gap-2 sm:flex-row sm:items-center sm:justify-between sm:gap-4">
      <p className="text-sm text-ink-soft">{text}</p>
      <div className="shrink-0">{children}</div>
    </div>
  );
}
