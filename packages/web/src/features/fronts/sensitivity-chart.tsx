import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";

/**
 * |S(jω)| and |T(jω)| of one loop against ω on log–log axes, with the bound 1/|W(jω)| dashed when the
 * sweep set a sensitivity weight (‖W·S‖∞ < 1 means |S| stays under it), and a dotted reference at 1.
 * Takes plain arrays.
 */
export function SensitivityChart({
  omega,
  S,
  T,
  invW,
}: {
  omega: readonly number[];
  S: readonly number[];
  T: readonly number[];
  invW?: readonly number[];
}) {
  const line = (name: string, values: readonly number[], color: string, dash = "solid") => ({
    type: "scatter",
    mode: "lines",
    name,
    x: omega,
    y: values,
    line: { color, width: 2, dash },
    hovertemplate: `${name} = %{y:.4g}<br>ω = %{x:.4g} rad/s<extra></extra>`,
  });
  const data = [line("|S|", S, CHART_COLORS.moss), line("|T|", T, CHART_COLORS.slate)];
  if (invW) data.push(line("1/|W| (bound on |S|)", invW, CHART_COLORS.inkSoft, "dash"));
  return (
    <div data-testid="sensitivity-chart">
      <LazyPlot
        height={300}
        data={data}
        layout={baseLayout({
          xaxis: axis("frequency ω [rad/s]", { type: "log", exponentformat: "power" }),
          yaxis: axis("magnitude", { type: "log", exponentformat: "power" }),
          margin: { l: 56, r: 16, t: 28, b: 44 },
          shapes: [
            { type: "line", xref: "paper", yref: "y", x0: 0, x1: 1, y0: 1, y1: 1, line: { color: CHART_COLORS.faint, width: 1, dash: "dot" } },
          ],
        })}
        config={CHART_CONFIG}
      />
    </div>
  );
}
