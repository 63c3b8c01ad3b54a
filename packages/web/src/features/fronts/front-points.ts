import type { CriterionId, PointsDto } from "@loopyard/core";

export interface FrontPoint {
  index: number;
  x: number;
  y: number;
}

/**
 * The points of a PointsDto (columns aligned by position) as plot points. The server already left
 * out unstable and diverged candidates and scores that are not finite on either axis.
 */
export function columnPoints(points: Pick<PointsDto, "indices" | "xs" | "ys">): FrontPoint[] {
  const n = Math.min(points.indices.length, points.xs.length, points.ys.length);
  const out: FrontPoint[] = new Array(n);
  for (let i = 0; i < n; i++) out[i] = { index: points.indices[i] as number, x: points.xs[i] as number, y: points.ys[i] as number };
  return out;
}

/**
 * Hover text of a candidate from PointsDto.params: its swept parameters, e.g. "kp = 1.2, ki = 0.3"
 * (fixed ones are the same for all); "" for an index not among the points.
 */
export function pointDescriber(points: Pick<PointsDto, "indices" | "params">, swept: readonly string[], format: (v: number) => string): (index: number) => string {
  const position = new Map<number, number>();
  points.indices.forEach((index, i) => position.set(index, i));
  return (index) => {
    const at = position.get(index);
    if (at === undefined) return "";
    return swept.map((name, k) => `${name} = ${format(points.params[k]?.[at] ?? Number.NaN)}`).join(", ");
  };
}

/**
 * The two criteria plotted first: ISE against effort when the sweep scored both, else its first two
 * that can be plotted (a criterion that does not apply to the scenario, e.g. settling time under a
 * load step alone, has no finite score and is passed over when `plottable` is given, from PointsDto).
 */
export function defaultAxes(criteria: readonly CriterionId[], plottable?: readonly CriterionId[]): { x: CriterionId; y: CriterionId } {
  const usable = plottable ? criteria.filter((c) => plottable.includes(c)) : [...criteria];
  const pool = usable.length > 0 ? usable : [...criteria];
  if (pool.includes("ise") && pool.includes("effort")) return { x: "ise", y: "effort" };
  return { x: pool[0] as CriterionId, y: (pool[1] ?? pool[0]) as CriterionId };
}
