import { useMemo } from "react";
import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import { cloudPoints, positionFinder, type FrontPoint, type PlotCloud } from "./front-points.js";
import { BOUND_HOVER, BOUND_LABEL, baselineHover, fittedRange, type BaselinePoint } from "./reference-points.js";

/** Above this many candidates the cloud is drawn with WebGL (plotly scattergl); SVG stays sharper and clickable below it. */
export const WEBGL_POINTS = 5000;

/** Above this many front points their markers are drawn small and without rims. */
export const DENSE_FRONT = 60;

/**
 * Every stable candidate as a dimmed dot (WebGL above WEBGL_POINTS), the non-dominated ones in the accent colour joined by a
 * staircase (each front point holds its y until the next one's x), and the chosen candidate ringed.
 * Takes plain data; calls onSelect with the candidate index of a clicked point. The cloud's columns go
 * to plotly as they are (no array of 10⁵ point objects), and its traces are rebuilt only when the cloud
 * or the axes change, not on a click.
 */
export function FrontChart({
  cloud,
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
  /** Every plotted candidate: index, x and y columns aligned by position (PointsDto, by index). */
  cloud: PlotCloud;
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
   * The swept parameters of the cloud, one column per name aligned with `cloud`: then the cloud's
   * hover text is formatted by plotly on hover (customdata) instead of one string per point up front.
   */
  cloudParams?: { names: readonly string[]; columns: readonly ArrayLike<number>[] };
}) {
  const find = useMemo(() => positionFinder(cloud.indices), [cloud.indices]);
  const frontPoints = useMemo(() => cloudPoints(cloud, find, front), [cloud, find, front]);
  const chosen = selected === null ? undefined : cloudPoints(cloud, find, [selected])[0];
  const count = cloud.xs.length;
  const hover = `candidate #%{customdata}${describe ? "<br>%{text}" : ""}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`;
  const webgl = count > WEBGL_POINTS;
  const text = (list: readonly FrontPoint[]) => (describe ? list.map((p) => describe(p.index)) : undefined);
  const cloudTrace = useMemo(
    () => ({
      type: webgl ? "scattergl" : "scatter",
      mode: "markers",
      name: "stable candidates",
      x: cloud.xs,
      y: cloud.ys,
      ...(cloudParams
        ? {
            customdata: Array.from({ length: count }, (_, i) => {
              const row = [cloud.indices[i] as number];
              for (const column of cloudParams.columns) row.push(column[i] as number);
              return row;
            }),
            hovertemplate: `candidate #%{customdata[0]}<br>${cloudParams.names.map((name, k) => `${name} = %{customdata[${k + 1}]:.4g}`).join(", ")}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`,
          }
        : {
            customdata: cloud.indices,
            text: describe ? Array.from({ length: count }, (_, i) => describe(cloud.indices[i] as number)) : undefined,
            hovertemplate: hover,
          }),
      // Dense clouds get smaller, fainter dots so that the front stays readable above them.
      marker: {
        color: CHART_COLORS.cloud,
        size: webgl ? 3 : count > 1000 ? 4 : 6,
        opacity: webgl ? 0.35 : count > 1000 ? 0.4 : 0.55,
        line: { width: 0 },
      },
    }),
    [cloud, cloudParams, describe, hover, xTitle, yTitle, webgl, count],
  );
  const data: Record<string, unknown>[] = [
    cloudTrace,
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
      // A long front packs its points along the cloud's edge: small plain dots there, so the staircase stays visible
      // (ringed 9 px markers would cover it and each other with their white rims).
      marker:
        frontPoints.length > DENSE_FRONT
          ? { color: CHART_COLORS.moss, size: 4, line: { width: 0 } }
          : { color: CHART_COLORS.moss, size: 9, line: { color: "#ffffff", width: 1.5 } },
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
  const xRange = useMemo(() => (fit ? fittedRange(cloud.xs, logAxes) : null), [fit, cloud.xs, logAxes]);
  const yRange = useMemo(() => (fit ? fittedRange(cloud.ys, logAxes) : null), [fit, cloud.ys, logAxes]);
  return (
    <div data-testid="front-chart" data-webgl={webgl ? "true" : "false"} data-points={count} data-front-size={frontPoints.length} data-bound-points={bound?.x.length ?? 0} data-baselines={baselines.length}>
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
