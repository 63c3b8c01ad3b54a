import { CHART_COLORS } from "../../components/charts/chart-theme.js";
import type { CriterionId, ReferencesDto } from "@loopyard/core";
import { BOUND_HOVER, BOUND_LABEL, baselineHover, inRange, type BaselinePoint } from "./reference-points.js";

/**
 * A small legend under the front chart, built from the references data: the bound (or why it is not
 * drawn) and each baseline drawn, each with the hover text saying what it is.
 */
export function ReferenceLegend({
  references,
  error,
  bound,
  baselines,
  ranges,
  logAxes,
  x,
  y,
}: {
  references: ReferencesDto | undefined;
  error: Error | null;
  bound: { x: number[]; y: number[] } | null;
  baselines: readonly BaselinePoint[];
  /** The chart's axis ranges (axis-fit.ts; null: autorange): a baseline beyond them is said to be off the chart. */
  ranges: { x: [number, number] | null; y: [number, number] | null };
  logAxes: boolean;
  x: CriterionId;
  y: CriterionId;
}) {
  if (error) return <p className="mt-2 text-xs text-rust">The bound and the baselines could not be loaded ({error.message}); the front is unaffected.</p>;
  if (!references) return null;
  const onBoundAxes = (x === "ise" && y === "effort") || (x === "effort" && y === "ise");
  const hidden = references.baselines.length - baselines.length;
  const offChart = (b: BaselinePoint) => !inRange(b.x, ranges.x, logAxes) || !inRange(b.y, ranges.y, logAxes);
  return (
    <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-soft" data-testid="reference-legend">
      {bound ? (
        <li title={references.bound.note ? `${BOUND_HOVER}\n${references.bound.note}` : BOUND_HOVER} data-testid="reference-bound" className="cursor-help">
          <span className="mr-1 inline-block w-5 border-t-2 border-dashed border-ink-soft align-middle" aria-hidden="true" />
          {BOUND_LABEL}
        </li>
      ) : !references.bound.ok ? (
        <li title={BOUND_HOVER}>No bound: {references.bound.reason}</li>
      ) : !onBoundAxes ? (
        <li title={BOUND_HOVER}>The LQR bound is drawn on ISE against effort only.</li>
      ) : null}
      {baselines.map((b) => (
        <li key={b.label} title={baselineHover(b.label)} data-testid="reference-baseline" className="cursor-help">
          <span className="mr-1 font-mono" style={{ color: CHART_COLORS.slate }} aria-hidden="true">
            ◇
          </span>
          {b.label}
          {offChart(b) ? <span className="text-ink-faint"> (beyond the axes; zoom out)</span> : null}
        </li>
      ))}
      {hidden > 0 ? <li>{hidden} baseline{hidden === 1 ? "" : "s"} without finite scores on these axes</li> : null}
      {bound && references.bound.note ? (
        <li className="basis-full" data-testid="reference-bound-note">
          {references.bound.note}
        </li>
      ) : null}
      {references.baselinesNote && baselines.length > 0 ? (
        <li className="basis-full" data-testid="reference-baselines-note">
          {references.baselinesNote}
        </li>
      ) : null}
      {references.skipped.length > 0 ? (
        <li title={references.skipped.map((s) => `${s.label}: ${s.reason}`).join("\n")} className="cursor-help text-ink-faint">
          {references.skipped.length} rule{references.skipped.length === 1 ? "" : "s"} not applicable (hover for why)
        </li>
      ) : null}
    </ul>
  );
}
