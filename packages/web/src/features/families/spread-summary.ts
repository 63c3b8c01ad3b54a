import { spreadParameterNames, type FamilySpread } from "@loopyard/core";

/** A spread in one line, e.g. "grid: c 360…440 × 3, h 1.6…2.4 × 2" or "Latin hypercube of 6 (seed 2026): c 360…440, h 1.6…2.4". */
export function spreadSummary(spread: FamilySpread): string {
  const grid = spread.design.kind === "grid";
  const ranges = spreadParameterNames(spread)
    .map((name) => {
      const r = spread.ranges[name]!;
      return `${name} ${r.min}…${r.max}${grid ? ` × ${r.count}` : ""}${r.scale === "log" ? " (log)" : ""}`;
    })
    .join(", ");
  if (spread.design.kind === "grid") return `grid: ${ranges}`;
  const how = spread.design.kind === "latin-hypercube" ? "Latin hypercube" : "random sample";
  return `${how} of ${spread.design.count} (seed ${spread.design.seed}): ${ranges}`;
}
