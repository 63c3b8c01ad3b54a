import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import { formatNumber } from "../../components/format-number.js";
import { responseWindowEnd } from "./response-window.js";

/** The plot opens on the transient only when it ends before this fraction of the horizon. */
const WINDOW_FRACTION = 0.6;

/**
 * A closed-loop response: output y(t) against setpoint r(t) in the upper panel, controller output
 * u(t) in the lower one, on one shared time axis; a dotted vertical line marks the load step when
 * the scenario has one. Takes plain arrays.
 */
export function ResponseChart({
  t,
  r,
  y,
  u,
  loadTime = null,
}: {
  t: readonly number[];
  r: readonly number[];
  y: readonly number[];
  u: readonly number[];
  /** Time of the load step [s], or null without one. */
  loadTime?: number | null;
}) {
  const loadMarks =
    loadTime === null
      ? {}
      : {
          shapes: [
            {
              type: "line",
              xref: "x",
              yref: "paper",
              x0: loadTime,
              x1: loadTime,
              y0: 0,
              y1: 1,
              line: { color: CHART_COLORS.faint, width: 1, dash: "dot" },
            },
          ],
          annotations: [
            {
              xref: "x",
              yref: "paper",
              x: loadTime,
              y: 1,
              yanchor: "top",
              xanchor: "left",
              xshift: 4,
              text: "load step",
              showarrow: false,
              bgcolor: "rgba(255,255,255,0.85)",
              font: { size: 11, color: CHART_COLORS.inkSoft },
            },
          ],
        };
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
  const horizon = t[t.length - 1] ?? 0;
  const windowEnd = responseWindowEnd(t, y, u);
  const windowed = windowEnd > 0 && windowEnd < WINDOW_FRACTION * horizon;
  return (
    <div data-testid="response-chart" data-load-time={loadTime ?? undefined} data-window-end={windowed ? windowEnd : undefined}>
      <LazyPlot
        height={380}
        data={[
          line("r(t)", r, CHART_COLORS.faint, "y", "dash"),
          line("y(t)", y, CHART_COLORS.ink, "y"),
          line("u(t)", u, CHART_COLORS.slate, "y2"),
        ]}
        layout={baseLayout({
          xaxis: axis("time t [s]", windowed ? { anchor: "y2", range: [0, windowEnd] } : { anchor: "y2" }),
          yaxis: axis("y, r", { domain: [0.42, 1], anchor: "x" }),
          yaxis2: axis("u", { domain: [0, 0.32], anchor: "x" }),
          margin: { l: 56, r: 16, t: 28, b: 44 },
          ...loadMarks,
        })}
        config={CHART_CONFIG}
      />
      {windowed ? (
        <p className="mt-1 text-xs text-ink-faint" data-testid="response-window-note">
          Showing 0–{formatNumber(windowEnd)} s, where the loop settles, of the {formatNumber(horizon)} s horizon; double-click the plot for all of it.
        </p>
      ) : null}
    </div>
  );
}
