import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";

/**
 * A closed-loop setpoint-step response: output y(t) against setpoint r(t) in the upper panel,
 * controller output u(t) in the lower one, on one shared time axis. Takes plain arrays.
 */
export function ResponseChart({ t, r, y, u }: { t: readonly number[]; r: readonly number[]; y: readonly number[]; u: readonly number[] }) {
  const line = (name: string, values: readonly number[], color: string, yaxis: string, dash = "solid") => ({
    type: "scatter",
    mode: "lines",
    name,
    x: t,
    y: values,
    xaxis: "x",
    yaxis,
    line: { color, width: 2, dash },
    hovertemplate: `${name}: %{y:.4g}<br>t = %{x:.4g} s<extra></extra>`,
  });
  return (
    <div data-testid="response-chart">
      <LazyPlot
        height={380}
        data={[
          line("r(t)", r, CHART_COLORS.faint, "y", "dash"),
          line("y(t)", y, CHART_COLORS.ink, "y"),
          line("u(t)", u, CHART_COLORS.slate, "y2"),
        ]}
        layout={baseLayout({
          xaxis: axis("time t [s]", { anchor: "y2" }),
          yaxis: axis("y, r", { domain: [0.42, 1], anchor: "x" }),
          yaxis2: axis("u", { domain: [0, 0.32], anchor: "x" }),
          margin: { l: 56, r: 16, t: 28, b: 44 },
        })}
        config={CHART_CONFIG}
      />
    </div>
  );
}
