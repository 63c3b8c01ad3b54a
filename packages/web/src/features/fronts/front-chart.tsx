import { useLayoutEffect, useMemo, useRef, useState } from "react";
import { chartFrame } from "../../components/charts/chart-frame.js";
import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import { edgeMarks, type AxisFit, type EdgeMarks } from "./axis-fit.js";
import { BASELINE_LABEL_SIZE, markerLabels, type PlotFrame } from "./baseline-labels.js";
import { cloudPoints, positionFinder, type FrontPoint, type PlotCloud } from "./front-points.js";
import { logTicks } from "./log-ticks.js";
import { BOUND_HOVER, BOUND_LABEL, baselineHover, type BaselinePoint } from "./reference-points.js";

/** Above this many candidates the cloud is drawn with WebGL (plotly scattergl); SVG stays sharper and clickable below it. */
export const WEBGL_POINTS = 5000;

/** Above this many front points their markers are drawn small and without rims. */
export const DENSE_FRONT = 60;

/** Height of the front chart [px] and its margins around the plot area [px] on a wide screen (the legend sits in the top one; chart-frame.ts moves it under the plot on a narrow one). */
const WIDE_FRAME = { height: 420, margin: { l: 64, r: 16, t: 40, b: 48 } } as const;
/** A measured plot area whose size differs from the one labels were placed for by more than this [px] places them again. */
const REMEASURE_PX = 6;

/**
 * Double-click returns to the fitted axes (not plotly's autorange: "Show every candidate" does that, and
 * then the far-out candidates are drawn where they lie instead of at the edge).
 */
const FRONT_CHART_CONFIG = { ...CHART_CONFIG, doubleClick: "reset" as const };

/** The size [px] of a drawn plotly figure's plot area (plotly's internal `_fullLayout._size`, read only). */
function measuredSize(graph: unknown): { width: number; height: number } | null {
  const size = (graph as { _fullLayout?: { _size?: { w: number; h: number } } } | null)?._fullLayout?._size;
  return size ? { width: size.w, height: size.h } : null;
}

