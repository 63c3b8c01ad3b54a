import { LazyPlot } from "./lazy-plot.js";
import { CHART_CONFIG, axis, baseLayout } from "./chart-theme.js";

export interface TimeSeries {
  name: string;
  t: readonly number[];
  values: readonly number[];
  color: string;
  dash?: "solid" | "dash" | "dot";
}

/** Signals over time on one shared time axis [s]. Takes plain arrays. */
export function TimeChart({ series, yTitle, height = 280, testId }: { series: TimeSeries[]; yTitle: string; height?: number; testId?: string }) {
  const data = series.map((s) => ({
    type: "scatter",
    mode: "lines",
    name: s.name,
    x: s.t,
    y: s.values,
    line: { color: s.color, width: 2, dash: s.dash ?? "solid" },
    hovertemplate: `${s.name}: %{y:.4g}<br>t = %{x:.4g} s<extra></extra>`,
  }));
  return (
    <div data-testid={testId}>
      <LazyPlot
        height={height}
        data={data}
        layout={baseLayout({ xaxis: axis("time t [s]"), yaxis: axis(yTitle), showlegend: series.length > 1 })}
        config={CHART_CONFIG}
      />
    </div>
  );
}
