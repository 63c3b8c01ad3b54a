/** Below this container width [px] a chart is laid out for a phone: legend under the plot, thinner side margins. */
export const NARROW_CHART_PX = 560;

/** Height [px] of the band under a narrow chart's x-axis title that holds its legend (two rows of 11 px entries). */
export const NARROW_LEGEND_BAND_PX = 52;

export interface ChartMargin {
  l: number;
  r: number;
  t: number;
  b: number;
}

export interface ChartFrame {
  /** Height of the whole figure [px]. */
  height: number;
  margin: ChartMargin;
  /** Plotly legend placement. */
  legend: Record<string, unknown>;
}

/**
 * The frame of a chart for the width of its container [px]: as designed (`wide`) on a wide container, and on
 * a narrow one (a phone, < NARROW_CHART_PX) the legend moved from over the plot to a band at the bottom of
 * the figure — a horizontal legend wraps into rows there and would otherwise cover the plot — with the figure
 * taller by that band, so the plot area keeps the height it has on a wide screen. A null width (not measured
 * yet) counts as wide. Common practice: keep the plot area readable and the legend off the data.
 */
export function chartFrame(width: number | null, wide: { height: number; margin: ChartMargin }): ChartFrame {
  if (width === null || width >= NARROW_CHART_PX) {
    return { height: wide.height, margin: { ...wide.margin }, legend: { orientation: "h", x: 0, y: 1.08, font: { size: 11 } } };
  }
  const top = Math.min(wide.margin.t, 16);
  return {
    height: wide.height - (wide.margin.t - top) + NARROW_LEGEND_BAND_PX,
    margin: { l: Math.min(wide.margin.l, 56), r: Math.min(wide.margin.r, 12), t: top, b: wide.margin.b + NARROW_LEGEND_BAND_PX },
    legend: { orientation: "h", x: 0, xanchor: "left", y: 0, yref: "container", yanchor: "bottom", font: { size: 11 } },
  };
}

/** Height [px] of one row of a legend listed under a chart (11 px text). */
export const LEGEND_ROW_PX = 20;

/** Width [px] plotly gives a legend entry besides its text: the line sample (40) and the gap after it. */
export const LEGEND_ENTRY_PAD_PX = 46;

/** Mean width [px] of one character of 11 px Inter, enough to over- rather than under-estimate. */
export const LEGEND_CHAR_PX = 6.2;

/**
 * Rows a horizontal legend takes in a chart `width` px wide: entries laid left to right, a new row when the
 * next does not fit (how plotly packs an `orientation: "h"` legend), each entry's width estimated from its
 * text. A null width (not measured yet) counts as one row per entry, so a first draw never covers the axis.
 */
export function legendRows(names: readonly string[], width: number | null): number {
  if (names.length === 0) return 0;
  if (width === null) return names.length;
  let rows = 1;
  let used = 0;
  for (const name of names) {
    const entry = LEGEND_ENTRY_PAD_PX + name.length * LEGEND_CHAR_PX;
    if (used > 0 && used + entry > width) {
      rows += 1;
      used = 0;
    }
    used += entry;
  }
  return rows;
}

/**
 * A chart with its legend listed under the plot, at the bottom of the figure: the figure's height and margins
 * [px] that keep a plot area `plotHeight` tall above the x-axis (`axisBand` px for its ticks and title) and
 * leave room for the legend's rows at the chart's width (legendRows).
 */
export function legendBelowFrame(width: number | null, names: readonly string[], plotHeight: number, axisBand = 44, top = 12): ChartFrame {
  const bottom = axisBand + legendRows(names, width) * LEGEND_ROW_PX + 6;
  return {
    height: top + plotHeight + bottom,
    margin: { l: 56, r: width !== null && width < NARROW_CHART_PX ? 12 : 16, t: top, b: bottom },
    legend: { orientation: "h", x: 0, xanchor: "left", y: 0, yref: "container", yanchor: "bottom", font: { size: 11 } },
  };
}
