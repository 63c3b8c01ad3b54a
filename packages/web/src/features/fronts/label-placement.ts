/** A point on the chart in pixels from the plot area's top-left corner (y grows downwards). */
export interface PixelPoint {
  x: number;
  y: number;
}

/** Where a label goes: its centre's offset from its anchor [px] (y grows downwards). */
export interface LabelOffset {
  dx: number;
  dy: number;
}

/** Gaps [px] tried between a marker and the nearest edge of its label, nearest first. */
export const LABEL_GAPS = [8, 22, 40, 62, 88, 120] as const;
/** Directions tried around a marker, in degrees anticlockwise from "right" (right and upper-right first). */
export const LABEL_ANGLES = [0, 45, -45, 90, -90, 135, -135, 180] as const;
/** Half the side of the square kept clear around every marker [px]. */
export const MARKER_CLEARANCE = 6;
/** Cost of one px² of a label over another label or a marker, and outside the plot area, against one px of distance. */
const OVERLAP_COST = 50;
const OUTSIDE_COST = 200;
/** Cost of each later direction in LABEL_ANGLES, in px of gap. */
const ANGLE_PREFERENCE = 0.5;

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

function overlap(a: Box, b: Box): number {
  const w = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
  const h = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
  return w > 0 && h > 0 ? w * h : 0;
}

/**
 * Places one text label beside each marker so that labels keep off each other, off every marker and
 * inside the plot area: a greedy search over positions around the marker (LABEL_ANGLES at the
 * LABEL_GAPS), each scored by its overlap with the labels already placed and with all markers
 * (OVERLAP_COST per px²), the part outside the area (OUTSIDE_COST per px²), its gap and its
 * direction's rank; the cheapest wins. Markers are labelled in order of crowding (most neighbours first), so the
 * crowded ones get the near places. Greedy candidate-position labelling is common practice
 * (point-feature label placement with a fixed set of candidate positions).
 * `obstacles` are further points to keep clear (e.g. the front's markers). Returns one offset per
 * anchor, in the anchors' order.
 */
export function placeLabels(
  anchors: readonly PixelPoint[],
  sizes: readonly { width: number; height: number }[],
  area: { width: number; height: number },
  obstacles: readonly PixelPoint[] = [],
): LabelOffset[] {
  if (sizes.length !== anchors.length) throw new RangeError(`placeLabels: ${anchors.length} anchors but ${sizes.length} sizes`);
  const marks: Box[] = [...anchors, ...obstacles].map((p) => ({
    x0: p.x - MARKER_CLEARANCE,
    y0: p.y - MARKER_CLEARANCE,
    x1: p.x + MARKER_CLEARANCE,
    y1: p.y + MARKER_CLEARANCE,
  }));
  const crowding = anchors.map((a) => anchors.filter((b) => Math.hypot(a.x - b.x, a.y - b.y) < 60).length);
  const order = anchors.map((_, i) => i).sort((i, j) => (crowding[j] as number) - (crowding[i] as number) || i - j);
  const placed: Box[] = [];
  const result: LabelOffset[] = anchors.map(() => ({ dx: 0, dy: 0 }));
  for (const i of order) {
    const anchor = anchors[i] as PixelPoint;
    const { width, height } = sizes[i] as { width: number; height: number };
    let best: { cost: number; penalty: number; box: Box; offset: LabelOffset } | null = null;
    for (const gap of LABEL_GAPS) {
      for (const [rank, degrees] of LABEL_ANGLES.entries()) {
        const c = Math.cos((degrees * Math.PI) / 180);
        const s = -Math.sin((degrees * Math.PI) / 180);
        // The label's nearest edge `gap` px from the marker in this direction.
        const dx = c * (gap + width / 2);
        const dy = s * (gap + height / 2);
        const box = { x0: anchor.x + dx - width / 2, y0: anchor.y + dy - height / 2, x1: anchor.x + dx + width / 2, y1: anchor.y + dy + height / 2 };
        const inside = overlap(box, { x0: 0, y0: 0, x1: area.width, y1: area.height });
        let penalty = OUTSIDE_COST * (width * height - inside);
        for (const other of placed) penalty += OVERLAP_COST * overlap(box, other);
        for (const mark of marks) penalty += OVERLAP_COST * overlap(box, mark);
        // Nearer gaps first, then the earlier directions (right of the marker reads first).
        const cost = penalty + gap + rank * ANGLE_PREFERENCE;
        if (best === null || cost < best.cost) best = { cost, penalty, box, offset: { dx, dy } };
      }
      // A free place at this gap beats any farther one.
      if (best !== null && best.penalty === 0) break;
    }
    const chosen = best as { box: Box; offset: LabelOffset };
    placed.push(chosen.box);
    result[i] = chosen.offset;
  }
  return result;
}

/** Approximate width [px] of a label in the chart's sans-serif font: 0.58 em per character, common practice for proportional fonts. */
export function labelWidth(text: string, fontSize: number): number {
  return Math.ceil(text.length * fontSize * 0.58) + 6;
}
