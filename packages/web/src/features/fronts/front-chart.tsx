import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import type { FrontPoint } from "./front-points.js";

/**
 * Every stable candidate as a dimmed dot, the non-dominated ones in the accent colour joined by a
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
}: {
  points: readonly FrontPoint[];
  /** Candidate indices on the front, sorted by x ascending. */
  front: readonly number[];
  selected: number | null;
  xTitle: string;
  yTitle: string;
  logAxes: boolean;
  onSelect: (index: number) => void;
}) {
  const byIndex = new Map(points.map((p) => [p.index, p]));
  const frontPoints = front.map((i) => byIndex.get(i)).filter((p): p is FrontPoint => p !== undefined);
  const chosen = selected === null ? undefined : byIndex.get(selected);
  const hover = `candidate #%{customdata}<br>${xTitle}: %{x:.4g}<br>${yTitle}: %{y:.4g}<extra></extra>`;
  const data: Record<string, unknown>[] = [
    {
      type: "scatter",
      mode: "markers",
      name: "stable candidates",
      x: points.map((p) => p.x),
      y: points.map((p) => p.y),
      customdata: points.map((p) => p.index),
      // Dense grids get smaller, fainter dots so that the front stays readable above them.
      marker: { color: CHART_COLORS.cloud, size: points.length > 1000 ? 4 : 6, opacity: points.length > 1000 ? 0.4 : 0.55, line: { width: 0 } },
      hovertemplate: hover,
    },
    {
      type: "scatter",
      mode: "lines+markers",
      name: "front",
      x: frontPoints.map((p) => p.x),
      y: frontPoints.map((p) => p.y),
      customdata: frontPoints.map((p) => p.index),
      line: { color: CHART_COLORS.moss, width: 2, shape: "hv" },
      marker: { color: CHART_COLORS.moss, size: 9, line: { color: "#ffffff", width: 1.5 } },
      hovertemplate: hover,
    },
  ];
  if (chosen) {
    data.push({
      type: "scatter",
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
  return (
    <div data-testid="front-chart" data-front-size={frontPoints.length}>
      <LazyPlot
        height={400}
        data={data}
        layout={baseLayout({
          xaxis: axis(xTitle, { type }),
          yaxis: axis(yTitle, { type }),
          hovermode: "closest",
          clickmode: "event",
        })}
        config={CHART_CONFIG}
        onClick={(event: { points?: { customdata?: unknown }[] }) => {
          const index = event.points?.[0]?.customdata;
          if (typeof index === "number") onSelect(index);
        }}
      />
    </div>
  );
}
