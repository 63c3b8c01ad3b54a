import type { ComparisonDetailDto } from "@loopyard/core";
import { ProgressBar } from "../../components/progress-bar.js";

const PHASES = [
  { phase: "prescan", label: "Pre-scan: Sobol points shared by every contender, scored on every variant" },
  { phase: "refine", label: "Refinement: each contender's pick, a local search from its best points" },
  { phase: "analyse", label: "Analysis: cross-score, agreement, stability of the answer" },
] as const;

/** Where a running comparison is: its three phases, the pre-scan's and the picks' bars, failures. */
export function ComparisonProgress({ comparison }: { comparison: ComparisonDetailDto }) {
  const p = comparison.progress;
  const at = PHASES.findIndex((s) => s.phase === p.phase);
  return (
    <div className="space-y-3" data-testid="comparison-progress" data-phase={p.phase}>
      <ol className="space-y-1 text-sm">
        {PHASES.map((s, i) => (
          <li key={s.phase} className={i === at ? "font-medium text-ink" : i < at || p.phase === "done" ? "text-moss" : "text-ink-faint"}>
            <span aria-hidden className="mr-2 font-mono">{i < at || p.phase === "done" ? "✓" : i === at ? "›" : "·"}</span>
            {s.label}
          </li>
        ))}
      </ol>
      <div>
        <div className="mb-1 text-xs text-ink-soft">Pre-scan points</div>
        <ProgressBar done={p.prescanDone} total={p.prescanTotal} testId="prescan-progress" />
      </div>
      <div>
        <div className="mb-1 text-xs text-ink-soft">Picks found</div>
        <ProgressBar done={p.picksDone} total={p.picksTotal} testId="picks-progress" />
      </div>
      <p className="text-xs text-ink-soft">{p.workersActive} worker{p.workersActive === 1 ? "" : "s"} active. The comparison survives a restart: what is stored stays, the rest is taken up again.</p>
      {p.failures.length > 0 ? (
        <ul className="text-xs text-rust" data-testid="comparison-failures">
          {p.failures.map((f) => (
            <li key={f.what}>
              {f.what}: {f.error}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
