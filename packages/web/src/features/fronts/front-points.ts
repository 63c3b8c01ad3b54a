import type { CriterionId } from "@loopyard/core";

export interface FrontPoint {
  index: number;
  x: number;
  y: number;
}

/** The cloud of a front chart in columns aligned by position (PointsDto's columns, as arrays or Float64Arrays). */
export interface PlotCloud {
  indices: ArrayLike<number>;
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
}

/**
 * Finds the position of a candidate index among `indices`, or −1. The server sends the cloud by
 * index, so a sorted column is searched by bisection (no map of 10⁵ entries to build); any other
 * order falls back to a map.
 */
export function positionFinder(indices: ArrayLike<number>): (index: number) => number {
  let sorted = true;
  for (let i = 1; i < indices.length && sorted; i++) sorted = (indices[i] as number) > (indices[i - 1] as number);
  if (!sorted) {
    const position = new Map<number, number>();
    for (let i = 0; i < indices.length; i++) position.set(indices[i] as number, i);
    return (index) => position.get(index) ?? -1;
  }
  return (index) => {
    let lo = 0;
    let hi = indices.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      const at = indices[mid] as number;
      if (at === index) return mid;
      if (at < index) lo = mid + 1;
      else hi = mid - 1;
    }
    return -1;
  };
}

/** The plot points of the given candidate indices that are in the cloud, in the given order. */
export function cloudPoints(cloud: PlotCloud, find: (index: number) => number, wanted: readonly number[]): FrontPoint[] {
  const out: FrontPoint[] = [];
  for (const index of wanted) {
    const at = find(index);
    if (at >= 0) out.push({ index, x: cloud.xs[at] as number, y: cloud.ys[at] as number });
  }
  return out;
}

/**
 * Hover text of a candidate from PointsDto.params: its swept parameters, e.g. "kp = 1.2, ki = 0.3"
 * (fixed ones are the same for all); "" for an index not among the points.
 */
export function pointDescriber(points: { indices: ArrayLike<number>; params: readonly ArrayLike<number>[] }, swept: readonly string[], format: (v: number) => string): (index: number) => string {
  const find = positionFinder(points.indices);
  return (index) => {
    const at = find(index);
    if (at < 0) return "";
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
