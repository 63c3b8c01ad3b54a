/**
 * The regret scale of Loopyard's cross-score: one hue (a warm umber, hue 28°) whose lightness falls
 * with regret on a logarithmic scale, so that order is carried by lightness alone and reads the same
 * to a reader with any colour-vision deficiency or in greyscale; every cell also prints its number
 * and draws a bar whose length follows the same scale. 0 % regret (the column's best) is white,
 * marked with a ring glyph; REGRET_SCALE_TOP % and beyond are the darkest step.
 */

/** Regret [%] at which the scale reaches its darkest step. */
export const REGRET_SCALE_TOP = 1000;
/** Lightness [%] at 0 regret and at REGRET_SCALE_TOP (CSS HSL). */
const LIGHTNESS_BEST = 99;
const LIGHTNESS_WORST = 34;
const HUE = 28;
const SATURATION = 38;
/** Below this lightness the printed number turns white to keep its contrast. */
const LIGHT_TEXT_BELOW = 62;

/** Position t ∈ [0, 1] of a regret on the scale: log10(1 + r) / log10(1 + top), clamped; NaN for no value. */
export function regretPosition(regret: number): number {
  if (Number.isNaN(regret)) return Number.NaN;
  if (regret <= 0) return 0;
  if (!Number.isFinite(regret)) return 1;
  return Math.min(1, Math.log10(1 + regret) / Math.log10(1 + REGRET_SCALE_TOP));
}

/** Background and text colours of a cell with this regret; a hatched neutral for no value. */
export function regretColours(regret: number): { background: string; text: string } {
  const t = regretPosition(regret);
  if (Number.isNaN(t)) return { background: "transparent", text: "#8a8d90" };
  const lightness = LIGHTNESS_BEST - t * (LIGHTNESS_BEST - LIGHTNESS_WORST);
  return { background: `hsl(${HUE} ${SATURATION}% ${lightness.toFixed(1)}%)`, text: lightness < LIGHT_TEXT_BELOW ? "#ffffff" : "#22262b" };
}

/** Regret as printed: "best", "+3.2 %", "+140 %", "+∞ %" (best is 0 Infinity), "—" for none. */
export function formatRegret(regret: number): string {
  if (Number.isNaN(regret)) return "—";
  if (regret === 0) return "best";
  if (!Number.isFinite(regret)) return regret > 0 ? "+∞ %" : "−∞ %";
  const abs = Math.abs(regret);
  const text = abs < 10 ? abs.toFixed(1) : abs < 10_000 ? abs.toFixed(0) : abs.toExponential(1).replace("e+", "e");
  return `${regret > 0 ? "+" : "−"}${text} %`;
}

/** Steps of the legend, regret [%] at each. */
export const REGRET_LEGEND_STEPS = [0, 3, 10, 30, 100, 300, 1000] as const;
