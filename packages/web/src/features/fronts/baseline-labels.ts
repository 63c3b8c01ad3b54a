import { toAxis } from "./axis-fit.js";
import { labelWidth, placeLabels, type PixelPoint } from "./label-placement.js";

/** Font size [px] of the baselines' labels on the front chart. */
export const BASELINE_LABEL_SIZE = 10;
/** Height [px] of one label line at that size, with its background's padding. */
const LABEL_HEIGHT = 16;
/** Most front points kept clear of labels (evenly spread along the front). */
const MAX_FRONT_OBSTACLES = 120;

/** The plot area of a chart: its size [px] and the ranges it shows, in axis units (log10 on log axes). */
export interface PlotFrame {
  width: number;
  height: number;
  xRange: readonly [number, number];
  yRange: readonly [number, number];
}

/** A labelled marker as a plotly annotation: its point in axis units and its label's offset [px]. */
export interface MarkerLabel {
  text: string;
  /** The marker's position in axis units (plotly annotations take log10 values on a log axis). */
  x: number;
  y: number;
  /** Offset of the label's centre from the marker [px], y downwards (plotly's ax, ay). */
  ax: number;
  ay: number;
}

/** A data point's position in the plot area [px from its top-left corner], or null when it cannot be shown (≤ 0 on a log axis). */
export function toPixel(x: number, y: number, frame: PlotFrame, log: boolean): PixelPoint | null {
  const ax = toAxis(x, log);
  const ay = toAxis(y, log);
  if (!Number.isFinite(ax) || !Number.isFinite(ay)) return null;
  const [x0, x1] = frame.xRange;
  const [y0, y1] = frame.yRange;
  return { x: ((ax - x0) / (x1 - x0)) * frame.width, y: frame.height - ((ay - y0) / (y1 - y0)) * frame.height };
}

/**
 * Labels for the markers inside the frame, placed so that they keep off each other, off every
 * marker and off the front's points, inside the plot area (placeLabels). Markers outside the frame
 * get no label (the legend list says they are beyond the axes).
 */
export function markerLabels(
  markers: readonly { label: string; x: number; y: number }[],
  front: readonly { x: number; y: number }[],
  frame: PlotFrame,
  log: boolean,
): MarkerLabel[] {
  const shown: { text: string; at: PixelPoint; x: number; y: number }[] = [];
  for (const m of markers) {
    const at = toPixel(m.x, m.y, frame, log);
    if (at && at.x >= 0 && at.x <= frame.width && at.y >= 0 && at.y <= frame.height) shown.push({ text: m.label, at, x: toAxis(m.x, log), y: toAxis(m.y, log) });
  }
  const step = Math.max(1, Math.ceil(front.length / MAX_FRONT_OBSTACLES));
  const obstacles: PixelPoint[] = [];
  for (let i = 0; i < front.length; i += step) {
    const p = front[i] as { x: number; y: number };
    const at = toPixel(p.x, p.y, frame, log);
    if (at) obstacles.push(at);
  }
  const offsets = placeLabels(
    shown.map((s) => s.at),
    shown.map((s) => ({ width: labelWidth(s.text, BASELINE_LABEL_SIZE), height: LABEL_HEIGHT })),
    frame,
    obstacles,
  );
  return shown.map((s, i) => ({ text: s.text, x: s.x, y: s.y, ax: Math.round(offsets[i]?.dx ?? 0), ay: Math.round(offsets[i]?.dy ?? 0) }));
}
