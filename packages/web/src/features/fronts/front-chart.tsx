import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import type { FrontPoint } from "./front-points.js";
import { BOUND_HOVER, BOUND_LABEL, baselineHover, fittedRange, type BaselinePoint } from "./reference-points.js";

/** Above this many candidates the cloud is drawn with WebGL (plotly scattergl); SVG stays sharper and clickable below it. */
export const WEBGL_POINTS = 5000;

/**
 * Every stable candidate as a dimmed dot (WebGL above WEBGL_POINTS), the non-dominated ones in the accent colour joined by a
 * staircase (each front point holds its y until the next one's x), and the chosen candidate ringed.
 * Takes plain data; calls onSelect with the candidate index of a clicked point.
 */
export function FrontChart({
  points,
  front,
  selected,
  xTitle,
  yTitle,
  logAxes,
  onSelect,
  bound = null,
  baselines = [],
  describe,
  cloudParams,
}: {
  points: readonly FrontPoint[];
  /** Candidate indices on the front, sorted by x ascending. */
  front: readonly number[];
  selected: number | null;
  xTitle: string;
  yTitle: string;
  logAxes: boolean;
  onSelect: (index: number) => void;
  /** The bound curve on these axes (dashed), or null when it does not apply. */
  bound?: { x: number[]; y: number[] } | null;
  /** Tuning-rule baselines on these axes (hollow diamonds with their names). */
  baselines?: readonly BaselinePoint[];
  /** The parameters of a candidate for its hover text, e.g. "kp = 1.2, ki = 0.3". */
  describe?: (index: number) => string;
  /**
   * The swept parameters of the cloud, one column per name aligned with `points`: then the cloud's
   * hover text is formatted by plotly on hover (customdata) instead of one string per point up front.
   */
  cloudParams?: { names: readonly string[]; columns: readonly (readonly number[])[] };
}) {
  const byIndex = new Map(points.map((p) => [p.index, p]));
  const frontPoints = front.map((i) => byIndex.get(i)).filter((p): p is FrontPoint => p !== undefined);
  const chosen = selected === null ? undefined : byIndex.get(selected);
  const hover = `candidate #%{customdata}${describe ? "<br>%{text}" : ""}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`;
  const webgl = points.length > WEBGL_POINTS;
  const text = (list: readonly FrontPoint[]) => (describe ? list.map((p) => describe(p.index)) : undefined);
  const data: Record<string, unknown>[] = [
    {
      type: webgl ? "scattergl" : "scatter",
      mode: "markers",
      name: "stable candidates",
      x: points.map((p) => p.x),
      y: points.map((p) => p.y),
      ...(cloudParams
        ? {
            customdata: points.map((p, i) => [p.index, ...cloudParams.columns.map((column) => column[i])]),
            hovertemplate: `candidate #%{customdata[0]}<br>${cloudParams.names.map((name, k) => `${name} = %{customdata[${k + 1}]:.4g}`).join(", ")}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`,
          }
        : { customdata: points.map((p) => p.index), text: text(points), hovertemplate: hover }),
      // Dense clouds get smaller, fainter dots so that the front stays readable above them.
      marker: {
        color: CHART_COLORS.cloud,
        size: webgl ? 3 : points.length > 1000 ? 4 : 6,
        opacity: webgl ? 0.35 : points.length > 1000 ? 0.4 : 0.55,
        line: { width: 0 },
      },
    },
    {
      // WebGL draws above every SVG trace, so over a WebGL cloud the front is WebGL too (later traces on top).
      type: webgl ? "scattergl" : "scatter",
      mode: "lines+markers",
      name: "front",
      x: frontPoints.map((p) => p.x),
      y: frontPoints.map((p) => p.y),
      customdata: frontPoints.map((p) => p.index),
      text: text(frontPoints),
      line: { color: CHART_COLORS.moss, width: 2, shape: "hv" },
      marker: { color: CHART_COLORS.moss, size: 9, line: { color: "#ffffff", width: 1.5 } },
      hovertemplate: hover,
    },
  ];
  if (bound) {
    // After the cloud and the front, so that those keep their trace positions.
    data.push({
      type: "scatter",
      mode: "lines",
      name: BOUND_LABEL,
      x: bound.x,
      y: bound.y,
      line: { color: CHART_COLORS.inkSoft, width: 1.5, dash: "dash" },
      // Named in the legend list under the chart (reference-legend.tsx), with its hover text.
      showlegend: false,
      hovertemplate: `${BOUND_HOVER.replace(/\. /g, ".<br>")}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`,
    });
  }
  if (baselines.length > 0) {
    data.push({
      type: "scatter",
      mode: "markers+text",
      name: "tuning-rule baselines",
      x: baselines.map((b) => b.x),
      y: baselines.map((b) => b.y),
      text: baselines.map((b) => b.label),
      textposition: baselines.map((_, i) => (i % 2 === 0 ? "top right" : "bottom right")),
      textfont: { size: 10, color: CHART_COLORS.inkSoft },
      marker: { symbol: "diamond-open", size: 11, color: CHART_COLORS.slate, line: { width: 2 } },
      showlegend: false,
      hovertemplate: baselines.map(
        (b) =>
          `${baselineHover(b.label)}<br>${Object.entries(b.params)
            .map(([k, v]) => `${k} = ${v.toPrecision(4)}`)
            .join(", ")}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`,
      ),
    });
  }
  if (chosen) {
    data.push({
      type: webgl ? "scattergl" : "scatter",
      mode: "markers",
      name: `candidate #${chosen.index}`,
      x: [chosen.x],
      y: [chosen.y],
      customdata: [chosen.index],
      marker: { color: "rgba(0,0,0,0)", size: 18, line: { color: CHART_COLORS.ink, width: 2 } },
      hovertemplate: hover,
    });
  }
  const type = logAxes ? "log" : "linear";
  // With references drawn, the axes fit the candidates, so the bound's tail or a far baseline does not squeeze them.
  const fit = bound !== null || baselines.length > 0;
  const xRange = fit ? fittedRange(points.map((p) => p.x), logAxes) : null;
  const yRange = fit ? fittedRange(points.map((p) => p.y), logAxes) : null;
  return (
    <div data-testid="front-chart" data-webgl={webgl ? "true" : "false"} data-points={points.length} data-front-size={frontPoints.length} data-bound-points={bound?.x.length ?? 0} data-baselines={baselines.length}>
      <LazyPlot
        height={400}
        data={data}
        layout={baseLayout({
          xaxis: axis(xTitle, xRange ? { type, range: xRange } : { type }),
          yaxis: axis(yTitle, yRange ? { type, range: yRange } : { type }),
          hovermode: "closest",
          clickmode: "event",
        })}
        config={CHART_CONFIG}
        onClick={(event: { points?: { customdata?: unknown }[] }) => {
          const data = event.points?.[0]?.customdata;
          // The cloud's customdata is [index, ...params] with cloudParams, the index alone otherwise.
          const index = Array.isArray(data) ? data[0] : data;
          if (typeof index === "number") onSelect(index);
        }}
      />
    </div>
  );
}
