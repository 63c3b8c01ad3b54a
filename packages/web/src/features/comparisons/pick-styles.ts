/**
 * How each pick is drawn when they are overlaid: a colour of the Okabe–Ito palette (chosen to stay
 * apart under the common colour-vision deficiencies: M. Okabe and K. Ito, "Color Universal Design",
 * 2008) paired with its own dash pattern, so that two picks stay apart in greyscale too.
 */
const PALETTE = ["#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "#000000", "#F0E442"] as const;
const DASHES = ["solid", "dash", "dot", "dashdot", "longdash", "longdashdot", "solid", "dash"] as const;

export interface PickStyle {
  color: string;
  dash: (typeof DASHES)[number];
}

/** The style of pick p (cycling after eight). */
export function pickStyle(p: number): PickStyle {
  return { color: PALETTE[p % PALETTE.length] as string, dash: DASHES[p % DASHES.length] as PickStyle["dash"] };
}
