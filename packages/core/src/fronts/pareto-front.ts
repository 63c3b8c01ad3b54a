/**
 * Positions of the non-dominated points of a two-objective set, both objectives minimised.
 * Point i is dominated when some j has x_j ≤ x_i and y_j ≤ y_i with at least one strict.
 *
 * O(n log n): sort the finite points by x, then y, ascending (ties by position), and sweep once,
 * keeping a point when its y is below every y seen at a smaller x (Kung, Luccio and Preparata 1975).
 *
 * Ties: equal points (same x and same y) do not dominate each other, so all copies of a
 * non-dominated point are kept. Points with non-finite x or y (NaN, ±Infinity: unstable or
 * unscored candidates) are ignored.
 *
 * x, y: objective values, same length. Returns positions sorted by x ascending, then by position.
 * Reference: H. T. Kung, F. Luccio and F. P. Preparata, "On finding the maxima of a set of
 * vectors", Journal of the ACM 22(4), 469–476, 1975.
 */
export function paretoFront(x: ArrayLike<number>, y: ArrayLike<number>): number[] {
  if (x.length !== y.length) throw new RangeError(`x and y must have the same length, got ${x.length} and ${y.length}`);
  const order: number[] = [];
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) order.push(i);
  order.sort((a, b) => x[a] - x[b] || y[a] - y[b] || a - b);

  const front: number[] = [];
  let bestY = Infinity;
  let g = 0;
  while (g < order.length) {
    // Group of equal x: its first member has the group's least y; only that y can survive.
    const groupX = x[order[g]];
    const groupY = y[order[g]];
    let end = g;
    while (end < order.length && x[order[end]] === groupX) end++;
    if (groupY < bestY) {
      for (let k = g; k < end && y[order[k]] === groupY; k++) front.push(order[k]);
      bestY = groupY;
    }
    g = end;
  }
  return front;
}
