import type { StepModelKind } from "@loopyard/core";
import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import { STEP_MODEL_LABELS } from "./fit-parameter-text.js";

const MODEL_COLORS: Record<StepModelKind, string> = { fopdt: CHART_COLORS.moss, sopdt: CHART_COLORS.slate, ipdt: CHART_COLORS.rust };

/**
 * The measured output with each fitted model's output on it (upper panel) and the residuals
 * y − ŷ under it (lower panel), on one time axis. Takes plain arrays.
 */
export function FitChart({
  t,
  measured,
  fits,
  outputLabel,
  testId = "fit-chart",
}: {
  t: readonly number[];
  measured: readonly number[];
  fits: { kind: StepModelKind; fitted: readonly number[]; residuals: readonly number[]; chosen: boolean }[];
  outputLabel: string;
  testId?: string;
}) {
  const data: Record<string, unknown>[] = [
    { type: "scatter", mode: "markers", name: "measured y", x: t, y: measured, marker: { color: CHART_COLORS.inkSoft, size: 3, opacity: 0.6 }, hovertemplate: "y = %{y:.4g}<br>t = %{x:.4g} s<extra></extra>" },
  ];
  for (const fit of fits) {
    const color = MODEL_COLORS[fit.kind];
    const name = STEP_MODEL_LABELS[fit.kind].label;
    data.push({ type: "scatter", mode: "lines", name, x: t, y: fit.fitted, line: { color, width: fit.chosen ? 2.5 : 1.2, dash: fit.chosen ? "solid" : "dot" }, hovertemplate: `${fit.kind.toUpperCase()}: %{y:.4g}<extra></extra>` });
    data.push({ type: "scatter", mode: "lines", name: `${name} residual`, showlegend: false, x: t, y: fit.residuals, xaxis: "x", yaxis: "y2", line: { color, width: fit.chosen ? 1.5 : 0.8 }, hovertemplate: `residual ${fit.kind.toUpperCase()}: %{y:.3g}<extra></extra>` });
  }
  return (
    <div data-testid={testId}>
      <LazyPlot
        height={420}
        data={data}
        layout={baseLayout({
          xaxis: axis("time t [s]", { anchor: "y2" }),
          yaxis: axis(outputLabel, { domain: [0.36, 1] }),
          yaxis2: axis("y − ŷ", { domain: [0, 0.26] }),
          showlegend: true,
        })}
        config={CHART_CONFIG}
      />
    </div>
  );
}