/**
 * Every stable candidate as a dimmed dot (WebGL above WEBGL_POINTS), the non-dominated ones in the accent colour joined by a
 * staircase (each front point holds its y until the next one's x), and the chosen candidate ringed.
 * With `fit`, the axes show the front and most of the cloud (axis-fit.ts) and the far-out candidates are drawn
 * as triangles in the padding band at the edge they lie beyond, pointing that way. Baselines carry labels
 * placed to keep off each other and the front (baseline-labels.ts); log axes get uncrowded, full tick labels.
 * Takes plain data; calls onSelect with the candidate index of a clicked point. The cloud's columns go
 * to plotly as they are (no array of 10⁵ point objects), and the traces are rebuilt only when the cloud,
 * the axes or the selection change.
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
  fit = null,
  edges = null,
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
  /** The fitted axes (axis-fit.ts fitFrontAxes), or null for plotly's autorange. */
  fit?: { x: AxisFit | null; y: AxisFit | null } | null;
  /** The far-out candidates moved to the edges of `fit` (axis-fit.ts edgeMarks), drawn as triangles pointing where they lie. */
  edges?: EdgeMarks | null;
}) {
  const find = useMemo(() => positionFinder(cloud.indices), [cloud.indices]);
  const frontPoints = useMemo(() => cloudPoints(cloud, find, front), [cloud, find, front]);
  const chosen = useMemo(() => (selected === null ? undefined : cloudPoints(cloud, find, [selected])[0]), [cloud, find, selected]);
  const count = cloud.xs.length;
  const hover = `candidate #%{customdata}${describe ? "<br>%{text}" : ""}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`;
  const webgl = count > WEBGL_POINTS;
  const xRange = fit?.x?.range ?? null;
  const yRange = fit?.y?.range ?? null;

  // The plot area the labels and log ticks are laid out for: the fitted ranges (a zoom moves the labels with
  // their markers and keeps the ticks; re-laying them out would make plotly's reset return to the zoom), on the
  // size estimated from the container's width before plotly first draws, corrected if plotly's differs.
  const box = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState<number | null>(null);
  // Read once before the first draw; later sizes come from plotly after it resizes (onRelayout → measure).
  useLayoutEffect(() => setWidth(box.current?.clientWidth ?? null), []);
  const { height: chartHeight, margin, legend } = chartFrame(width, WIDE_FRAME);
  const estimated = width === null ? null : { width: Math.max(1, width - margin.l - margin.r), height: chartHeight - margin.t - margin.b };
  const [measured, setMeasured] = useState<{ width: number; height: number; estimated: number } | null>(null);
  const size = measured !== null && measured.estimated === width ? measured : estimated;
  const frame: PlotFrame | null = size && xRange && yRange ? { width: size.width, height: size.height, xRange, yRange } : null;
  const plotted = useRef<unknown>(null);
  // Only a plot area of another size than the one in use draws again: a first draw as estimated costs nothing more.
  const measure = (graph: unknown) => {
    const next = measuredSize(graph);
    if (next && width !== null && (!size || Math.abs(next.width - size.width) > REMEASURE_PX || Math.abs(next.height - size.height) > REMEASURE_PX)) {
      setMeasured({ ...next, estimated: width });
    }
  };
  const chosenMark = useMemo(() => {
    if (!chosen || !fit) return chosen;
    const moved = edgeMarks({ indices: [chosen.index], xs: [chosen.x], ys: [chosen.y] }, fit.x, fit.y, logAxes);
    return moved.indices.length === 1 ? { index: chosen.index, x: moved.xs[0] as number, y: moved.ys[0] as number } : chosen;
  }, [chosen, fit, logAxes]);
  const labels = useMemo(() => (frame ? markerLabels(baselines, frontPoints, frame, logAxes) : []), [baselines, frontPoints, frame, logAxes]);

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
  // Every trace is kept by reference between renders unless its data changed, so that placing the labels
  // again (a layout change) does not make plotly recompute the 10⁵-point cloud.
  const data = useMemo(() => {
    const text = (list: readonly FrontPoint[]) => (describe ? list.map((p) => describe(p.index)) : undefined);
    const traces: Record<string, unknown>[] = [
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
      traces.push({
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
      // Labelled by annotations placed apart (baseline-labels.ts), named in the legend list too.
      traces.push({
        type: "scatter",
        mode: "markers",
        name: "tuning-rule baselines",
        x: baselines.map((b) => b.x),
        y: baselines.map((b) => b.y),
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
    if (edges && edges.indices.length > 0) {
      traces.push({
        type: edges.indices.length > WEBGL_POINTS ? "scattergl" : "scatter",
        mode: "markers",
        name: "far out, at the edge",
        x: edges.xs,
        y: edges.ys,
        customdata: edges.indices.map((index, i) => [index, edges.trueXs[i], edges.trueYs[i]]),
        marker: { symbol: edges.symbols, size: 8, color: CHART_COLORS.inkSoft, opacity: 0.7, line: { width: 0 } },
        cliponaxis: false,
        hovertemplate: `candidate #%{customdata[0]}, beyond the axes<br>${xTitle}: %{customdata[1]:.4g}<br>${yTitle}: %{customdata[2]:.4g}<extra></extra>`,
      });
    }
    if (chosenMark) {
      traces.push({
        type: webgl ? "scattergl" : "scatter",
        mode: "markers",
        name: `candidate #${chosenMark.index}`,
        x: [chosenMark.x],
        y: [chosenMark.y],
        customdata: [chosenMark.index],
        marker: { color: "rgba(0,0,0,0)", size: 18, line: { color: CHART_COLORS.ink, width: 2 } },
        // Named by the response's title; kept out of the legend so that it stays on one line.
        showlegend: false,
        hovertemplate: hover,
      });
    }
    return traces;
  }, [cloudTrace, frontPoints, bound, baselines, edges, chosenMark, describe, hover, webgl, xTitle, yTitle]);

  const type = logAxes ? "log" : "linear";
  const ticks = (direction: "x" | "y") => {
    if (!logAxes) return {};
    const shown = direction === "x" ? (frame?.xRange ?? xRange) : (frame?.yRange ?? yRange);
    const length = direction === "x" ? frame?.width : frame?.height;
    return shown && length ? logTicks(shown, length, direction) : logTicks([0, 0], 0, direction);
  };
  // Copies of the ranges: plotly writes a zoom into the layout's range arrays, which must not reach the fit.
  const layout = baseLayout({
    xaxis: axis(xTitle, { type, ...(xRange ? { range: [...xRange] } : {}), ...ticks("x") }),
    yaxis: axis(yTitle, { type, ...(yRange ? { range: [...yRange] } : {}), ...ticks("y") }),
    margin,
    legend,
    hovermode: "closest",
    clickmode: "event",
    // The user's zoom is kept across re-renders (a click) until the axes or the fitted ranges change.
    uirevision: `${xTitle}|${yTitle}|${logAxes}|${xRange?.join(",")}|${yRange?.join(",")}`,
    annotations: labels.map((label) => ({
      xref: "x",
      yref: "y",
      x: label.x,
      y: label.y,
      ax: label.ax,
      ay: label.ay,
      text: label.text,
      showarrow: true,
      arrowhead: 0,
      arrowwidth: 1,
      arrowcolor: CHART_COLORS.faint,
      standoff: 6,
      font: { size: BASELINE_LABEL_SIZE, color: CHART_COLORS.inkSoft },
      bgcolor: "rgba(255,255,255,0.85)",
      borderpad: 1,
    })),
  });
  return (
    <div
      ref={box}
      data-testid="front-chart"
      data-webgl={webgl ? "true" : "false"}
      data-points={count}
      data-front-size={frontPoints.length}
      data-bound-points={bound?.x.length ?? 0}
      data-baselines={baselines.length}
      data-edge-marks={edges?.indices.length ?? 0}
      data-labels={labels.length}
    >
      {width === null ? (
        <div style={{ height: chartHeight }} />
      ) : (
        <LazyPlot
          height={chartHeight}
          data={data}
          layout={layout}
          config={FRONT_CHART_CONFIG}
          onInitialized={(_, graph) => {
            plotted.current = graph;
            measure(graph);
          }}
          // After a resize (and at the end of a zoom or a pan, which keep the size).
          onRelayout={() => measure(plotted.current)}
          onClick={(event: { points?: { customdata?: unknown }[] }) => {
            const data = event.points?.[0]?.customdata;
            // The cloud's and the edge marks' customdata is [index, ...], the index alone otherwise.
            const index = Array.isArray(data) ? data[0] : data;
            if (typeof index === "number") onSelect(index);
          }}
        />
      )}
    </div>
  );
}
