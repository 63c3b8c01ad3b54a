/** Least distance [px] between the centres of two tick labels along an axis, per axis direction. */
export const TICK_SPACING = { x: 56, y: 24 } as const;

/** log10(2): the narrowest gap between the 1, 2, 5 ticks of a decade (from 1 to 2 and from 5 to 10), in decades. */
const NARROWEST_125_GAP = Math.log10(2);

/**
 * Tick labels printed in full on a log axis (d3-format "~g": 0.2, 5, 20, 1000, 1e+6), instead of
 * plotly's small single digits between the powers of ten.
 */
export const LOG_TICK_FORMAT = "~g";

/** Ticks of a log axis for plotly: dtick ("D2": 1, 2, 5 in each decade; k: every k-th power of ten) and their format. */
export interface LogTicks {
  dtick?: "D2" | number;
  tickformat: string;
}

/**
 * Tick labels that do not crowd on a log axis of `length` px spanning the log10 range [lo, hi]:
 * 1, 2 and 5 in each decade when even the narrowest of their gaps (log10 2 of a decade) leaves
 * TICK_SPACING between labels, else one label per decade, else every k-th decade with k the least
 * whole number that leaves the spacing (the 1–2–5 series of plot axes, common practice). Under one
 * decade, or without a known length, plotly chooses (no dtick). Every label is printed in full.
 */
export function logTicks(range: readonly [number, number], length: number, direction: "x" | "y"): LogTicks {
  const decades = range[1] - range[0];
  if (!(decades >= 1) || !(length > 0)) return { tickformat: LOG_TICK_FORMAT };
  const perDecade = length / decades;
  const spacing = TICK_SPACING[direction];
  if (perDecade * NARROWEST_125_GAP >= spacing) return { dtick: "D2", tickformat: LOG_TICK_FORMAT };
  return { dtick: Math.max(1, Math.ceil(spacing / perDecade)), tickformat: LOG_TICK_FORMAT };
}
