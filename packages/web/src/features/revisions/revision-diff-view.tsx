import type { RevisionChange, RevisionChangeGroup, RevisionDiffDto } from "@loopyard/core";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { changeValueText, GROUP_LABELS } from "./revision-diff-text.js";

const MARKS: Record<RevisionChange["change"], { sign: string; tone: string; label: string }> = {
  added: { sign: "+", tone: "text-moss", label: "added" },
  removed: { sign: "−", tone: "text-rust", label: "removed" },
  changed: { sign: "~", tone: "text-ink", label: "changed" },
};

/** Two revision pickers and the changes between them, grouped (coefficients, matrices, expressions, limits, variants …). */
export function RevisionDiffView({
  numbers,
  from,
  to,
  onChange,
  query,
}: {
  numbers: readonly number[];
  from: number;
  to: number;
  onChange: (from: number, to: number) => void;
  query: { isPending: boolean; isError: boolean; error: unknown; data?: RevisionDiffDto | undefined };
}) {
  const select = (value: number, set: (n: number) => void, testId: string) => (
    <select
      className="rounded border border-line bg-white px-2 py-1 font-mono text-xs"
      value={value}
      data-testid={testId}
      onChange={(e) => set(Number(e.target.value))}
    >
      {numbers.map((n) => (
        <option key={n} value={n}>
          rev {n}
        </option>
      ))}
    </select>
  );
  const groups = new Map<RevisionChangeGroup, RevisionChange[]>();
  for (const c of query.data?.changes ?? []) groups.set(c.group, [...(groups.get(c.group) ?? []), c]);
  return (
    <div data-testid="revision-diff">
      <div className="mb-3 flex items-center gap-2 text-xs text-ink-soft">
        From {select(from, (n) => onChange(n, to), "diff-from")} to {select(to, (n) => onChange(from, n), "diff-to")}
      </div>
      {query.isPending ? <Loading label="Comparing the revisions…" /> : null}
      {query.isError ? <ErrorNote error={query.error} title="Could not compare the revisions" /> : null}
      {query.data && query.data.changes.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="diff-empty">
          {from === to ? "Choose two different revisions to see what changed." : `Revisions ${from} and ${to} are the same in every field.`}
        </p>
      ) : null}
      {[...groups.entries()].map(([group, changes]) => (
        <div key={group} className="mb-3">
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">{GROUP_LABELS[group]}</h3>
          <ul className="space-y-1 text-sm">
            {changes.map((c) => (
              <li key={c.field} className="grid grid-cols-[1.2rem_1fr] gap-x-2" data-testid="diff-change">
                <span className={`font-mono ${MARKS[c.change].tone}`} aria-label={MARKS[c.change].label}>
                  {MARKS[c.change].sign}
                </span>
                <span className="font-mono text-xs font-medium">{c.field}</span>
                <span className="col-start-2 break-words font-mono text-xs">
                  {c.change !== "added" ? <span className="text-rust line-through decoration-rust/50">{changeValueText(c.before)}</span> : null}
                  {c.change === "changed" ? <span className="px-1 text-ink-faint">→</span> : null}
                  {c.change !== "removed" ? <span className="text-moss">{changeValueText(c.after)}</span> : null}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </div>
  );
}
